/*
 * Makes the invented test corpus in fixtures/corpus/: eighteen invented parts of the invented "Larkspur Yard
 * qualification lab", across every device kind cardwright fits (signal and rectifier silicon, Schottky,
 * germanium, LED, zener and avalanche from 3.3 V to 1.1 kV, a transistor's base-emitter junction), simulated
 * in ngspice 39 at tight tolerances. Each part gets its own folder with its generating card, the deck exactly
 * as it ran, a part.properties file of its truth (card, shunt resistor, fixture stray, what the data show),
 * the noisy data files (forward.csv, reverse.csv, cv.csv) and their noise-free twins in noisefree/.
 * See fixtures/corpus/README.md.
 *
 * Run from the repository root (JDK 17+ and ngspice 39 needed, nothing else):
 *
 *     java verify/tools/MakeCorpus.java [--out DIR] [--ngspice PATH] [--any-version] [--keep-work]
 *
 * --keep-work leaves each part's ngspice work folder (decks, logs, raw wrdata output) for inspection.
 *
 * Every data row is its own operating point (or AC point), with the instance TEMP set to the row's logged
 * temperature, so a temperature that wanders from row to row is simulated at exactly the value written in the file. A
 * part with a parallel leakage path has the resistor across the diode's terminals in the deck; a part with
 * fixture stray capacitance has the capacitor across the terminals of its C-V instances.
 *
 * The output is byte-stable: the same ngspice version gives the same files every time (fixed seeds,
 * java.util.Random whose generators are specified by the JDK, Locale.ROOT number formats, "\n" line ends).
 * The files are invented corpus data, not a measurement, and say so in their header.
 */

import java.io.IOException;
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

public final class MakeCorpus {
    static final String TOOL = "verify/tools/MakeCorpus.java";
    static final String REGENERATE = "java " + TOOL + " (from the repository root; needs ngspice 39)";
    static final String EXPECTED_VERSION = "ngspice-39";
    static final String LAB = "the invented Larkspur Yard qualification lab";
    /** Solver options of every deck: tight, so that the simulated values are exact to far below the noise. */
    static final String OPTIONS = ".options reltol=1e-9 vntol=1e-9 abstol=1e-18 itl1=1000";
    /** C-V test frequency [Hz]. */
    static final double CV_FREQUENCY = 1e6;
    /** How long ngspice may run for one part [s]. */
    static final long TIMEOUT_SECONDS = 300;
    /** Half-width of a wandering chamber logger's reading around its set point [K]. */
    static final double WANDER = 0.15;
    /** Largest relative gap between a forced current and the diode's simulated current (no shunt) [1]. */
    static final double FORCED_CURRENT_TOLERANCE = 1e-6;

    /** Voltage noise of a reading: Gaussian sigma = offset + fraction * |V|, then optional 4.5-digit quantisation. */
    record VoltageNoise(double offset, double fraction, boolean fourAndHalfDigits, String text) {
    }

    /** Leakage-current noise: Gaussian sigma = fraction * |I| + floor [A]. */
    record CurrentNoise(double fraction, double floor, String text) {
    }

    /** Capacitance noise: Gaussian sigma = fraction * C + offset [F]. */
    record CapacitanceNoise(double fraction, double offset, String text) {
    }

    /**
     * One invented part.
     *
     * @param name          folder and lower-case name
     * @param model         SPICE model name
     * @param kind          the cardwright device kind it belongs to (fit --kind)
     * @param description   one line of what it is
     * @param parameters    the generating card's parameters
     * @param shunt         parallel resistor across the terminals [ohm], 0 for none
     * @param stray         fixture stray capacitance across the C-V terminals [F], 0 for none
     * @param wander        whether the logged temperatures wander from row to row
     * @param forwardTemps  forward set points [degC]
     * @param forwardRange  {first exponent, last exponent, points per decade} of the forced forward current
     * @param forwardNoise  forward voltage noise
     * @param reverseTemps  leakage and breakdown set points [degC]
     * @param leakageVolts  reverse voltages forced for the leakage rows (positive numbers) [V]
     * @param breakdownAmps reverse currents forced for the breakdown rows (positive numbers) [A]
     * @param leakageNoise  leakage current noise
     * @param breakdownNoise breakdown voltage noise
     * @param cvTemps       C-V set points [degC]
     * @param cvBiases      C-V biases [V]
     * @param cvNoise       capacitance noise
     * @param showsTt       whether the C-V data show the transit time (diffusion capacitance) above the noise
     * @param seed          seed base
     */
    record Part(String name, String model, String kind, String description, String parameters, double shunt,
            double stray, boolean wander, double[] forwardTemps, double[] forwardRange, VoltageNoise forwardNoise,
            double[] reverseTemps, double[] leakageVolts, double[] breakdownAmps, CurrentNoise leakageNoise,
            VoltageNoise breakdownNoise, double[] cvTemps, double[] cvBiases, CapacitanceNoise cvNoise,
            boolean showsTt, long seed) {

        String card() {
            return ".model " + model + " D(" + parameters + ")";
        }
    }

    static double[] d(double... values) {
        return values;
    }

