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
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.sim.Bias;
import org.cardwright.sim.BuiltinCapacitance;
import org.cardwright.sim.BuiltinEngine;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.OperatingPoint;

/**
 * Writes the data files of the invented example library in fixtures/library: every value simulated with
 * cardwright's built-in engine (ngspice 39 level-1 equations) from invented cards, with seeded Gaussian noise.
 * Run {@code main} with the target folder to regenerate them; {@code LibraryFixturesTest} checks that the committed
 * files are exactly what this writes.
 */
public final class LibraryFixtureData {
    /** Voltage noise of the invented bench, 1 sigma [V] (a 5.5-digit meter on its 2 V range; common practice, no source). */
    private static final double VOLTAGE_NOISE = 1e-4;
    /** Relative noise of the invented leakage and capacitance readings, 1 sigma [1]. */
    private static final double RELATIVE_NOISE = 0.01;
    private static final String HEADER = "# Invented demo data, not a measurement: the %s, an invented %s, on an invented bench.\n"
            + "# Simulated with cardwright's built-in engine (ngspice 39 level-1 equations) from the invented card\n"
            + "#   %s\n"
            + "# Noise: %s; java.util.Random seed %d.\n"
            + "# Regenerate: see fixtures/library/README.md.\n";

    private LibraryFixtureData() {
    }

    /** Switching diode SW1: ISR and IKF matter, so a spice3 card must leave them out. */
    static DiodeParameters sw1() {
        return params(Param.IS, 4e-15, Param.N, 1.03, Param.RS, 1.1, Param.ISR, 2e-11, Param.NR, 1.9, Param.IKF, 0.06,
                Param.CJO, 1.8e-12, Param.VJ, 0.7, Param.M, 0.35);
    }

    /** Rectifier RB4. */
    static DiodeParameters rb4() {
        return params(Param.IS, 8e-9, Param.N, 1.85, Param.RS, 0.035, Param.TNOM, 298.15);
    }

    /** Schottky SK2. */
    static DiodeParameters sk2() {
        return params(Param.IS, 2e-7, Param.N, 1.04, Param.RS, 0.08, Param.EG, 0.69, Param.XTI, 2.0,
                Param.CJO, 1.2e-10, Param.VJ, 0.4, Param.M, 0.5);
    }

    public static void main(String[] args) throws IOException {
        write(Path.of(args.length > 0 ? args[0] : "fixtures/library"));
    }

    /** Writes every data file under {@code root}. */
    static void write(Path root) throws IOException {
        DiodeParameters sw1 = sw1();
        String sw1Text = "IS=4f N=1.03 RS=1.1 ISR=20p NR=1.9 IKF=60m CJO=1.8p VJ=0.7 M=0.35";
        int seed = 5100;
        for (double c : List.of(-40.0, 25.0, 125.0)) {
            forward(root.resolve("switching/data/sw1-forward-" + tag(c) + ".csv"), "SW1", "small-signal switching diode",
                    sw1, sw1Text, c, 1e-9, 0.1, 6, seed++, false);
        }
        reverse(root.resolve("switching/data/sw1-reverse-25C.csv"), "SW1", "small-signal switching diode", sw1, sw1Text,
                25, List.of(0.5, 1.0, 2.0, 5.0, 10.0, 20.0, 40.0), seed++);
        recovery(root.resolve("switching/data/sw1-recovery-25C.csv"));

        DiodeParameters rb4 = rb4();
        String rb4Text = "IS=8n N=1.85 RS=35m TNOM=25";
        Path rb4File = root.resolve("rectifiers/data/rb4-forward.csv");
        forward(rb4File, "RB4", "general-purpose rectifier", rb4, rb4Text, 25, 1e-7, 1, 5, 5200, true);
        String first = Files.readString(rb4File, StandardCharsets.UTF_8);
        Path tmp = rb4File.resolveSibling("rb4-100C.tmp");
        forward(tmp, "RB4", "general-purpose rectifier", rb4, rb4Text, 100, 1e-7, 1, 5, 5201, true);
        StringBuilder both = new StringBuilder(first);
        for (String line : Files.readAllLines(tmp, StandardCharsets.UTF_8)) {
            if (!line.startsWith("#") && !line.startsWith("V ")) {
                both.append(line).append('\n');
            }
        }
        Files.delete(tmp);
        Files.writeString(rb4File, both.toString().replace("at 25 degC", "at 25 and 100 degC (T column)"), StandardCharsets.UTF_8);

        DiodeParameters sk2 = sk2();
        String sk2Text = "IS=200n N=1.04 RS=80m EG=0.69 XTI=2 CJO=120p VJ=0.4 M=0.5";
        forward(root.resolve("schottky/data/sk2-forward-25C.csv"), "SK2", "Schottky barrier rectifier", sk2, sk2Text, 25,
                1e-6, 1, 5, 5300, false);
        forward(root.resolve("schottky/data/sk2-forward-85C.csv"), "SK2", "Schottky barrier rectifier", sk2, sk2Text, 85,
                1e-6, 1, 5, 5301, false);
        capacitance(root.resolve("schottky/data/sk2-cv-25C.csv"), sk2, sk2Text, 5302);
    }

    private static DiodeParameters params(Object... pairs) {
        Map<Param, Double> m = new EnumMap<>(Param.class);
        for (int i = 0; i < pairs.length; i += 2) {
            m.put((Param) pairs[i], (Double) pairs[i + 1]);
        }
        return DiodeParameters.of(m);
    }

