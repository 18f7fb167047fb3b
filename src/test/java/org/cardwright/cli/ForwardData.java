package org.cardwright.cli;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.sim.Bias;
import org.cardwright.sim.BuiltinEngine;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.NgspiceEngine;
import org.cardwright.sim.OperatingPoint;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.sim.process.SimulatorProcess;
import org.cardwright.testsupport.Simulators;

/**
 * Forward I-V measurement files for the command-line tests, made by simulating an invented card: in ngspice 39
 * (the outside reference) or with the built-in engine (where the test is about the command layer, not the
 * numbers). One CSV file per temperature, noise-free, with a provenance header.
 */
final class ForwardData {
    /** Time allowed for one ngspice run that makes test data [s]. */
    private static final Duration NGSPICE_TIMEOUT = Duration.ofSeconds(60);

    private ForwardData() {
    }

    /** Forced currents from {@code low} to {@code high} [A], {@code perDecade} per decade, at each temperature [degC]. */
    static List<Bias> currentSweeps(double[] celsius, double low, double high, int perDecade) {
        int steps = (int) Math.round(Math.log10(high / low) * perDecade);
        List<Bias> biases = new ArrayList<>();
        for (double c : celsius) {
            for (int k = 0; k <= steps; k++) {
                biases.add(Bias.current(low * Math.pow(10, (double) k / perDecade), c + Ngspice39.CELSIUS_TO_KELVIN));
            }
        }
        return biases;
    }

    /** A one-line {@code .model} statement for {@code p}, every given value with 17 significant digits. */
    static String card(String name, DiodeParameters p) {
        StringBuilder sb = new StringBuilder(".model ").append(name).append(" D(");
        for (Map.Entry<Param, Double> e : p.givenValues().entrySet()) {
            sb.append(' ').append(e.getKey().keyword()).append('=')
                    .append(String.format(Locale.ROOT, "%.17g", e.getKey().toCardValue(e.getValue())));
        }
        return sb.append(")\n").toString();
    }

    /** Terminal voltages at {@code biases} simulated by ngspice 39; requires ngspice (see {@link Simulators}). */
    static List<OperatingPoint> simulateInNgspice(DiodeParameters truth, List<Bias> biases, String workName)
            throws SimulationException {
        SimulatorProcess ngspice = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(),
                NGSPICE_TIMEOUT);
        return new NgspiceEngine(ngspice, Simulators.tempDir(workName))
                .dc(CardUnderTest.ngspice("truth", truth), biases);
    }

    /** Terminal voltages at {@code biases} from the built-in ngspice 39 equations. */
    static List<OperatingPoint> simulateBuiltin(DiodeParameters truth, List<Bias> biases) {
        return new BuiltinEngine(SimulatorOptions.NGSPICE_DEFAULTS)
                .dc(CardUnderTest.ngspice("truth", truth), biases);
    }

    /**
     * Writes one CSV file per temperature, {@code DIR/STEM-<T>C.csv}, columns {@code V [V], I [A], T [degC]}
     * with 10 significant digits, and returns them in temperature order.
     *
     * @param how one line saying how the values were made, for the header
     */
    static List<Path> writePerTemperature(Path dir, String stem, DiodeParameters truth, List<Bias> biases,
                                          List<OperatingPoint> points, String how) throws IOException {
        List<Path> files = new ArrayList<>();
        StringBuilder sb = null;
        double temperature = Double.NaN;
        for (int i = 0; i <= biases.size(); i++) {
            boolean flush = i == biases.size() || biases.get(i).temperature() != temperature;
            if (flush && sb != null) {
                double c = temperature - Ngspice39.CELSIUS_TO_KELVIN;
                Path f = dir.resolve(String.format(Locale.ROOT, "%s-%sC.csv", stem,
                        c < 0 ? "minus" + Math.round(-c) : Long.toString(Math.round(c))));
                Files.writeString(f, sb.toString(), StandardCharsets.UTF_8);
                files.add(f);
            }
            if (i == biases.size()) {
                break;
            }
            if (flush) {
                temperature = biases.get(i).temperature();
                sb = new StringBuilder()
                        .append("# Invented test data, not a measurement of any real device.\n")
                        .append("# ").append(how).append(", noise-free, from ").append(card("truth", truth))
                        .append("V [V],I [A],T [degC]\n");
            }
            sb.append(String.format(Locale.ROOT, "%.10g,%.10g,%.10g\n", points.get(i).voltage(), biases.get(i).value(),
                    temperature - Ngspice39.CELSIUS_TO_KELVIN));
        }
        return files;
    }
}