    static final double[] NONE = {};
    static final String ONE_TWO_FIVE = "1-2-5";
    static final VoltageNoise BENCH_FORWARD = new VoltageNoise(0.1e-3, 5e-5, false,
            "voltage 0.1 mV + 0.005 % of reading (a 6.5-digit bench meter)");
    static final VoltageNoise METER_FORWARD = new VoltageNoise(0.05e-3, 2e-5, true,
            "voltage 0.05 mV + 0.002 % of reading, then rounded to a 4.5-digit meter's resolution (19999 counts on"
                    + " the 0.2/2/20/200 V ranges, 0.1 V on the 1000 V range)");
    static final VoltageNoise BENCH_BREAKDOWN = new VoltageNoise(0.5e-3, 5e-5, false,
            "voltage 0.5 mV + 0.005 % of reading (a 6.5-digit bench meter)");
    static final CurrentNoise LEAKAGE = new CurrentNoise(2e-3, 1e-13, "current 0.2 % of reading + 0.1 pA");
    static final CapacitanceNoise LCR = new CapacitanceNoise(1e-3, 2e-15, "capacitance 0.1 % of reading + 2 fF");

    static VoltageNoise jitter(double sigma) {
        return new VoltageNoise(sigma, 0, true, String.format(Locale.ROOT,
                "voltage jitter %.0f mV (Gaussian), then rounded to a 4.5-digit meter's resolution (19999 counts on"
                        + " the 0.2/2/20/200 V ranges, 0.1 V on the 1000 V range)", sigma * 1e3));
    }

    static double[] steps125(double first, double last) {
        List<Double> out = new ArrayList<>();
        double[] mant = {1, 2, 5};
        for (int e = -15; e <= 3; e++) {
            for (double m : mant) {
                double v = Double.parseDouble(String.format(Locale.ROOT, "%.0fe%d", m, e));
                if (v >= first * (1 - 1e-9) && v <= last * (1 + 1e-9)) {
                    out.add(v);
                }
            }
        }
        return out.stream().mapToDouble(Double::doubleValue).toArray();
    }

    static double[] linear(double from, double to, int n) {
        double[] out = new double[n];
        for (int i = 0; i < n; i++) {
            out[i] = Double.parseDouble(String.format(Locale.ROOT, "%.4f", from + (to - from) * i / (n - 1)));
        }
        return out;
    }

    static double[] logSpaced(double first, double last, int perDecade) {
        int n = (int) Math.round(Math.log10(last / first) * perDecade) + 1;
        double[] out = new double[n];
        for (int i = 0; i < n; i++) {
            out[i] = Double.parseDouble(String.format(Locale.ROOT, "%.4g",
                    first * Math.pow(10, (double) i / perDecade)));
        }
        return out;
    }

