package org.cardwright.library;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.stream.Collectors;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.sim.Bias;
import org.cardwright.sim.BuiltinEngine;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.OperatingPoint;

/**
 * Invented parts for library tests: a device file and forward I-V data simulated from an invented card with the
 * built-in engine (ngspice 39 level-1 equations), with seeded Gaussian noise on the voltage. Nothing here is a
 * measurement or describes a real part.
 */
final class SyntheticParts {
    /** Voltage noise of the invented bench, 1 sigma [V]: a 5.5-digit meter on its 2 V range (common practice, no source). */
    static final double VOLTAGE_NOISE = 1e-4;

    /**
     * One invented part.
     *
     * @param folder   folder of the device file, relative to the library root
     * @param model    model name
     * @param truth    the invented card the data are simulated from [SI]
     * @param celsius  temperatures of the sweeps [degC], one file each
     * @param seed     noise seed
     * @param extraYaml more device-file lines (rules, dialects, tolerance), or empty
     */
    record Spec(String folder, String model, DiodeParameters truth, List<Double> celsius, long seed, String extraYaml) {
    }

    private SyntheticParts() {
    }

    /** A small silicon diode with the given IS, N, RS. */
    static DiodeParameters card(double is, double n, double rs) {
        Map<Param, Double> m = new EnumMap<>(Param.class);
        m.put(Param.IS, is);
        m.put(Param.N, n);
        m.put(Param.RS, rs);
        return DiodeParameters.of(m);
    }

    /** Writes the device file and its data files for {@code spec} under {@code root}; returns the device file. */
    static Path write(Path root, Spec spec) throws IOException {
        Path dir = Files.createDirectories(root.resolve(spec.folder()));
        Files.createDirectories(dir.resolve("data"));
        StringBuilder yaml = new StringBuilder();
        yaml.append("# Invented part for tests: not a real device. Data simulated with cardwright's built-in engine.\n");
        yaml.append("model: ").append(spec.model()).append('\n');
        yaml.append("kind: silicon-pn\n");
        yaml.append("data:\n");
        for (double c : spec.celsius()) {
            String file = "data/" + spec.model().toLowerCase(Locale.ROOT) + "-forward-" + tag(c) + ".csv";
            writeForward(dir.resolve(file), spec.model(), spec.truth(), c, spec.seed() + Math.round(c * 10));
            yaml.append("  - file: ").append(file).append('\n');
            yaml.append("    kind: forward\n");
            yaml.append("    temperature: ").append(fmt(c)).append('\n');
        }
        yaml.append(spec.extraYaml());
        Path device = dir.resolve(spec.model() + DeviceFileReader.SUFFIX);
        Files.writeString(device, yaml.toString(), StandardCharsets.UTF_8);
        return device;
    }

    /** Forward sweep 1 nA .. 100 mA, 5 points per decade, without a T column (the device file gives the temperature). */
    static void writeForward(Path csv, String model, DiodeParameters truth, double celsius, long seed) throws IOException {
        Random random = new Random(seed);
        List<Bias> biases = new ArrayList<>();
        for (int k = 0; k <= 40; k++) {
            biases.add(Bias.current(Math.pow(10, -9 + k / 5.0), celsius + Ngspice39.CELSIUS_TO_KELVIN));
        }
        List<OperatingPoint> ops = new BuiltinEngine(SimulatorOptions.NGSPICE_DEFAULTS)
                .dc(CardUnderTest.ngspice(model, truth), biases);
        StringBuilder sb = new StringBuilder();
        sb.append("# Invented test data, not a measurement: forward I-V of the invented part ").append(model)
                .append(" at ").append(fmt(celsius)).append(" degC.\n");
        sb.append("# Simulated with cardwright's built-in engine from ").append(truth.givenValues().entrySet().stream()
                .map(e -> e.getKey() + "=" + e.getValue()).collect(Collectors.joining(" ")))
                .append("; Gaussian voltage noise 0.1 mV, java.util.Random seed ").append(seed).append(".\n");
        sb.append("V [V],I [A]\n");
        for (int i = 0; i < ops.size(); i++) {
            double v = ops.get(i).voltage() + VOLTAGE_NOISE * random.nextGaussian();
            sb.append(String.format(Locale.ROOT, "%.7f,%.6e%n", v, biases.get(i).value()));
        }
        Files.writeString(csv, sb.toString(), StandardCharsets.UTF_8);
    }

    /** Twenty invented parts with different IS, N, RS, two temperatures each, ngspice cards only. */
    static List<Spec> twenty() {
        List<Spec> out = new ArrayList<>();
        for (int i = 0; i < 20; i++) {
            double is = 1e-14 * Math.pow(10, (i % 5) * 0.5);
            double n = 1.0 + 0.04 * (i % 4);
            double rs = 0.3 + 0.15 * (i % 7);
            String model = String.format(Locale.ROOT, "TP%02d", i + 1);
            out.add(new Spec("group" + (i / 5 + 1), model, card(is, n, rs), List.of(25.0, 85.0), 1000L + i,
                    "dialects: [ngspice]\n"));
        }
        return out;
    }

    private static String tag(double c) {
        return (c < 0 ? "minus" : "") + Math.round(Math.abs(c)) + "C";
    }

    private static String fmt(double c) {
        return c == Math.rint(c) ? Long.toString(Math.round(c)) : Double.toString(c);
    }
}
