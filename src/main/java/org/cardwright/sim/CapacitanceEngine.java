package org.cardwright.sim;

import java.util.List;
import org.cardwright.sim.process.SimulationException;

/**
 * Something that simulates a diode card's small-signal capacitance at DC voltage biases, as an LCR meter in
 * parallel mode reads it: C = Im(Y)/(2 pi f) of the terminal admittance Y, series resistance included.
 */
public interface CapacitanceEngine {
    /** Short name used on the command line and in reports, e.g. {@code builtin}, {@code ngspice}. */
    String name();

    /** A one-line description including the simulator version where there is one. */
    String describe() throws SimulationException;

    /**
     * Parallel capacitance Im(Y)/(2 pi f) at each bias, in the order given [F].
     *
     * @param card          the card to simulate
     * @param voltageBiases DC terminal voltages (forcing {@link Bias.Forcing#VOLTAGE}) and temperatures
     * @param frequency     test-signal frequency, positive [Hz]
     * @throws SimulationException      when the simulator cannot run, reports an error or warns about the card
     * @throws IllegalArgumentException when a bias forces current or the frequency is not positive
     */
    List<Double> capacitance(CardUnderTest card, List<Bias> voltageBiases, double frequency) throws SimulationException;

    /** Checks the arguments every engine needs; throws IllegalArgumentException naming the first bad one. */
    static void checkArguments(List<Bias> voltageBiases, double frequency) {
        if (!(frequency > 0) || !Double.isFinite(frequency)) {
            throw new IllegalArgumentException("capacitance needs a positive, finite test frequency, got " + frequency + " Hz");
        }
        for (Bias b : voltageBiases) {
            if (b.forcing() != Bias.Forcing.VOLTAGE) {
                throw new IllegalArgumentException("capacitance is simulated at forced voltages only, got " + b);
            }
        }
    }
}