    /** The parts. Every value is invented; none is taken from a real device. */
    static List<Part> parts() {
        List<Part> p = new ArrayList<>();
        p.add(new Part("alder", "ALDER", "silicon-pn", "small-signal silicon switching diode, chamber logger wanders",
                "IS=2.2e-15 N=1.03 RS=0.6 ISR=4e-12 NR=2 IKF=0.08 CJO=1.8e-12 VJ=0.72 M=0.36 TT=4e-9 EG=1.11 XTI=3",
                0, 0.4e-12, true, d(-40, 25, 85, 125), d(-9, -1, 6), BENCH_FORWARD,
                d(25, 125), d(0.5, 1, 2, 5, 10, 20, 40), NONE, LEAKAGE, BENCH_BREAKDOWN,
                d(25, 85), linear(0.3, -10, 24), LCR, false, 8100));
        p.add(new Part("birch", "BIRCH", "led", "red LED-like junction: EG near 2 eV, N near 2, strong recombination (NR 3.4)",
                "IS=3e-21 N=1.9 RS=3.5 ISR=3e-14 NR=3.4 EG=1.95 XTI=3 CJO=3e-11 VJ=1.7 M=0.4",
                0, 0, true, d(-20, 25, 60, 85), d(-9, -1.5, 6), BENCH_FORWARD,
                d(25), d(1, 2, 3, 4, 5), NONE, LEAKAGE, BENCH_BREAKDOWN,
                d(25), linear(0.5, -5, 23), LCR, false, 8200));
        p.add(new Part("cedar", "CEDAR", "led", "green LED-like junction: EG 2.3 eV, N 2.1, recombination NR 3.8 below 0.1 mA",
                "IS=5e-26 N=2.1 RS=6 ISR=1e-16 NR=3.8 EG=2.3 XTI=3",
                0, 0, false, d(-20, 25, 85), d(-9, -1.5, 6), METER_FORWARD,
                NONE, NONE, NONE, LEAKAGE, BENCH_BREAKDOWN, NONE, NONE, LCR, false, 8300));
        p.add(new Part("dogwood", "DOGWOOD", "germanium", "germanium junction diode, large saturation current",
                "IS=1.2e-6 N=1.08 RS=1.5 EG=0.67 XTI=3 CJO=2.5e-12 VJ=0.3 M=0.5",
                0, 0, true, d(-20, 25, 60), d(-5, -1.3, 8), BENCH_FORWARD,
                d(25, 60), d(0.5, 1, 2, 5, 10, 20), NONE, LEAKAGE, BENCH_BREAKDOWN,
                NONE, NONE, LCR, false, 8400));
        p.add(new Part("elm", "ELM", "silicon-pn", "kilovolt rectifier, avalanche near 1.1 kV, diffusion capacitance at 0 V",
                "IS=4e-9 N=1.85 RS=0.045 IKF=0.9 BV=1100 IBV=5e-6 NBV=20 TCV=-0.9 CJO=1.5e-11 VJ=0.6 M=0.4 TT=5e-6 EG=1.11 XTI=3",
                0, 0, false, d(25, 75, 125), d(-6, 0, 6), METER_FORWARD,
                d(25, 75, 125), d(10, 100, 300, 600), steps125(1e-6, 1e-3), LEAKAGE, jitter(0.15),
                d(25), linear(0.2, -100, 26), LCR, true, 8500));
        p.add(new Part("fir", "FIR", "zener", "3.3 V zener with a soft tunnelling knee, BV falls with temperature",
                "IS=1e-14 N=1.05 RS=2 ISR=1e-11 NR=2 BV=3.3 IBV=5e-3 NBV=6 TCV=2e-3 CJO=3e-10 VJ=0.75 M=0.33 EG=1.11 XTI=3",
                0, 0, true, d(-20, 25, 85), d(-8, -1, 6), BENCH_FORWARD,
                d(-20, 25, 85), d(0.25, 0.5), steps125(1e-5, 2e-2), LEAKAGE, BENCH_BREAKDOWN,
                d(25), linear(0.2, -1.0, 13), LCR, false, 8600));
        p.add(new Part("gorse", "GORSE", "zener", "6.8 V avalanche zener, near-vertical knee read by a 4.5-digit meter",
                "IS=4e-15 N=1.02 RS=1.2 ISR=8e-12 NR=2 BV=6.8 IBV=1e-3 NBV=1.2 TCV=-3.5e-3 CJO=9e-11 VJ=0.8 M=0.35 EG=1.11 XTI=3",
                0, 0, true, d(-20, 25, 85), d(-8, -1, 6), METER_FORWARD,
                d(-20, 25, 85), d(1, 3), logSpaced(1e-6, 5e-2, 4), LEAKAGE, jitter(0.007),
                NONE, NONE, LCR, false, 8700));
        p.add(new Part("hazel", "HAZEL", "zener", "15 V zener on a precision bench, with C-V",
                "IS=2e-15 N=1.01 RS=3 ISR=5e-12 NR=2 BV=15 IBV=2e-3 NBV=1.5 TCV=-1.1e-2 CJO=6e-11 VJ=0.8 M=0.4 EG=1.11 XTI=3",
                0, 0, false, d(-40, 25, 125), d(-8, -1, 6), BENCH_FORWARD,
                d(-40, 25, 125), d(2, 5, 10), logSpaced(1e-5, 2e-2, 4), LEAKAGE, BENCH_BREAKDOWN,
                d(25, 125), linear(0.3, -12, 24), LCR, false, 8800));
        p.add(new Part("ivy", "IVY", "zener", "47 V avalanche diode, 4.5-digit meter on its 200 V range",
                "IS=1e-15 N=1.02 RS=8 BV=47 IBV=5e-4 NBV=1.8 TCV=-4.5e-2 CJO=2e-11 VJ=0.75 M=0.4 EG=1.11 XTI=3",
                0, 0, true, d(25, 85, 125), d(-8, -1.3, 6), METER_FORWARD,
                d(25, 85, 125), d(5, 20, 40), logSpaced(1e-6, 2e-2, 4), LEAKAGE, jitter(0.015),
                NONE, NONE, LCR, false, 8900));
        p.add(new Part("juniper", "JUNIPER", "silicon-pn", "leaky high-N 100 V junction up to 150 degC, diffusion capacitance at 0 V",
                "IS=2e-9 N=1.8 RS=0.8 BV=100 IBV=1e-4 NBV=3 TCV=-0.06 CJO=2e-10 VJ=0.7 M=0.4 TT=2e-6 EG=1.11 XTI=3",
                0, 0, true, d(25, 85, 125, 150), d(-8, -1, 6), BENCH_FORWARD,
                d(25, 85, 125, 150), d(1, 5, 20, 50, 80), logSpaced(2e-5, 2e-2, 4), LEAKAGE, jitter(0.010),
                d(25, 125, 150), linear(0.1, -20, 22), LCR, true, 9000));
        p.add(new Part("larch", "LARCH", "zener", "200 V avalanche diode, 6.5-digit bench meter",
                "IS=5e-15 N=1.04 RS=12 BV=200 IBV=5e-5 NBV=2.5 TCV=-0.18 CJO=8e-12 VJ=0.7 M=0.42 EG=1.11 XTI=3",
                0, 0, false, d(25, 100), d(-8, -1.5, 6), BENCH_FORWARD,
                d(25, 100), d(20, 100, 150), logSpaced(2e-6, 5e-3, 4), LEAKAGE, BENCH_BREAKDOWN,
                NONE, NONE, LCR, false, 9100));
        p.add(new Part("maple", "MAPLE", "silicon-pn", "small diode with a 150 kOhm surface-leakage path across it",
                "IS=1e-15 N=1.0 RS=1.2 ISR=5e-12 NR=2 EG=1.11 XTI=3",
                150e3, 0, true, d(25, 85), d(-8, -1.3, 8), BENCH_FORWARD,
                d(25, 85), d(0.1, 0.5, 1, 2, 5, 10, 20, 30), NONE, LEAKAGE, BENCH_BREAKDOWN,
                NONE, NONE, LCR, false, 9200));
        p.add(new Part("nettle", "NETTLE", "silicon-pn", "leaky rectifier with a 2 MOhm shunt, up to 150 degC",
                "IS=1e-10 N=1.6 RS=0.05 IKF=1.5 EG=1.11 XTI=3",
                2e6, 0, false, d(25, 100, 150), d(-7, 0, 6), BENCH_FORWARD,
                d(25, 100, 150), d(1, 10, 50, 100, 200, 400), NONE, LEAKAGE, BENCH_BREAKDOWN,
                NONE, NONE, LCR, false, 9300));
        p.add(new Part("oak", "OAK", "silicon-pn", "recombination-dominated junction (ISR above IS up to about 1 mA), with C-V",
                "IS=1e-16 N=1.0 RS=0.3 ISR=2e-10 NR=2 CJO=4e-11 VJ=0.7 M=0.5 EG=1.11 XTI=3",
                0, 0, true, d(-40, 25, 85, 125), d(-9, -1.5, 6), BENCH_FORWARD,
                NONE, NONE, NONE, LEAKAGE, BENCH_BREAKDOWN,
                d(25), linear(0.3, -5, 22), LCR, false, 9400));
        p.add(new Part("pine", "PINE", "base-emitter", "base-emitter-like junction: recombination factor with VJ 0.75, M 0.33; breakdown 6.3 V",
                "IS=4e-16 N=1.0 RS=8 ISR=6e-14 NR=1.9 VJ=0.75 M=0.33 BV=6.3 IBV=1e-5 NBV=2 TCV=-1.5e-3 EG=1.11 XTI=3",
                0, 0, false, d(-20, 25, 85), d(-10, -2, 6), BENCH_FORWARD,
                d(25, 85), d(1, 3), logSpaced(1e-6, 1e-3, 4), LEAKAGE, BENCH_BREAKDOWN,
                NONE, NONE, LCR, false, 9500));
        p.add(new Part("quince", "QUINCE", "schottky", "Schottky barrier rectifier, 45 V, large leakage at temperature",
                "IS=5e-8 N=1.04 RS=0.15 BV=45 IBV=1e-4 NBV=5 CJO=1.2e-10 VJ=0.45 M=0.5 EG=0.69 XTI=2",
                0, 0, true, d(-20, 25, 85, 125), d(-7, -0.5, 6), BENCH_FORWARD,
                d(25, 85), d(1, 5, 10, 20, 30), steps125(2e-4, 1e-2), LEAKAGE, BENCH_BREAKDOWN,
                d(25), linear(0.2, -20, 23), LCR, false, 9600));
        p.add(new Part("rowan", "ROWAN", "silicon-pn", "0.3 pF RF diode on a fixture with 0.5 pF stray, 0.02 pF meter noise",
                "IS=5e-15 N=1.05 RS=3 CJO=3e-13 VJ=0.65 M=0.4 EG=1.11 XTI=3",
                0, 0.5e-12, true, d(25, 85), d(-8, -2, 6), BENCH_FORWARD,
                NONE, NONE, NONE, LEAKAGE, BENCH_BREAKDOWN,
                d(25, 85, 125), linear(0.2, -20, 41), new CapacitanceNoise(0, 0.02e-12, "capacitance 0.02 pF"),
                false, 9700));
        p.add(new Part("willow", "WILLOW", "silicon-pn", "3 A rectifier with high injection, 4.5-digit meter",
                "IS=2e-12 N=1.3 RS=0.012 IKF=2 ISR=1e-9 NR=2.2 CJO=3e-10 VJ=0.5 M=0.45 EG=1.11 XTI=3",
                0, 0, true, d(-40, 25, 85, 150), d(-6, 0.5, 6), METER_FORWARD,
                d(25, 150), d(5, 50, 200), NONE, LEAKAGE, BENCH_BREAKDOWN,
                NONE, NONE, LCR, false, 9800));
        return p;
    }