    private static void forward(Path csv, String model, String what, DiodeParameters p, String card, double celsius,
                                double from, double to, int perDecade, long seed, boolean tColumn) throws IOException {
        Random random = new Random(seed);
        List<Bias> biases = new ArrayList<>();
        int decades = (int) Math.round(Math.log10(to / from));
        for (int k = 0; k <= decades * perDecade; k++) {
            biases.add(Bias.current(from * Math.pow(10, (double) k / perDecade), celsius + Ngspice39.CELSIUS_TO_KELVIN));
        }
        List<OperatingPoint> ops = new BuiltinEngine(SimulatorOptions.NGSPICE_DEFAULTS).dc(CardUnderTest.ngspice(model, p), biases);
        StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, HEADER, model, what, ".model " + model + " D(" + card + ")",
                "Gaussian on the voltage, 0.1 mV", seed));
        sb.append("# Forward I-V at ").append(fmt(celsius)).append(" degC, current forced, ").append(perDecade)
                .append(" points per decade.\n");
        sb.append(tColumn ? "V [V],I [A],T [degC]\n" : "V [V],I [A]\n");
        for (int i = 0; i < ops.size(); i++) {
            double v = ops.get(i).voltage() + VOLTAGE_NOISE * random.nextGaussian();
            sb.append(String.format(Locale.ROOT, "%.7f,%.6e", v, biases.get(i).value()));
            sb.append(tColumn ? "," + fmt(celsius) + "\n" : "\n");
        }
        Files.createDirectories(csv.getParent());
        Files.writeString(csv, sb.toString(), StandardCharsets.UTF_8);
    }

    private static void reverse(Path csv, String model, String what, DiodeParameters p, String card, double celsius,
                                List<Double> volts, long seed) throws IOException {
        Random random = new Random(seed);
        List<Bias> biases = volts.stream().map(v -> Bias.voltage(-v, celsius + Ngspice39.CELSIUS_TO_KELVIN)).toList();
        List<OperatingPoint> ops = new BuiltinEngine(SimulatorOptions.NGSPICE_DEFAULTS).dc(CardUnderTest.ngspice(model, p), biases);
        StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, HEADER, model, what, ".model " + model + " D(" + card + ")",
                "Gaussian on the current, 1 % of reading", seed));
        sb.append("# Reverse leakage at ").append(fmt(celsius)).append(" degC, voltage forced.\n");
        sb.append("V [V],I [nA],T [degC]\n");
        for (int i = 0; i < ops.size(); i++) {
            double amps = ops.get(i).current() * (1 + RELATIVE_NOISE * random.nextGaussian());
            sb.append(String.format(Locale.ROOT, "%.3f,%.5f,%s%n", biases.get(i).value(), amps * 1e9, fmt(celsius)));
        }
        Files.createDirectories(csv.getParent());
        Files.writeString(csv, sb.toString(), StandardCharsets.UTF_8);
    }

    private static void capacitance(Path csv, DiodeParameters p, String card, long seed) throws IOException {
        Random random = new Random(seed);
        List<Bias> biases = new ArrayList<>();
        for (double v : List.of(0.0, -0.5, -1.0, -2.0, -5.0, -10.0, -20.0)) {
            biases.add(Bias.voltage(v, 25 + Ngspice39.CELSIUS_TO_KELVIN));
        }
        List<Double> c = new BuiltinCapacitance(SimulatorOptions.NGSPICE_DEFAULTS).capacitance(CardUnderTest.ngspice("SK2", p), biases, 1e6);
        StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, HEADER, "SK2", "Schottky barrier rectifier",
                ".model SK2 D(" + card + ")", "Gaussian on the capacitance, 1 % of reading", seed));
        sb.append("# C-V at 25 degC, 1 MHz, parallel capacitance.\n");
        sb.append("V [V],C [pF],T [degC]\n");
        for (int i = 0; i < c.size(); i++) {
            sb.append(String.format(Locale.ROOT, "%.2f,%.4f,25%n", biases.get(i).value(), c.get(i) * 1e12 * (1 + RELATIVE_NOISE * random.nextGaussian())));
        }
        Files.createDirectories(csv.getParent());
        Files.writeString(csv, sb.toString(), StandardCharsets.UTF_8);
    }

    private static void recovery(Path csv) throws IOException {
        String text = "# Invented demo data, not a measurement: reverse-recovery records of the SW1, an invented switching diode.\n"
                + "# Listed in SW1.device.yaml as kind recovery. Written from the charge-control relation trr = TT ln(1 + IF/|IR|)\n"
                + "# with TT = 5 ns, rounded to 10 ps; IR is negative, as every reverse current in cardwright's files.\n"
                + "# Regenerate: see fixtures/library/README.md.\n"
                + "IF [mA],IR [mA],trr [ns],T [degC]\n"
                + "10,-10,3.47,25\n10,-20,2.03,25\n20,-20,3.47,25\n";
        Files.createDirectories(csv.getParent());
        Files.writeString(csv, text, StandardCharsets.UTF_8);
    }

    private static String tag(double c) {
        return (c < 0 ? "minus" : "") + Math.round(Math.abs(c)) + "C";
    }

    private static String fmt(double c) {
        return c == Math.rint(c) ? Long.toString(Math.round(c)) : Double.toString(c);
    }
}
