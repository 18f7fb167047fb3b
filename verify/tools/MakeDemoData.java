/*
 * Makes the invented demo data in fixtures/demo/: simulates an invented diode card in ngspice 39, adds
 * seeded Gaussian noise and writes one CSV per sweep, plus the card and the netlist that produced them.
 *
 * Run from the repository root (JDK 17+ and ngspice 39 needed, nothing else):
 *
 *     java verify/tools/MakeDemoData.java [--out DIR] [--ngspice PATH] [--any-version]
 *
 * The output is byte-stable: the same ngspice version gives the same files every time (fixed seeds,
 * java.util.Random whose Gaussian generator is specified by the JDK, Locale.ROOT number formats, "\n" line ends).
 * The files are invented demo data, not a measurement, and say so in their header.
 */

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

public final class MakeDemoData {
    static final String TOOL = "verify/tools/MakeDemoData.java";
    static final String REGENERATE = "java " + TOOL + " (from the repository root; needs ngspice 39)";
    static final String EXPECTED_VERSION = "ngspice-39";

    /** SPICE model name of the invented KS-1 diode. */
    static final String MODEL_NAME = "KS1";
    /**
     * The generating card (invented). IS/N: diffusion current; ISR/NR: recombination current, larger than the
     * diffusion current below about 1 uA at 25 degC; IKF: high-injection knee bending the top decade;
     * RS: series resistance; EG/XTI: silicon temperature law (SPICE default values).
     */
    static final String PARAMETERS = "IS=1.5e-14 N=1.02 RS=0.85 ISR=6e-11 NR=1.95 IKF=0.045 EG=1.11 XTI=3";
    static final String CARD = ".model " + MODEL_NAME + " D(" + PARAMETERS + ")";

    /** Device temperatures of the forward sweeps [degC]. */
    static final int[] FORWARD_TEMPERATURES = {-40, 25, 85, 125};
    /** Forced current: 10^-9 .. 10^-1 A, 8 points per decade, as exponents of ten [1]. */
    static final double FIRST_EXPONENT = -9.0;
    static final double LAST_EXPONENT = -1.0;
    static final double EXPONENT_STEP = 0.125;
    /** Reverse voltages forced on the cathode, 25 degC [V] (written as negative anode voltages). */
    static final String REVERSE_VOLTAGES = "0.1 0.2 0.5 1 2 5 10 15 20 25 30 35 40 45 50";
    static final int REVERSE_TEMPERATURE = 25;

    /** Voltage noise, 1 sigma: offset [V] plus a fraction of the reading [1], added linearly. */
    static final double VOLTAGE_NOISE_OFFSET = 0.15e-3;
    static final double VOLTAGE_NOISE_FRACTION = 2e-4;
    /** Current noise, 1 sigma, as a fraction of the reading [1]. */
    static final double CURRENT_NOISE_FRACTION = 1e-3;
    /** Seed of file k is SEED_BASE + k (k = 1..4 forward in the order above, 5 reverse). */
    static final long SEED_BASE = 7100;

    /** Largest relative gap between the forced and the simulated current before we refuse the data [1]. */
    static final double FORCED_CURRENT_TOLERANCE = 1e-5;
    /** How long ngspice may run [s]. */
    static final long TIMEOUT_SECONDS = 120;

    record Point(double voltage, double current) {
    }