    record Row(String kind, double setPoint, double temperature, double forced, String node) {
    }

    public static void main(String[] args) throws Exception {
        try {
            run(args);
        } catch (Failure e) {
            System.err.println("MakeCorpus: " + e.getMessage());
            System.exit(2);
        }
    }

    static void run(String[] args) throws Exception {
        Path out = Path.of("fixtures", "corpus");
        String ngspice = System.getenv().getOrDefault("CARDWRIGHT_NGSPICE", "ngspice");
        boolean anyVersion = false;
        boolean keepWork = false;
        for (int i = 0; i < args.length; i++) {
            switch (args[i]) {
                case "--out" -> out = Path.of(value(args, ++i, "--out"));
                case "--ngspice" -> ngspice = value(args, ++i, "--ngspice");
                case "--any-version" -> anyVersion = true;
                case "--keep-work" -> keepWork = true;
                default -> fail("unknown argument '" + args[i] + "'; usage: java " + TOOL
                        + " [--out DIR] [--ngspice PATH] [--any-version] [--keep-work]");
            }
        }
        Path parent = out.toAbsolutePath().getParent();
        if (parent == null || !Files.isDirectory(parent)) {
            fail("output parent folder " + parent + " does not exist; run from the repository root or give --out");
        }
        String version = ngspiceVersion(ngspice);
        if (!version.equals(EXPECTED_VERSION) && !anyVersion) {
            fail(ngspice + " is " + version + ", the committed data came from " + EXPECTED_VERSION
                    + "; pass --any-version to write data from it anyway");
        }
        for (Part part : parts()) {
            Path work = Files.createTempDirectory("cardwright-corpus-");
            try {
                make(part, ngspice, version, work, out.resolve(part.name()));
            } catch (Failure e) {
                throw new Failure(part.name() + ": " + e.getMessage());
            } finally {
                if (keepWork) {
                    System.err.println(part.name() + ": work folder kept: " + work);
                } else {
                    try (Stream<Path> paths = Files.walk(work)) {
                        for (Path p : paths.sorted(Comparator.reverseOrder()).toList()) {
                            Files.deleteIfExists(p);
                        }
                    }
                }
            }
        }
    }

