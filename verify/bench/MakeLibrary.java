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
import org.cardwright.sim.BuiltinEngine;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.OperatingPoint;

/**
 * Writes an invented model library for the build benchmark (verify/bench/commands): N parts, each a device file
 * with data simulated by cardwright's built-in engine (ngspice 39 level-1 equations) from an invented card, with
 * seeded Gaussian voltage noise. Nothing here is a measurement or describes a real part.
 *
 * <pre>
 * java -cp target/cardwright.jar verify/bench/MakeLibrary.java OUT PARTS forward|forward+reverse
 * java -cp target/cardwright.jar verify/bench/MakeLibrary.java FILE.csv POINTS sweep
 * </pre>
 *
 * forward: one file per part, a forward sweep at 25 degC (1 nA .. 100 mA, 5 points per decade), ngspice card.
 * forward+reverse: forward sweeps at 25 and 85 degC and a reverse sweep at 25 degC into breakdown (BV 5 .. 40 V),
 * ngspice and spice3 cards. sweep: one forward sweep of POINTS points at 25 degC (1 nA .. 100 mA), for verify.
 */
public final class MakeLibrary {
    /** Voltage noise of the invented bench, 1 sigma [V]. */
    private static final double NOISE = 1e-4;

    public static void main(String[] args) throws IOException {
        if (args.length == 3 && args[2].equals("sweep")) {
            sweep(Path.of(args[0]), Integer.parseInt(args[1]));
            return;
        }
        if (args.length != 3 || !(args[2].equals("forward") || args[2].equals("forward+reverse"))) {
            System.err.println("usage: MakeLibrary OUT PARTS forward|forward+reverse, or MakeLibrary FILE.csv POINTS sweep");
            System.exit(2);
        }
        Path out = Path.of(args[0]);
        int parts = Integer.parseInt(args[1]);
        boolean reverse = args[2].equals("forward+reverse");
        for (int i = 0; i < parts; i++) {
            part(out, i, reverse);
        }
        System.out.println("wrote " + parts + " invented parts (" + args[2] + ") under " + out);
    }

    private static void part(Path root, int i, boolean reverse) throws IOException {
        Map<Param, Double> m = new EnumMap<>(Param.class);
        m.put(Param.IS, 1e-14 * Math.pow(10, (i % 7) * 0.4));
        m.put(Param.N, 1.0 + 0.03 * (i % 5));
        m.put(Param.RS, 0.2 + 0.13 * (i % 11));
        if (reverse) {
            m.put(Param.BV, 5.0 + (i % 36));
            m.put(Param.IBV, 1e-4);
            m.put(Param.NBV, 2.0 + 0.25 * (i % 4));
        }
        DiodeParameters truth = DiodeParameters.of(m);
        String model = String.format(Locale.ROOT, "BP%05d", i + 1);
        Path dir = Files.createDirectories(root.resolve(String.format(Locale.ROOT, "group%03d", i / 100)).resolve("data"));
        StringBuilder yaml = new StringBuilder();
        yaml.append("# Invented part for the build benchmark, not a real device; data simulated with cardwright's built-in engine.\n");
        yaml.append("model: ").append(model).append("\nkind: silicon-pn\ndata:\n");
        List<Double> temps = reverse ? List.of(25.0, 85.0) : List.of(25.0);
        for (double c : temps) {
            String file = "data/" + model.toLowerCase(Locale.ROOT) + "-forward-" + (int) c + "C.csv";
            List<Bias> b = new ArrayList<>();
            for (int k = 0; k <= 40; k++) {
                b.add(Bias.current(Math.pow(10, -9 + k / 5.0), c + Ngspice39.CELSIUS_TO_KELVIN));
            }
            write(dir.getParent().resolve(file), model, truth, b, 1000L * i + (long) c);
            yaml.append("  - file: ").append(file).append("\n    kind: forward\n    temperature: ").append((int) c).append('\n');
        }
        if (reverse) {
            String file = "data/" + model.toLowerCase(Locale.ROOT) + "-reverse-25C.csv";
            List<Bias> b = new ArrayList<>();
            double bv = m.get(Param.BV);
            for (int k = 1; k <= 8; k++) {
                b.add(Bias.voltage(-bv * k / 10.0, 25 + Ngspice39.CELSIUS_TO_KELVIN));  // leakage below breakdown
            }
            for (int k = 0; k <= 12; k++) {
                b.add(Bias.current(-Math.pow(10, -6 + k / 4.0), 25 + Ngspice39.CELSIUS_TO_KELVIN));  // 1 uA .. 1 mA into breakdown
            }
            write(dir.getParent().resolve(file), model, truth, b, 1000L * i + 7);
            yaml.append("  - file: ").append(file).append("\n    kind: reverse\n    temperature: 25\n");
            yaml.append("dialects: [ngspice, spice3]\n");
        } else {
            yaml.append("dialects: [ngspice]\n");
        }
        Files.writeString(dir.getParent().resolve(model + ".device.yaml"), yaml.toString(), StandardCharsets.UTF_8);
    }

    /** One forward sweep of {@code points} points at 25 degC, 1 nA .. 100 mA, of an invented part (for verify). */
    private static void sweep(Path csv, int points) throws IOException {
        Map<Param, Double> m = new EnumMap<>(Param.class);
        m.put(Param.IS, 2e-14);
        m.put(Param.N, 1.03);
        m.put(Param.RS, 0.6);
        List<Bias> b = new ArrayList<>();
        for (int k = 0; k < points; k++) {
            b.add(Bias.current(1e-9 * Math.pow(10, 8.0 * k / (points - 1)), 25 + Ngspice39.CELSIUS_TO_KELVIN));
        }
        Files.createDirectories(csv.toAbsolutePath().getParent());
        write(csv, "SWEEP", DiodeParameters.of(m), b, points);
        String text = Files.readString(csv, StandardCharsets.UTF_8);
        Files.writeString(csv, "# temperature = 25 degC\n" + text, StandardCharsets.UTF_8);
        System.out.println("wrote " + points + " points of an invented forward sweep to " + csv);
    }

    private static void write(Path csv, String model, DiodeParameters truth, List<Bias> biases, long seed) throws IOException {
        Random random = new Random(seed);
        List<OperatingPoint> ops = new BuiltinEngine(SimulatorOptions.NGSPICE_DEFAULTS)
                .dc(new CardUnderTest(model, truth, List.of()), biases);
        StringBuilder sb = new StringBuilder();
        sb.append("# Invented benchmark data, not a measurement: the invented part ").append(model)
                .append(", simulated with cardwright's built-in engine, Gaussian voltage noise 0.1 mV, seed ").append(seed).append(".\n");
        sb.append("V [V],I [A]\n");
        for (OperatingPoint op : ops) {
            sb.append(String.format(Locale.ROOT, "%.7f,%.6e%n", op.voltage() + NOISE * random.nextGaussian(), op.current()));
        }
        Files.writeString(csv, sb.toString(), StandardCharsets.UTF_8);
    }
}