    public static void main(String[] args) throws Exception {
        Path out = Path.of("fixtures", "demo");
        String ngspice = System.getenv().getOrDefault("CARDWRIGHT_NGSPICE", "ngspice");
        boolean anyVersion = false;
        for (int i = 0; i < args.length; i++) {
            switch (args[i]) {
                case "--out" -> out = Path.of(value(args, ++i, "--out"));
                case "--ngspice" -> ngspice = value(args, ++i, "--ngspice");
                case "--any-version" -> anyVersion = true;
                default -> fail("unknown argument '" + args[i] + "'; usage: java " + TOOL
                        + " [--out DIR] [--ngspice PATH] [--any-version]");
            }
        }
        if (!Files.isDirectory(out.getParent() == null ? Path.of(".") : out.getParent())) {
            fail("output parent folder " + out.toAbsolutePath().getParent()
                    + " does not exist; run from the repository root or give --out");
        }
        String version = ngspiceVersion(ngspice);
        if (!version.equals(EXPECTED_VERSION) && !anyVersion) {
            fail(ngspice + " is " + version + ", the committed data came from " + EXPECTED_VERSION
                    + "; pass --any-version to write data from it anyway");
        }

        Path work = Files.createTempDirectory("cardwright-demo-");
        try {
            String netlist = netlist();
            runNgspice(ngspice, netlist, work);
            Files.createDirectories(out);
            int seedIndex = 1;
            for (int t : FORWARD_TEMPERATURES) {
                List<Point> points = readForward(work.resolve("fwd_T" + t + ".dat"));
                writeCsv(out.resolve("ks1-forward-" + temperatureName(t) + ".csv"), forwardScenario(t), t,
                        points, SEED_BASE + seedIndex++, version);
            }
            List<Point> reverse = readReverse(work.resolve("rev.dat"));
            writeCsv(out.resolve("ks1-reverse-" + temperatureName(REVERSE_TEMPERATURE) + ".csv"),
                    reverseScenario(), REVERSE_TEMPERATURE, reverse, SEED_BASE + seedIndex, version);
            write(out.resolve("generating-card.lib"), card(version));
            write(out.resolve("generating-netlist.cir"), netlist);
            System.out.println("wrote " + (FORWARD_TEMPERATURES.length + 1) + " CSV files, the card and the netlist to "
                    + out);
        } finally {
            try (Stream<Path> paths = Files.walk(work)) {
                for (Path p : paths.sorted(Comparator.reverseOrder()).toList()) {
                    Files.deleteIfExists(p);
                }
            }
        }
    }

    static String value(String[] args, int i, String option) {
        if (i >= args.length) {
            fail(option + " needs a value");
        }
        return args[i];
    }

    static void fail(String message) {
        System.err.println("MakeDemoData: " + message);
        System.exit(2);
    }

    static String temperatureName(int celsius) {
        return (celsius < 0 ? "minus" + (-celsius) : Integer.toString(celsius)) + "C";
    }

    /** The ngspice deck: forward sweeps by a current forced as 10^V(x) (diode-model.md section 11(a)),
     *  then reverse operating points at 25 degC on a second copy of the diode. */
    static String netlist() {
        String n = "\n";
        return "* KS-1 invented switching diode: demo data deck for ngspice 39 (made by " + TOOL + ")" + n
                + "* Invented demo data, not a measurement." + n
                + "* Forward: current forced as 10^V(x) into the anode of D1, 1 nA .. 100 mA, 8 points/decade." + n
                + "* Reverse: voltage forced on the cathode of D2 at " + REVERSE_TEMPERATURE + " degC." + n
                + "Vx x 0 0" + n
                + "B1 0 a I = pwr(10, V(x))" + n
                + "D1 a 0 " + MODEL_NAME + n
                + "V2 k 0 0" + n
                + "D2 0 k " + MODEL_NAME + n
                + CARD + n
                + ".options reltol=1e-7 vntol=1e-10 abstol=1e-16" + n
                + ".control" + n
                + "set wr_singlescale" + n
                + "set wr_vecnames" + n
                + "option numdgt=12" + n
                + "save v(a) @d1[vd] @d1[id] v(k) @d2[vd] @d2[id]" + n
                + "foreach t " + join(FORWARD_TEMPERATURES) + n
                + "  option temp=$t" + n
                + "  dc Vx " + fmt(FIRST_EXPONENT) + " " + fmt(LAST_EXPONENT) + " " + fmt(EXPONENT_STEP) + n
                + "  wrdata fwd_T{$t}.dat v(a) @d1[vd] @d1[id]" + n
                + "end" + n
                + "option temp=" + REVERSE_TEMPERATURE + n
                + "unset wr_vecnames" + n
                + "set appendwrite" + n
                + "foreach vr " + REVERSE_VOLTAGES + n
                + "  alter V2 dc = $vr" + n
                + "  op" + n
                + "  wrdata rev.dat v(k) @d2[vd] @d2[id]" + n
                + "end" + n
                + "quit" + n
                + ".endc" + n
                + ".end" + n;
    }