    static void make(Part part, String ngspice, String version, Path work, Path dir) throws Exception {
        Random temperatures = new Random(part.seed());
        List<Row> forward = new ArrayList<>();
        double[] fr = part.forwardRange();
        for (double t : part.forwardTemps()) {
            int n = (int) Math.round((fr[1] - fr[0]) * fr[2]) + 1;
            for (int i = 0; i < n; i++) {
                double current = Double.parseDouble(String.format(Locale.ROOT, "%.6e",
                        Math.pow(10, fr[0] + i / fr[2])));
                forward.add(new Row("F", t, logged(t, part.wander(), temperatures), current, "f" + (forward.size() + 1)));
            }
        }
        List<Row> leakage = new ArrayList<>();
        List<Row> breakdown = new ArrayList<>();
        for (double t : part.reverseTemps()) {
            for (double v : part.leakageVolts()) {
                leakage.add(new Row("L", t, logged(t, part.wander(), temperatures), v, "l" + (leakage.size() + 1)));
            }
            for (double a : part.breakdownAmps()) {
                breakdown.add(new Row("B", t, logged(t, part.wander(), temperatures), a, "b" + (breakdown.size() + 1)));
            }
        }
        List<Row> cv = new ArrayList<>();
        for (double t : part.cvTemps()) {
            for (double v : part.cvBiases()) {
                cv.add(new Row("C", t, logged(t, part.wander(), temperatures), v, "c" + (cv.size() + 1)));
            }
        }
        List<Row> empty = List.of();
        String[] deckNames = {"forward", "leakage", "breakdown", "cv"};
        String[] decks = {
            netlist(part, forward, empty, empty, empty),
            netlist(part, empty, leakage, empty, empty),
            netlist(part, empty, empty, breakdown, empty),
            netlist(part, empty, empty, empty, cv)};
        int[] sizes = {forward.size(), leakage.size(), breakdown.size(), cv.size()};
        for (int k = 0; k < decks.length; k++) {
            if (sizes[k] > 0) {
                runNgspice(ngspice, decks[k], work);
            }
        }
        Files.createDirectories(dir.resolve("noisefree"));
        double[] fwd = inRowOrder(readValues(work.resolve("fwd.dat"), forward.size()), order(forward));
        double[] fwdCheck = part.shunt() > 0 ? null
                : inRowOrder(readValues(work.resolve("fwdid.dat"), forward.size()), order(forward));
        for (int i = 0; fwdCheck != null && i < forward.size(); i++) {
            double forced = forward.get(i).forced();
            if (Math.abs(fwdCheck[i] - forced) > FORCED_CURRENT_TOLERANCE * forced) {
                fail(part.name() + ": forward row " + (i + 1) + " diode current " + fwdCheck[i] + " differs from "
                        + forced);
            }
        }
        double[] lk = inRowOrder(readValues(work.resolve("lk.dat"), leakage.size()), order(leakage));
        double[] bd = inRowOrder(readValues(work.resolve("bd.dat"), breakdown.size()), order(breakdown));
        double[] cap = inRowOrder(readValues(work.resolve("cv.dat"), cv.size()), order(cv));

        int files = 0;
        if (!forward.isEmpty()) {
            for (boolean noisy : new boolean[] {true, false}) {
                Random random = new Random(part.seed() + 1);
                StringBuilder b = header(part, version, "forward I-V: a source-measure unit forces the current from "
                        + current(forward.get(0).forced()) + " to " + current(forward.get(forward.size() - 1).forced())
                        + ", " + (int) fr[2] + " points per decade, and reads the voltage", noisy,
                        noisy ? "Noise added, Gaussian, 1 sigma: " + part.forwardNoise().text() + ";\n#   current 0.02 % of"
                                + " reading; per row one draw for the voltage, then one for the current."
                                : null, part.seed() + 1);
                b.append("V [V],I [A],T [degC]\n");
                for (int i = 0; i < forward.size(); i++) {
                    Row r = forward.get(i);
                    double v = fwd[i];
                    double current = r.forced();
                    if (noisy) {
                        v = noisyVoltage(random, v, part.forwardNoise());
                        current = current * (1 + 2e-4 * random.nextGaussian());
                        b.append(String.format(Locale.ROOT, "%.6f,%.6e,%.2f\n", v, current, r.temperature()));
                    } else {
                        b.append(String.format(Locale.ROOT, "%.10f,%.9e,%.2f\n", v, current, r.temperature()));
                    }
                }
                write(dir.resolve(noisy ? "forward.csv" : "noisefree/forward.csv"), b.toString());
                files++;
            }
        }
        if (!leakage.isEmpty() || !breakdown.isEmpty()) {
            for (boolean noisy : new boolean[] {true, false}) {
                Random random = new Random(part.seed() + 2);
                String what = "reverse I-V: leakage rows (a source-measure unit forces the anode voltage and reads the"
                        + " current)" + (breakdown.isEmpty() ? "" : ", then breakdown rows (it forces the reverse current,"
                        + " written negative, and reads the voltage)");
                String noise = noisy ? "Noise added, Gaussian, 1 sigma: leakage rows " + part.leakageNoise().text()
                        + (breakdown.isEmpty() ? "" : "; breakdown rows " + part.breakdownNoise().text()
                        + ", and current 0.02 % of reading") + "." : null;
                StringBuilder b = header(part, version, what, noisy, noise, part.seed() + 2);
                b.append("V [V],I [A],T [degC]\n");
                // rows in set-point order: the leakage rows of a set point, then its breakdown rows
                for (double t : part.reverseTemps()) {
                    for (int i = 0; i < leakage.size(); i++) {
                        Row r = leakage.get(i);
                        if (r.setPoint() != t) {
                            continue;
                        }
                        double current = -lk[i];
                        if (noisy) {
                            CurrentNoise n = part.leakageNoise();
                            current += (n.fraction() * Math.abs(current) + n.floor()) * random.nextGaussian();
                            b.append(String.format(Locale.ROOT, "%.4f,%.6e,%.2f\n", -r.forced(), current,
                                    r.temperature()));
                        } else {
                            b.append(String.format(Locale.ROOT, "%.4f,%.9e,%.2f\n", -r.forced(), current,
                                    r.temperature()));
                        }
                    }
                    for (int i = 0; i < breakdown.size(); i++) {
                        Row r = breakdown.get(i);
                        if (r.setPoint() != t) {
                            continue;
                        }
                        double v = -bd[i];
                        double current = -r.forced();
                        if (noisy) {
                            v = noisyVoltage(random, v, part.breakdownNoise());
                            current = current * (1 + 2e-4 * random.nextGaussian());
                            b.append(String.format(Locale.ROOT, "%.6f,%.6e,%.2f\n", v, current, r.temperature()));
                        } else {
                            b.append(String.format(Locale.ROOT, "%.10f,%.9e,%.2f\n", v, current, r.temperature()));
                        }
                    }
                }
                write(dir.resolve(noisy ? "reverse.csv" : "noisefree/reverse.csv"), b.toString());
                files++;
            }
        }
        if (!cv.isEmpty()) {
            for (boolean noisy : new boolean[] {true, false}) {
                Random random = new Random(part.seed() + 3);
                String what = "C-V: an LCR meter at 1 MHz (1 V AC in the simulation) reads the parallel capacitance"
                        + " -Im(I)/(2 pi f) at each bias" + (part.stray() > 0 ? String.format(Locale.ROOT,
                        ", fixture stray %.2f pF included", part.stray() * 1e12) : "");
                String noise = noisy ? "Noise added, Gaussian, 1 sigma: " + part.cvNoise().text() + "; the bias is"
                        + " the set value." : null;
                StringBuilder b = header(part, version, what, noisy, noise, part.seed() + 3);
                b.append("V [V],C [pF],T [degC]\n");
                for (int i = 0; i < cv.size(); i++) {
                    Row r = cv.get(i);
                    double c = cap[i];
                    if (!(c > 0)) {
                        fail(part.name() + ": C-V row " + (i + 1) + " capacitance " + c);
                    }
                    if (noisy) {
                        CapacitanceNoise n = part.cvNoise();
                        c += (n.fraction() * c + n.offset()) * random.nextGaussian();
                        b.append(String.format(Locale.ROOT, "%.4f,%.5f,%.2f\n", r.forced(), c * 1e12, r.temperature()));
                    } else {
                        b.append(String.format(Locale.ROOT, "%.4f,%.10f,%.2f\n", r.forced(), c * 1e12, r.temperature()));
                    }
                }
                write(dir.resolve(noisy ? "cv.csv" : "noisefree/cv.csv"), b.toString());
                files++;
            }
        }
        write(dir.resolve("generating-card.lib"), card(part, version));
        for (int k = 0; k < decks.length; k++) {
            if (sizes[k] > 0) {
                write(dir.resolve("generating-netlist-" + deckNames[k] + ".cir"), decks[k]);
            }
        }
        write(dir.resolve("part.properties"), properties(part));
        System.out.println(part.name() + ": wrote " + files + " data files, the card, the netlist and part.properties");
    }

