package org.cardwright.sim.process;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;

/**
 * Reads one output stream of a child process to its end on its own thread, so that a simulator filling one
 * pipe can never block while we wait on the other. Keeps at most {@link #LIMIT_BYTES}; the rest is read and
 * discarded so the child never stalls.
 */
final class StreamDrain implements Runnable {
    /** Largest amount of console output kept per stream; a runaway print loop must not exhaust the heap. */
    static final int LIMIT_BYTES = 16 * 1024 * 1024;

    private final InputStream input;
    private final ByteArrayOutputStream kept = new ByteArrayOutputStream();
    private boolean truncated;
    private IOException failure;

    StreamDrain(InputStream input) {
        this.input = input;
    }

    @Override
    public void run() {
        byte[] buffer = new byte[8192];
        try (input) {
            int count;
            while ((count = input.read(buffer)) >= 0) {
                synchronized (this) {
                    int room = LIMIT_BYTES - kept.size();
                    if (count > room) {
                        truncated = true;
                    }
                    kept.write(buffer, 0, Math.max(0, Math.min(count, room)));
                }
            }
        } catch (IOException e) {
            synchronized (this) {
                failure = e;
            }
        }
    }

    /** Everything read so far, decoded as UTF-8 (malformed bytes become U+FFFD). */
    synchronized String text() {
        String text = kept.toString(StandardCharsets.UTF_8);
        return truncated ? text + System.lineSeparator() + "[output cut at " + LIMIT_BYTES + " bytes]" : text;
    }

    /** The read error, if the stream failed other than by being closed when the process was killed. */
    synchronized IOException failure() {
        return failure;
    }
}
