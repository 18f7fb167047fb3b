package org.cardwright.cli;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.Arrays;
import java.util.List;

/**
 * One in-process run of the {@code cardwright} command line through {@link Main#execute(PrintWriter, PrintWriter,
 * String...)}, with what it printed.
 *
 * @param exitCode the exit code the process would have had
 * @param out      everything printed on standard output
 * @param err      everything printed on standard error
 */
record CliRun(int exitCode, String out, String err) {

    /** Runs the command line {@code args} in this JVM. */
    static CliRun of(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code;
        try (PrintWriter o = new PrintWriter(out); PrintWriter e = new PrintWriter(err)) {
            code = Main.execute(o, e, args);
        }
        return new CliRun(code, out.toString(), err.toString());
    }

    /** The non-empty lines of standard error. */
    List<String> errLines() {
        return Arrays.stream(err.split("\\R")).filter(l -> !l.isEmpty()).toList();
    }

    /** For assertion messages: the exit code and both streams. */
    String describe() {
        return "exit " + exitCode + "\n--- stdout ---\n" + out + "\n--- stderr ---\n" + err;
    }
}