    /** The logged temperature of one row: the set point, or the set point plus a wander of up to WANDER, 0.01 K. */
    static double logged(double setPoint, boolean wander, Random random) {
        if (!wander) {
            return setPoint;
        }
        double t = setPoint + WANDER * (2 * random.nextDouble() - 1);
        return Math.round(t * 100) / 100.0;
    }

    static double noisyVoltage(Random random, double v, VoltageNoise n) {
        double noisy = v + (n.offset() + n.fraction() * Math.abs(v)) * random.nextGaussian();
        return n.fourAndHalfDigits() ? quantise(noisy) : noisy;
    }

    /** Rounds a reading to a 4.5-digit meter's resolution on the smallest range that holds it. */
    static double quantise(double v) {
        double a = Math.abs(v);
        double resolution;
        if (a < 0.19999) {
            resolution = 1e-5;
        } else if (a < 1.9999) {
            resolution = 1e-4;
        } else if (a < 19.999) {
            resolution = 1e-3;
        } else if (a < 199.99) {
            resolution = 1e-2;
        } else {
            resolution = 1e-1;
        }
        return Math.round(v / resolution) * resolution;
    }

    static String current(double amps) {
        return String.format(Locale.ROOT, "%.3g A", amps);
    }

    static String temps(double[] ts) {
        StringBuilder b = new StringBuilder();
        for (double t : ts) {
            b.append(b.length() == 0 ? "" : ", ").append(String.format(Locale.ROOT, "%.0f", t));
        }
        return b.toString();
    }

