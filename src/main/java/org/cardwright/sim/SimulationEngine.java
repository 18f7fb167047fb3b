package org.cardwright.sim;

import java.util.List;
import org.cardwright.sim.process.SimulationException;

/** Something that re-simulates a diode card at given operating conditions. */
public interface SimulationEngine {
    /** Short name used on the command line and in reports, e.g. {@code builtin}, {@code ngspice}. */
    String name();

    /** A one-line description including the simulator version where there is one. */
    String describe() throws SimulationException;

    /**
     * DC solutions at each bias, in the order given.
     *
     * @throws SimulationException when the simulator cannot run or reports an error
     */
    List<OperatingPoint> dc(CardUnderTest card, List<Bias> biases) throws SimulationException;
}
