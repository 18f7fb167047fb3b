package org.cardwright.cli;

import java.io.PrintWriter;
import java.util.Locale;

/**
 * Progress of a library build or check that runs its parts in parallel. The result lines go to standard output
 * in the parts' order; standard error says which part has just finished: one line per part, or, when the
 * command runs on a terminal, one bar redrawn in place (cleared before each result line, so the two streams do
 * not run into each other on the screen).
 */
final class PartProgress {
    private static final int BAR_WIDTH = 30;

    private final String command;
    private final PrintWriter out;
    private final PrintWriter err;
    private final boolean bar;
    private String drawn = "";

    /**
     * @param command {@code build} or {@code check}, to name the progress lines
     * @param bar     draw a bar instead of one line per part (on a terminal)
     */
    PartProgress(String command, PrintWriter out, PrintWriter err, boolean bar) {
        this.command = command;
        this.out = out;
        this.err = err;
        this.bar = bar;
    }

    /**
     * A bar when standard input and output are a terminal (where standard error usually is too). From Java 22 on
     * a console exists even when the streams are redirected, and its {@code isTerminal()} tells.
     */
    static boolean onTerminal() {
        java.io.Console console = System.console();
        if (console == null) {
            return false;
        }
        try {
            return (Boolean) java.io.Console.class.getMethod("isTerminal").invoke(console);
        } catch (NoSuchMethodException e) {
            return true;  // before Java 22, a console means a terminal
        } catch (ReflectiveOperationException | RuntimeException e) {
            return false;
        }
    }

    /** The number of jobs the command runs: {@code asked}, or one per available processor. */
    static int jobs(Integer asked) {
        if (asked == null) {
            return Math.max(1, Runtime.getRuntime().availableProcessors());
        }
        if (asked < 1) {
            throw new org.cardwright.failure.UsageException("--jobs must be at least 1, not " + asked);
        }
        return asked;
    }

    /** A result line, on standard output. */
    void result(String line) {
        clearBar();
        out.println(line);
        out.flush();
        redraw();
    }

    /** One more part finished. */
    void finished(int done, int total, String part, String status) {
        if (bar) {
            int filled = total == 0 ? BAR_WIDTH : (int) ((long) BAR_WIDTH * done / total);
            drawn = String.format(Locale.ROOT, "%s [%s%s] %d/%d parts", command, "#".repeat(filled),
                    "-".repeat(BAR_WIDTH - filled), done, total);
            redraw();
        } else {
            err.println(String.format(Locale.ROOT, "%s: %d/%d done: %s: %s", command, done, total, part, status));
            err.flush();
        }
    }

    /** Removes the bar at the end. */
    void close() {
        clearBar();
        drawn = "";
    }

    private void clearBar() {
        if (bar && !drawn.isEmpty()) {
            err.print("\r\033[K");
            err.flush();
        }
    }

    private void redraw() {
        if (bar && !drawn.isEmpty()) {
            err.print("\r" + drawn);
            err.flush();
        }
    }
}
