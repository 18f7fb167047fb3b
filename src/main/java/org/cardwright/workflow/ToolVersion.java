package org.cardwright.workflow;

import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;

/** The tool's version, from the build. */
public final class ToolVersion {
    private ToolVersion() {
    }

    /** e.g. {@code 0.1.0}; {@code unknown} when run from classes without the build's resource. */
    public static String get() {
        return Read.VERSION;
    }

    /** The resource is read once per run (a library build asks for every card it writes). */
    private static final class Read {
        static final String VERSION = read();
    }

    private static String read() {
        try (InputStream in = ToolVersion.class.getResourceAsStream("/org/cardwright/version.properties")) {
            if (in == null) {
                return "unknown";
            }
            Properties p = new Properties();
            p.load(in);
            return p.getProperty("version", "unknown");
        } catch (IOException e) {
            return "unknown";
        }
    }
}