    static String join(int[] values) {
        StringBuilder b = new StringBuilder();
        for (int v : values) {
            b.append(b.length() == 0 ? "" : " ").append(v);
        }
        return b.toString();
    }

    static String fmt(double value) {
        return String.format(Locale.ROOT, "%s", value);
    }

    static String ngspiceVersion(String ngspice) throws IOException, InterruptedException {
        Process p;
        try {
            p = new ProcessBuilder(ngspice, "-v").redirectErrorStream(true).start();
        } catch (IOException e) {
            fail("cannot start ngspice '" + ngspice + "': " + e.getMessage()
                    + " (install it, or set CARDWRIGHT_NGSPICE or --ngspice)");
            throw e;
        }
        p.getOutputStream().close();
        String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS);
        for (String line : text.split("\\R")) {
            String s = line.replaceAll("^[\\s*]+", "");
            if (s.startsWith("ngspice-")) {
                return s.split("\\s")[0];
            }
        }
        fail("'" + ngspice + " -v' printed no ngspice-N banner");
        return "";
    }

    static void runNgspice(String ngspice, String netlist, Path work) throws IOException, InterruptedException {
        write(work.resolve("demo.cir"), netlist);
        Path log = work.resolve("ngspice.log");
        Process p = new ProcessBuilder(ngspice, "-b", "demo.cir").directory(work.toFile())
                .redirectErrorStream(true).redirectOutput(log.toFile()).start();
        p.getOutputStream().close();
        if (!p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS)) {
            p.descendants().forEach(ProcessHandle::destroyForcibly);
            p.destroyForcibly();
            fail("ngspice did not finish within " + TIMEOUT_SECONDS + " s");
        }
        String text = Files.readString(log, StandardCharsets.UTF_8);
        for (String line : text.split("\\R")) {
            if (line.trim().startsWith("Error") || line.contains("unrecognized parameter")) {
                fail("ngspice: " + line.trim());
            }
        }
        if (p.exitValue() != 0) {
            fail("ngspice exited with code " + p.exitValue());
        }
    }

    /** wrdata rows "exponent v(a) vd id": terminal voltage v(a), current id; the forced current must match. */
    static List<Point> readForward(Path file) throws IOException {
        List<Point> points = new ArrayList<>();
        for (double[] row : readRows(file, 4, true)) {
            double forced = Math.pow(10.0, row[0]);
            if (Math.abs(row[3] - forced) > FORCED_CURRENT_TOLERANCE * forced) {
                fail(file.getFileName() + ": diode current " + row[3] + " A differs from the forced " + forced
                        + " A by more than " + FORCED_CURRENT_TOLERANCE + " relative");
            }
            points.add(new Point(row[1], row[3]));
        }
        int expected = (int) Math.round((LAST_EXPONENT - FIRST_EXPONENT) / EXPONENT_STEP) + 1;
        if (points.size() != expected) {
            fail(file.getFileName() + ": " + points.size() + " rows, expected " + expected);
        }
        return points;
    }

    /** wrdata rows "scale v(k) vd id" from op: the anode voltage is -v(k), the current id is negative. */
    static List<Point> readReverse(Path file) throws IOException {
        List<Point> points = new ArrayList<>();
        for (double[] row : readRows(file, 4, false)) {
            points.add(new Point(-row[1], row[3]));
        }
        if (points.size() != REVERSE_VOLTAGES.split(" ").length) {
            fail(file.getFileName() + ": " + points.size() + " rows, expected " + REVERSE_VOLTAGES.split(" ").length);
        }
        return points;
    }

    static List<double[]> readRows(Path file, int columns, boolean header) throws IOException {
        if (!Files.isRegularFile(file)) {
            fail("ngspice wrote no " + file.getFileName());
        }
        List<double[]> rows = new ArrayList<>();
        List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        for (int i = header ? 1 : 0; i < lines.size(); i++) {
            String line = lines.get(i).trim();
            if (line.isEmpty()) {
                continue;
            }
            String[] fields = line.split("\\s+");
            if (fields.length != columns) {
                fail(file.getFileName() + " line " + (i + 1) + ": expected " + columns + " columns: '" + line + "'");
            }
            double[] row = new double[columns];
            for (int c = 0; c < columns; c++) {
                row[c] = Double.parseDouble(fields[c]);
            }
            rows.add(row);
        }
        return rows;
    }

    static String forwardScenario(int celsius) {
        return "# Scenario: forward I-V of the KS-1, an invented small-signal silicon switching diode, on the\n"
                + "#   invented Kestrel Street test bench: a source-measure unit forces the current from 1 nA to 100 mA,\n"
                + "#   8 points per decade, and reads the voltage; device held at " + celsius + " degC.\n";
    }

    static String reverseScenario() {
        return "# Scenario: reverse leakage of the KS-1, an invented small-signal silicon switching diode, on the\n"
                + "#   invented Kestrel Street test bench: a source-measure unit forces the anode voltage from -0.1 V\n"
                + "#   to -50 V and reads the current (negative: it flows from cathode to anode); device at "
                + REVERSE_TEMPERATURE + " degC.\n"
                + "#   In the level-1 model below this is -IS(T) plus the GMIN = 1e-12 S conductance ngspice puts\n"
                + "#   across every junction; the card has no breakdown (BV not given).\n";
    }

    static String provenance(long seed, String version) {
        return "# Generated by simulating this card in " + version + " (wrdata, 12 digits):\n"
                + "#   " + CARD + "\n"
                + "#   (.options reltol=1e-7 vntol=1e-10 abstol=1e-16; netlist: generating-netlist.cir)\n"
                + "# Noise added, Gaussian, 1 sigma: voltage " + "0.15 mV + 0.02 % of reading (added linearly),\n"
                + "#   current 0.1 % of reading; java.util.Random seed " + seed
                + ", per row one draw for the voltage, then one for the current.\n"
                + "# Made by " + TOOL + "; regenerate with: " + REGENERATE + "\n";
    }

    static void writeCsv(Path file, String scenario, int celsius, List<Point> points, long seed, String version)
            throws IOException {
        Random random = new Random(seed);
        StringBuilder b = new StringBuilder();
        b.append("# Invented demo data, not a measurement.\n");
        b.append(scenario);
        b.append(provenance(seed, version));
        b.append("V [V],I [A],T [degC]\n");
        for (Point p : points) {
            double voltageSigma = VOLTAGE_NOISE_OFFSET + VOLTAGE_NOISE_FRACTION * Math.abs(p.voltage());
            double voltage = p.voltage() + voltageSigma * random.nextGaussian();
            double current = p.current() * (1.0 + CURRENT_NOISE_FRACTION * random.nextGaussian());
            b.append(String.format(Locale.ROOT, "%.7f,%.6e,%.1f\n", voltage, current, (double) celsius));
        }
        write(file, b.toString());
    }

    static String card(String version) {
        return "* KS-1: an invented small-signal silicon switching diode (not a real part).\n"
                + "* This is the card that generated the invented demo data in fixtures/demo/*.csv\n"
                + "* (simulated in " + version + ", then seeded noise added; see README.md there).\n"
                + "* Made by " + TOOL + "; regenerate with: " + REGENERATE + "\n"
                + CARD + "\n";
    }

    static void write(Path file, String text) throws IOException {
        Files.writeString(file, text, StandardCharsets.UTF_8);
    }
}