    static StringBuilder header(Part part, String version, String what, boolean noisy, String noise, long seed) {
        StringBuilder b = new StringBuilder();
        b.append("# Invented corpus data, not a measurement.\n");
        b.append("# Scenario: ").append(what).append(", on the ").append(part.model()).append(" (")
                .append(part.description()).append("), an invented part of ").append(LAB).append(".\n");
        if (part.wander()) {
            b.append("#   T is the chamber logger's reading for each row: it wanders within +-0.15 degC of the set point.\n");
        } else {
            b.append("#   T is the chamber set point.\n");
        }
        b.append("# Generated by simulating this card in ").append(version)
                .append(", each row at its own T (instance TEMP), one operating point per row:\n");
        b.append("#   ").append(part.card()).append("\n");
        if (part.shunt() > 0) {
            b.append(String.format(Locale.ROOT, "#   with a %.6g ohm resistor across the terminals (a parallel leakage path)%n",
                    part.shunt()));
        }
        b.append("#   (" + OPTIONS + "; decks: generating-netlist-*.cir)\n");
        if (noisy) {
            b.append("# ").append(noise).append("\n");
            b.append("# java.util.Random seed ").append(seed).append(".\n");
        } else {
            b.append("# No noise added: these are the simulated values, the noise-free twin of the file of the same name\n#   one folder up.\n");
        }
        b.append("# Made by " + TOOL + "; regenerate with: " + REGENERATE + "\n");
        return b;
    }

    static String card(Part part, String version) {
        return "* " + part.model() + ": " + part.description() + ".\n"
                + "* An invented part of " + LAB + " (not a real part); the card that generated\n"
                + "* the invented corpus data in this folder (simulated in " + version + "; see ../README.md).\n"
                + (part.shunt() > 0 ? String.format(Locale.ROOT,
                        "* The data also carry a %.6g ohm resistor across the terminals (see generating-netlist-*.cir).%n",
                        part.shunt()) : "")
                + (part.stray() > 0 ? String.format(Locale.ROOT,
                        "* The C-V data also carry %.6g F of fixture stray across the terminals.%n", part.stray()) : "")
                + "* Made by " + TOOL + "; regenerate with: " + REGENERATE + "\n"
                + part.card() + "\n";
    }

    static String properties(Part part) {
        return "# Truth of the invented corpus part " + part.model() + " (made by " + TOOL + ").\n"
                + "name=" + part.model() + "\n"
                + "kind=" + part.kind() + "\n"
                + "description=" + part.description() + "\n"
                + "card=" + part.card() + "\n"
                + "shunt.ohm=" + fmt(part.shunt()) + "\n"
                + "stray.farad=" + fmt(part.stray()) + "\n"
                + "temperature.wanders=" + part.wander() + "\n"
                + "cv.shows.tt=" + part.showsTt() + "\n"
                + "breakdown=" + (part.breakdownAmps().length > 0) + "\n";
    }

    /** A value for the deck, every digit of the double (ngspice reads the E notation). */
    static String exact(double v) {
        return Double.toString(v);
    }

    static String fmt(double v) {
        return String.format(Locale.ROOT, "%.6g", v);
    }

    static String netlist(Part part, List<Row> forward, List<Row> leakage, List<Row> breakdown, List<Row> cv) {
        String n = "\n";
        String m = part.model();
        String shunt = part.shunt() > 0 ? fmt(part.shunt()) : null;
        StringBuilder b = new StringBuilder();
        b.append("* ").append(m).append(": invented corpus part, deck for ngspice 39 (made by ").append(TOOL).append(")").append(n);
        b.append("* Invented corpus data, not a measurement. One operating point (or AC point) per data row, with the").append(n);
        b.append("* instance TEMP set to the row's logged temperature; one deck per kind of data. DF: current forced into the anode by IF.").append(n);
        b.append("* DL: anode voltage forced by VL. DB: reverse current forced into the cathode by IB.").append(n);
        b.append("* DC: C-V, AC analysis at 1 MHz, C = -Im(I(VC))/(2 pi f).").append(n);
        if (!forward.isEmpty()) {
            b.append("IF 0 f DC 1e-9").append(n).append("DF f 0 ").append(m).append(n);
            if (shunt != null) {
                b.append("RF f 0 ").append(shunt).append(n);
            }
        }
        if (!leakage.isEmpty()) {
            b.append("VL l 0 DC 0").append(n).append("DL l 0 ").append(m).append(n);
            if (shunt != null) {
                b.append("RL l 0 ").append(shunt).append(n);
            }
        }
        if (!breakdown.isEmpty()) {
            b.append("IB 0 b DC 0").append(n).append("DB 0 b ").append(m).append(n);
            if (shunt != null) {
                b.append("RB b 0 ").append(shunt).append(n);
            }
        }
        if (!cv.isEmpty()) {
            b.append("VC c 0 DC 0 AC 1").append(n).append("DC c 0 ").append(m).append(n);
            if (part.stray() > 0) {
                b.append("CS c 0 ").append(fmt(part.stray())).append(n);
            }
            if (shunt != null) {
                b.append("RC c 0 ").append(shunt).append(n);
            }
        }
        b.append(part.card()).append(n);
        b.append(OPTIONS).append(n);
        b.append(".control").append(n);
        b.append("set wr_singlescale").append(n);
        b.append("option numdgt=15").append(n);
        b.append("set appendwrite").append(n);
        for (int k : order(forward)) {
            Row r = forward.get(k);
            b.append("alter @df[temp] = ").append(tfmt(r.temperature())).append(n);
            b.append("alter IF dc = ").append(exact(r.forced())).append(n);
            b.append("op").append(n);
            b.append("wrdata fwd.dat v(f)").append(n);
            if (shunt == null) {
                b.append("wrdata fwdid.dat @df[id]").append(n);
            }
        }
        for (int k : order(leakage)) {
            Row r = leakage.get(k);
            b.append("alter @dl[temp] = ").append(tfmt(r.temperature())).append(n);
            b.append("alter VL dc = ").append(exact(-r.forced())).append(n);
            b.append("op").append(n);
            b.append("wrdata lk.dat vl#branch").append(n);
        }
        for (int k : order(breakdown)) {
            Row r = breakdown.get(k);
            b.append("alter @db[temp] = ").append(tfmt(r.temperature())).append(n);
            b.append("alter IB dc = ").append(exact(r.forced())).append(n);
            b.append("op").append(n);
            b.append("wrdata bd.dat v(b)").append(n);
        }
        for (int k : order(cv)) {
            Row r = cv.get(k);
            b.append("alter @dc[temp] = ").append(tfmt(r.temperature())).append(n);
            b.append("alter VC dc = ").append(exact(r.forced())).append(n);
            b.append("ac lin 1 1e6 1e6").append(n);
            b.append("let cap = -imag(i(vc))/(2*pi*real(frequency))").append(n);
            b.append("wrdata cv.dat cap").append(n);
        }
        b.append("quit").append(n);
        b.append(".endc").append(n);
        b.append(".end").append(n);
        return b.toString();
    }

