package org.cardwright.cli;

import java.io.PrintWriter;
import picocli.CommandLine.Model.CommandSpec;

/**
 * Where a command's text goes: results (tables, summaries, verdicts, the files written) to standard output, notes
 * about the inputs (a line that starts with {@value #NOTE}) to standard error, so that a script that reads the
 * results is not handed the notes and a person still sees them. Every command prints through here.
 */
final class Terminal {
    /** The start of a note line, as every report writes it. */
    static final String NOTE = "note: ";

    private Terminal() {
    }

    /** Prints {@code text}, line by line, to the command's two streams, and flushes both. */
    static void print(CommandSpec spec, String text) {
        print(spec.commandLine().getOut(), spec.commandLine().getErr(), text);
    }

    /** Prints {@code text}: note lines to {@code err}, the rest to {@code out}; flushes both. */
    static void print(PrintWriter out, PrintWriter err, String text) {
        int start = 0;
        while (start < text.length()) {
            int end = text.indexOf('\n', start);
            int next = end < 0 ? text.length() : end + 1;
            String line = text.substring(start, next);
            (line.startsWith(NOTE) ? err : out).print(end < 0 ? line + "\n" : line);
            start = next;
        }
        err.flush();
        out.flush();
    }

    /** Prints one note line to the command's standard error. */
    static void note(CommandSpec spec, String note) {
        spec.commandLine().getErr().println(NOTE + note);
        spec.commandLine().getErr().flush();
    }
}
