package org.cardwright.sim.process;

/**
 * An external simulator run that did not produce a usable result: the executable is missing or cannot start,
 * the run exceeded its time limit, the process exited with a non-zero code, or the simulator reported an error
 * in its output. The message is one line and names the simulator and the cause.
 */
public final class SimulationException extends Exception {
    private static final long serialVersionUID = 1L;

    /** A failure with a one-line message naming the simulator and the cause. */
    public SimulationException(String message) {
        super(message);
    }

    /** A failure caused by an I/O or interruption problem; the message still names the simulator. */
    public SimulationException(String message, Throwable cause) {
        super(message, cause);
    }
}