    /**
     * The order in which the deck visits the rows: set point by set point, every second set point backwards, so
     * that each operating point starts from a neighbouring solution (a jump from the top current of one set
     * point to the bottom of the next defeats Newton at these tolerances).
     */
    static int[] order(List<Row> rows) {
        List<Integer> out = new ArrayList<>();
        int start = 0;
        int group = 0;
        while (start < rows.size()) {
            int end = start;
            while (end < rows.size() && rows.get(end).setPoint() == rows.get(start).setPoint()) {
                end++;
            }
            for (int k = 0; k < end - start; k++) {
                out.add(group % 2 == 0 ? start + k : end - 1 - k);
            }
            start = end;
            group++;
        }
        return out.stream().mapToInt(Integer::intValue).toArray();
    }

    /** Values read in deck order, put back in row order. */
    static double[] inRowOrder(double[] simulated, int[] order) {
        double[] out = new double[simulated.length];
        for (int k = 0; k < order.length; k++) {
            out[order[k]] = simulated[k];
        }
        return out;
    }

    static String tfmt(double t) {
        return String.format(Locale.ROOT, "%.2f", t);
    }

    static double[] readValues(Path file, int expected) throws IOException {
        if (expected == 0) {
            return new double[0];
        }
        if (!Files.isRegularFile(file)) {
            fail("ngspice wrote no " + file.getFileName());
        }
        List<Double> values = new ArrayList<>();
        for (String line : Files.readAllLines(file, StandardCharsets.UTF_8)) {
            String s = line.trim();
            if (s.isEmpty()) {
                continue;
            }
            String[] f = s.split("\\s+");
            values.add(Double.parseDouble(f[f.length - 1]));
        }
        if (values.size() != expected) {
            fail(file.getFileName() + ": " + values.size() + " values, expected " + expected);
        }
        return values.stream().mapToDouble(Double::doubleValue).toArray();
    }

    static String value(String[] args, int i, String option) {
        if (i >= args.length) {
            fail(option + " needs a value");
        }
        return args[i];
    }

    /** Stops the run: the message is printed by main, after the work folder is deleted. */
    static void fail(String message) {
        throw new Failure(message);
    }

    static final class Failure extends RuntimeException {
        Failure(String message) {
            super(message);
        }
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
        write(work.resolve("corpus.cir"), netlist);
        Path log = work.resolve("ngspice.log");
        Process p = new ProcessBuilder(ngspice, "-b", "corpus.cir").directory(work.toFile())
                .redirectErrorStream(true).redirectOutput(log.toFile()).start();
        p.getOutputStream().close();
        if (!p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS)) {
            p.descendants().forEach(ProcessHandle::destroyForcibly);
            p.destroyForcibly();
            fail("ngspice did not finish within " + TIMEOUT_SECONDS + " s");
        }
        String text = Files.readString(log, StandardCharsets.UTF_8);
        for (String line : text.split("\\R")) {
            String s = line.trim().toLowerCase(Locale.ROOT);
            if (s.startsWith("error") || s.contains("unrecognized parameter") || s.startsWith("warning")
                    || s.contains("singular") || s.contains("failed") || s.contains("too many")) {
                fail("ngspice: " + line.trim());
            }
        }
        if (p.exitValue() != 0) {
            fail("ngspice exited with code " + p.exitValue());
        }
    }

    static void write(Path file, String text) throws IOException {
        Files.writeString(file, text, StandardCharsets.UTF_8);
    }
}
