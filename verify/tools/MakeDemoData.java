/*
 * Makes the invented demo data in fixtures/demo/: simulates two invented diode cards in ngspice 39, adds
 * seeded Gaussian noise and writes one CSV per sweep, plus each card and the netlist that produced its data.
 * KS-1 is a small-signal switching diode (forward I-V and leakage); KS-Z6 is a 6.2 V zener whose files cover
 * the whole junction (forward, leakage and breakdown, C-V, reverse recovery). See fixtures/demo/README.md.
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
            System.out.println("KS-1: wrote " + (FORWARD_TEMPERATURES.length + 1)
                    + " CSV files, the card and the netlist to " + out);
            Path zenerWork = Files.createDirectories(work.resolve("ksz6"));
            int zenerFiles = Zener.make(ngspice, version, zenerWork, out);
            System.out.println("KS-Z6: wrote " + zenerFiles + " CSV files, the card and the netlist to " + out);
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

    /**
     * KS-Z6, an invented 6.2 V zener diode of the same invented bench, measured over the whole junction: forward
     * I-V, leakage and breakdown at three temperatures and C-V (AC analysis at 1 MHz) at two, all from one ngspice
     * deck; reverse-recovery records from the charge-control relation trr = TT ln(1 + IF/|IR|) (Kingston,
     * "Switching time in junction diodes and junction transistors", Proc. IRE 42 (1954) 829-834; citation
     * recalled), which is what the fit's recovery term assumes.
     */
    static final class Zener {
        /** SPICE model name of the invented KS-Z6. */
        static final String MODEL_NAME = "KSZ6";
        /** The card's TT as written on it [s]. */
        static final String TRANSIT_TIME_TEXT = "4e-8";
        static final double TRANSIT_TIME = Double.parseDouble(TRANSIT_TIME_TEXT);
        /**
         * The generating card (invented). IS/N and ISR/NR: forward diffusion and recombination current (the
         * latter larger below about 0.5 uA at 25 degC); RS: series resistance, seen at the top of both the forward
         * and the breakdown sweep; BV/IBV/NBV: 6.2 V at 0.5 mA with a soft knee; TCV in the ngspice sign,
         * BV(T) = BV - TCV (T - TNOM), so -2.2 mV/K raises the breakdown voltage by 2.2 mV/K; CJO/VJ/M: depletion
         * capacitance; TT: transit time; EG/XTI: the silicon temperature law (SPICE defaults). TNOM 27 degC.
         */
        static final String PARAMETERS = "IS=3e-15 N=1.01 RS=1.5 ISR=2e-11 NR=1.9 BV=6.2 IBV=5e-4 NBV=3"
                + " TCV=-2.2e-3 CJO=1.6e-10 VJ=0.8 M=0.38 TT=" + TRANSIT_TIME_TEXT + " EG=1.11 XTI=3";
        static final String CARD = ".model " + MODEL_NAME + " D(" + PARAMETERS + ")";

        /** Device temperatures of the forward, leakage and breakdown sweeps [degC]. */
        static final int[] DC_TEMPERATURES = {-20, 25, 85};
        /** Device temperatures of the C-V sweeps [degC]. */
        static final int[] CV_TEMPERATURES = {25, 85};
        /** Reverse voltages forced on the cathode for the leakage points [V] (written as negative anode voltages). */
        static final String LEAKAGE_VOLTAGES = "0.5 1 2";
        /** Reverse currents forced into the cathode, 1-2-5 steps [A] (written as negative anode currents). */
        static final String BREAKDOWN_CURRENTS = "1e-05 2e-05 5e-05 1e-04 2e-04 5e-04 1e-03 2e-03 5e-03 1e-02 2e-02 5e-02";
        /** Bias of the C-V readings, a little forward bias first [V]. */
        static final String CV_BIASES = "0.3 0.2 0.1 0 -0.25 -0.5 -0.75 -1 -1.5 -2 -2.5 -3 -4 -5";
        /** Test frequency of the C-V readings [Hz]. */
        static final String CV_FREQUENCY_TEXT = "1e6";
        static final double CV_FREQUENCY = Double.parseDouble(CV_FREQUENCY_TEXT);
        /** Recovery conditions {IF, IR} [A]: forward current before switching, reverse current during recovery. */
        static final double[][] RECOVERY_CONDITIONS = {
            {5e-3, -5e-3}, {20e-3, -2e-3}, {10e-3, -20e-3}, {50e-3, -10e-3}, {2e-3, -1e-3}};
        static final int RECOVERY_TEMPERATURE = 25;

        /** Breakdown voltage noise, 1 sigma, as a fraction of the reading [1]. */
        static final double BREAKDOWN_VOLTAGE_FRACTION = 2e-4;
        /** Capacitance noise, 1 sigma: fraction of the reading [1] plus an offset [F], added linearly. */
        static final double CAPACITANCE_NOISE_FRACTION = 5e-3;
        static final double CAPACITANCE_NOISE_OFFSET = 20e-15;
        /** Recovery-time noise, 1 sigma, as a fraction of the value [1]. */
        static final double RECOVERY_NOISE_FRACTION = 1e-2;
        /** Seed of file k is SEED_BASE + k: forward 1-3, reverse 4-6 (-20, 25, 85 degC), C-V 7-8, recovery 9. */
        static final long SEED_BASE = 7200;

        private Zener() {
        }

        /** Writes the KS-Z6 files into {@code out}; returns the number of CSV files. */
        static int make(String ngspice, String version, Path work, Path out) throws IOException, InterruptedException {
            String netlist = netlist();
            runNgspice(ngspice, netlist, work);
            long seed = SEED_BASE + 1;
            int files = 0;
            for (int t : DC_TEMPERATURES) {
                List<Point> points = readForward(work.resolve("zfwd_T" + t + ".dat"));
                StringBuilder b = header(forwardScenario(t), seed, version, FORWARD_NOISE);
                b.append("V [V],I [A],T [degC]\n");
                Random random = new Random(seed++);
                for (Point p : points) {
                    b.append(ivRow(random, p, VOLTAGE_NOISE_OFFSET, VOLTAGE_NOISE_FRACTION, t));
                }
                write(out.resolve("ksz6-forward-" + temperatureName(t) + ".csv"), b.toString());
                files++;
            }
            for (int t : DC_TEMPERATURES) {
                List<Point> leakage = readLeakage(work.resolve("zlk_T" + t + ".dat"));
                List<Point> breakdown = readBreakdown(work.resolve("zbrk_T" + t + ".dat"));
                StringBuilder b = header(reverseScenario(t), seed, version, REVERSE_NOISE);
                b.append("V [V],I [A],T [degC]\n");
                Random random = new Random(seed++);
                for (Point p : leakage) {
                    b.append(ivRow(random, p, VOLTAGE_NOISE_OFFSET, VOLTAGE_NOISE_FRACTION, t));
                }
                for (Point p : breakdown) {
                    b.append(ivRow(random, p, 0.0, BREAKDOWN_VOLTAGE_FRACTION, t));
                }
                write(out.resolve("ksz6-reverse-" + temperatureName(t) + ".csv"), b.toString());
                files++;
            }
            for (int t : CV_TEMPERATURES) {
                List<double[]> rows = readCv(work.resolve("zcv_T" + t + ".dat"));
                StringBuilder b = header(cvScenario(t), seed, version, CV_NOISE);
                b.append("V [V],C [pF],T [degC]\n");
                Random random = new Random(seed++);
                for (double[] r : rows) {
                    double sigma = CAPACITANCE_NOISE_FRACTION * r[1] + CAPACITANCE_NOISE_OFFSET;
                    double c = r[1] + sigma * random.nextGaussian();
                    b.append(String.format(Locale.ROOT, "%.3f,%.5f,%.1f\n", r[0], c * 1e12, (double) t));
                }
                write(out.resolve("ksz6-cv-" + temperatureName(t) + ".csv"), b.toString());
                files++;
            }
            StringBuilder b = header(recoveryScenario(), seed, version, RECOVERY_NOISE);
            b.append("IF [mA],IR [mA],trr [ns],T [degC]\n");
            Random random = new Random(seed);
            for (double[] c : RECOVERY_CONDITIONS) {
                double trr = recoveryTime(c[0], c[1]) * (1.0 + RECOVERY_NOISE_FRACTION * random.nextGaussian());
                b.append(String.format(Locale.ROOT, "%.1f,%.1f,%.4f,%.1f\n", c[0] * 1e3, c[1] * 1e3, trr * 1e9,
                        (double) RECOVERY_TEMPERATURE));
            }
            write(out.resolve("ksz6-recovery-" + temperatureName(RECOVERY_TEMPERATURE) + ".csv"), b.toString());
            files++;
            write(out.resolve("ksz6-generating-card.lib"), card(version));
            write(out.resolve("ksz6-generating-netlist.cir"), netlist);
            return files;
        }

        /** The charge-control recovery time of the card (Kingston 1954, see the class comment) [s]. */
        static double recoveryTime(double forwardCurrent, double reverseCurrent) {
            return TRANSIT_TIME * Math.log(1.0 + forwardCurrent / Math.abs(reverseCurrent));
        }

        /**
         * The ngspice deck. D1: forward current forced as 10^V(x) (diode-model.md section 11(a)). D2: breakdown
         * current forced into the cathode by I2, one operating point per current. D3: leakage, voltage forced on
         * the cathode by V3. D4: C-V, AC analysis at each bias, C = -Im(I(V4))/(2 pi f) (section 11(c)).
         * Vx rests at -9 so that the operating points force only 1 nA through D1.
         */
        static String netlist() {
            String n = "\n";
            return "* KS-Z6 invented 6.2 V zener diode: demo data deck for ngspice 39 (made by " + TOOL + ")" + n
                    + "* Invented demo data, not a measurement." + n
                    + "* Forward: current forced as 10^V(x) into the anode of D1, 1 nA .. 100 mA, 8 points/decade." + n
                    + "* Breakdown: current forced into the cathode of D2, 10 uA .. 50 mA in 1-2-5 steps." + n
                    + "* Leakage: voltage forced on the cathode of D3." + n
                    + "* C-V: AC analysis of D4 at " + CV_FREQUENCY_TEXT + " Hz, C = -Im(I(V4))/(2 pi f)." + n
                    + "Vx x 0 -9" + n
                    + "B1 0 a I = pwr(10, V(x))" + n
                    + "D1 a 0 " + MODEL_NAME + n
                    + "I2 0 k DC 0" + n
                    + "D2 0 k " + MODEL_NAME + n
                    + "V3 r 0 0" + n
                    + "D3 0 r " + MODEL_NAME + n
                    + "V4 c 0 DC 0 AC 1" + n
                    + "D4 c 0 " + MODEL_NAME + n
                    + CARD + n
                    + ".options reltol=1e-7 vntol=1e-10 abstol=1e-16" + n
                    + ".control" + n
                    + "set wr_singlescale" + n
                    + "set wr_vecnames" + n
                    + "option numdgt=12" + n
                    + "save v(a) @d1[vd] @d1[id] v(k) @d2[vd] @d2[id] v(r) @d3[vd] @d3[id] v4#branch" + n
                    + "foreach t " + join(DC_TEMPERATURES) + n
                    + "  option temp=$t" + n
                    + "  dc Vx " + fmt(FIRST_EXPONENT) + " " + fmt(LAST_EXPONENT) + " " + fmt(EXPONENT_STEP) + n
                    + "  wrdata zfwd_T{$t}.dat v(a) @d1[vd] @d1[id]" + n
                    + "end" + n
                    + "unset wr_vecnames" + n
                    + "set appendwrite" + n
                    + "foreach t " + join(DC_TEMPERATURES) + n
                    + "  option temp=$t" + n
                    + "  foreach vr " + LEAKAGE_VOLTAGES + n
                    + "    alter V3 dc = $vr" + n
                    + "    op" + n
                    + "    wrdata zlk_T{$t}.dat v(r) @d3[vd] @d3[id]" + n
                    + "  end" + n
                    + "  alter V3 dc = 0" + n
                    + "  foreach ir " + BREAKDOWN_CURRENTS + n
                    + "    alter I2 dc = $ir" + n
                    + "    op" + n
                    + "    wrdata zbrk_T{$t}.dat v(k) @d2[vd] @d2[id]" + n
                    + "  end" + n
                    + "  alter I2 dc = 0" + n
                    + "end" + n
                    + "foreach t " + join(CV_TEMPERATURES) + n
                    + "  option temp=$t" + n
                    + "  foreach vb " + CV_BIASES + n
                    + "    alter V4 dc = $vb" + n
                    + "    ac lin 1 " + CV_FREQUENCY_TEXT + " " + CV_FREQUENCY_TEXT + n
                    + "    let vbias = $vb" + n
                    + "    let cap = -imag(i(v4)) / (2*pi*real(frequency))" + n
                    + "    wrdata zcv_T{$t}.dat vbias cap" + n
                    + "  end" + n
                    + "end" + n
                    + "quit" + n
                    + ".endc" + n
                    + ".end" + n;
        }

        /** op rows "scale v(r) vd id": the anode voltage is -v(r); one row per forced voltage. */
        static List<Point> readLeakage(Path file) throws IOException {
            String[] forced = LEAKAGE_VOLTAGES.split(" ");
            List<double[]> rows = readRows(file, 4, false);
            if (rows.size() != forced.length) {
                fail(file.getFileName() + ": " + rows.size() + " rows, expected " + forced.length);
            }
            List<Point> points = new ArrayList<>();
            for (double[] row : rows) {
                points.add(new Point(-row[1], row[3]));
            }
            return points;
        }

        /** op rows "scale v(k) vd id": the anode voltage is -v(k); id must be minus the forced current. */
        static List<Point> readBreakdown(Path file) throws IOException {
            String[] forced = BREAKDOWN_CURRENTS.split(" ");
            List<double[]> rows = readRows(file, 4, false);
            if (rows.size() != forced.length) {
                fail(file.getFileName() + ": " + rows.size() + " rows, expected " + forced.length);
            }
            List<Point> points = new ArrayList<>();
            for (int i = 0; i < rows.size(); i++) {
                double current = Double.parseDouble(forced[i]);
                double[] row = rows.get(i);
                if (Math.abs(row[3] + current) > FORCED_CURRENT_TOLERANCE * current) {
                    fail(file.getFileName() + " row " + (i + 1) + ": diode current " + row[3] + " A differs from the forced -"
                            + current + " A by more than " + FORCED_CURRENT_TOLERANCE + " relative");
                }
                points.add(new Point(-row[1], row[3]));
            }
            return points;
        }

        /** ac rows "frequency vbias cap": returns {bias [V], capacitance [F]}; the bias must be the one set. */
        static List<double[]> readCv(Path file) throws IOException {
            String[] biases = CV_BIASES.split(" ");
            List<double[]> rows = readRows(file, 3, false);
            if (rows.size() != biases.length) {
                fail(file.getFileName() + ": " + rows.size() + " rows, expected " + biases.length);
            }
            List<double[]> out = new ArrayList<>();
            for (int i = 0; i < rows.size(); i++) {
                double[] row = rows.get(i);
                if (row[0] != CV_FREQUENCY || row[1] != Double.parseDouble(biases[i]) || !(row[2] > 0)) {
                    fail(file.getFileName() + " row " + (i + 1) + ": expected " + CV_FREQUENCY + " Hz, bias "
                            + biases[i] + " V and a positive capacitance, got " + java.util.Arrays.toString(row));
                }
                out.add(new double[] {row[1], row[2]});
            }
            return out;
        }

        /** One I-V row: one draw for the voltage (offset [V] + fraction [1] of reading), then one for the current. */
        static String ivRow(Random random, Point p, double voltageOffset, double voltageFraction, int celsius) {
            double voltageSigma = voltageOffset + voltageFraction * Math.abs(p.voltage());
            double voltage = p.voltage() + voltageSigma * random.nextGaussian();
            double current = p.current() * (1.0 + CURRENT_NOISE_FRACTION * random.nextGaussian());
            return String.format(Locale.ROOT, "%.7f,%.6e,%.1f\n", voltage, current, (double) celsius);
        }

        static final String BENCH = "on the\n#   invented Kestrel Street test bench";
        static final String PART = "the KS-Z6, an invented 6.2 V silicon zener diode, ";

        static final String FORWARD_NOISE = "# Noise added, Gaussian, 1 sigma: voltage 0.15 mV + 0.02 % of reading (added linearly),\n"
                + "#   current 0.1 % of reading; per row one draw for the voltage, then one for the current.\n";
        static final String REVERSE_NOISE = "# Noise added, Gaussian, 1 sigma: leakage rows (the first "
                + LEAKAGE_VOLTAGES.split(" ").length + ") voltage 0.15 mV + 0.02 % of\n"
                + "#   reading (added linearly); breakdown rows voltage 0.02 % of reading; every row current 0.1 % of\n"
                + "#   reading; per row one draw for the voltage, then one for the current.\n";
        static final String CV_NOISE = "# Noise added, Gaussian, 1 sigma: capacitance 0.5 % of reading + 20 fF (added linearly),\n"
                + "#   one draw per row; the bias is the set value, without noise.\n";
        static final String RECOVERY_NOISE = "# Noise added, Gaussian, 1 sigma: trr 1 % of the value, one draw per row; IF and IR are the\n"
                + "#   set values, without noise.\n";

        static String forwardScenario(int celsius) {
            return "# Scenario: forward I-V of " + PART + BENCH + ": a source-measure unit forces the current\n"
                    + "#   from 1 nA to 100 mA, 8 points per decade, and reads the voltage; device held at " + celsius
                    + " degC.\n";
        }

        static String reverseScenario(int celsius) {
            return "# Scenario: reverse leakage and breakdown of " + PART + BENCH + ", device held at " + celsius
                    + " degC.\n"
                    + "#   Leakage: a source-measure unit forces the anode voltage to -0.5, -1 and -2 V and reads the\n"
                    + "#   current (IS(T) plus the GMIN = 1e-12 S conductance ngspice puts across every junction).\n"
                    + "#   Breakdown: it forces the reverse current from 10 uA to 50 mA in 1-2-5 steps (written as\n"
                    + "#   negative anode currents) and reads the voltage.\n";
        }

        static String cvScenario(int celsius) {
            return "# Scenario: C-V of " + PART + BENCH + ": an LCR meter at 1 MHz, 1 V AC in the simulation,\n"
                    + "#   reads the parallel capacitance -Im(I)/(2 pi f) at biases from +0.3 V to -5 V; device at "
                    + celsius + " degC.\n";
        }

        static String recoveryScenario() {
            return "# Scenario: reverse recovery of " + PART + BENCH + ": the diode carries the forward current\n"
                    + "#   IF, is switched to the reverse current IR (negative) and the recovery time trr is read;\n"
                    + "#   device at " + RECOVERY_TEMPERATURE + " degC.\n";
        }

        static StringBuilder header(String scenario, long seed, String version, String noise) {
            StringBuilder b = new StringBuilder();
            b.append("# Invented demo data, not a measurement.\n");
            b.append(scenario);
            if (noise.equals(RECOVERY_NOISE)) {
                b.append("# Generated from the charge-control relation trr = TT ln(1 + IF/|IR|) (Kingston, Proc. IRE 42\n"
                        + "#   (1954) 829-834) with the TT of this card (not simulated; " + version
                        + " made the card's other files):\n");
            } else {
                b.append("# Generated by simulating this card in " + version + " (wrdata, 12 digits):\n");
            }
            b.append("#   ").append(CARD).append("\n");
            if (noise.equals(RECOVERY_NOISE)) {
                b.append("#   (TT = " + TRANSIT_TIME_TEXT + " s; the netlist of the other files: ksz6-generating-netlist.cir)\n");
            } else {
                b.append("#   (.options reltol=1e-7 vntol=1e-10 abstol=1e-16; netlist: ksz6-generating-netlist.cir)\n");
            }
            b.append(noise);
            b.append("# java.util.Random seed ").append(seed).append(".\n");
            b.append("# Made by " + TOOL + "; regenerate with: " + REGENERATE + "\n");
            return b;
        }

        static String card(String version) {
            return "* KS-Z6: an invented 6.2 V silicon zener diode (not a real part).\n"
                    + "* This is the card that generated the invented demo data in fixtures/demo/ksz6-*.csv\n"
                    + "* (simulated in " + version + ", recovery times from TT ln(1 + IF/|IR|), then seeded noise\n"
                    + "* added; see README.md there).\n"
                    + "* Made by " + TOOL + "; regenerate with: " + REGENERATE + "\n"
                    + CARD + "\n";
        }
    }
}
