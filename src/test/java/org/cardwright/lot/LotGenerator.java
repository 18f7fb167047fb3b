package org.cardwright.lot;

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
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.JunctionCapacitance;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * An invented lot of our own, for tests and benchmarks: parts drawn from a stated multivariate normal distribution
 * of (log10 IS, N, RS, log10 CJO) with VJ = 0.7 V, M = 0.4, EG and XTI at their silicon defaults; a few
 * deliberate outliers; two unreadable files. Each part is simulated with the built-in engine (the ngspice 39
 * equations, which it matches to about 1e-8 relative; see the sim and model tests against ngspice), at 25 degC:
 * forward I-V from 1 nA to 50 mA, 5 points a decade, and (optionally) C-V from -10 V to +0.2 V at 1 MHz; then
 * seeded Gaussian noise is added: 0.1 mV on each forward voltage, 0.2 % on each capacitance.
 *
 * <p>The normal parts' parameters are moment-matched: the standard normal draws are centred and whitened so that
 * their sample mean is exactly 0 and their sample covariance exactly the identity before the stated Cholesky factor
 * colours them. The lot's own parameters therefore have exactly the stated means and correlations, and a test
 * compares what the fits and statistics recover with the stated numbers without the luck of the draw.
 */
final class LotGenerator {
    /** Stated means: log10 IS [log10 A], N [1], RS [ohm], log10 CJO [log10 F]. */
    static final double[] MEAN = {-14.0, 1.04, 0.6, Math.log10(3e-12)};
    /** Stated standard deviations, same order. */
    static final double[] STD = {0.12, 0.012, 0.06, 0.03};
    /** Stated correlation matrix, same order. */
    static final double[][] CORRELATION = {
        {1.0, 0.8, -0.3, 0.4},
        {0.8, 1.0, -0.2, 0.3},
        {-0.3, -0.2, 1.0, 0.0},
        {0.4, 0.3, 0.0, 1.0}};
    /** Same order as the arrays. */
    static final Param[] PARAMS = {Param.IS, Param.N, Param.RS, Param.CJO};
    /** Forward-voltage noise, 1 sigma [V]. */
    static final double VOLTAGE_NOISE = 1e-4;
    /** Capacitance noise, 1 sigma, relative [1]. */
    static final double CAPACITANCE_NOISE = 2e-3;
    static final double KELVIN_25C = 298.15;

    /**
     * What was generated.
     *
     * @param normal     names of the parts drawn from the distribution
     * @param outliers   names of the deliberate outliers
     * @param unreadable names of the unreadable files' parts
     * @param truth      every readable part's generating parameters
     */
    record Lot(List<String> normal, List<String> outliers, List<String> unreadable, Map<String, DiodeParameters> truth) {
    }

    private LotGenerator() {
    }

    /**
     * Writes a lot of {@code normal} parts plus the deliberate outliers and two unreadable files into {@code dir}: one
     * sub-folder per part holding forward.csv (and cv.csv when {@code withCv}), simulated with the built-in engine.
     */
    static Lot write(Path dir, int normal, long seed, boolean withCv, boolean withBad) throws IOException {
        return write(dir, normal, seed, withCv, withBad, null);
    }

    /**
     * As {@link #write(Path, int, long, boolean, boolean)}, but every part is simulated in ngspice ({@code ngspice}
     * the executable; null for the built-in engine): all parts in one deck, written beside the lot folder as
     * {@code DIR.generating.cir}, tight tolerances. The noise is drawn in the same order either way.
     */
    static Lot write(Path dir, int normal, long seed, boolean withCv, boolean withBad, Path ngspice) throws IOException {
        Random rnd = new Random(seed);
        Files.createDirectories(dir);
        double[][] z = momentMatched(normal, rnd);
        double[][] l = cholesky(CORRELATION);
        List<String> normalNames = new ArrayList<>();
        List<String> outlierNames = new ArrayList<>();
        Map<String, DiodeParameters> truth = new java.util.LinkedHashMap<>();
        int width = Integer.toString(normal + 10).length();
        List<double[]> thetas = new ArrayList<>();
        for (int k = 0; k < normal; k++) {
            double[] theta = new double[4];
            for (int i = 0; i < 4; i++) {
                double s = 0;
                for (int j = 0; j <= i; j++) {
                    s += l[i][j] * z[k][j];
                }
                theta[i] = MEAN[i] + STD[i] * s;
            }
            thetas.add(theta);
        }
        // deliberate outliers: RS four times too high (a bad bond), twice; N far too high (a damaged junction); IS ten times too high
        List<double[]> wild = new ArrayList<>();
        if (withBad) {
            wild.add(new double[] {MEAN[0], MEAN[1], 4 * MEAN[2], MEAN[3]});
            wild.add(new double[] {MEAN[0] + 0.05, MEAN[1], 4.2 * MEAN[2], MEAN[3]});
            wild.add(new double[] {MEAN[0], 1.25, MEAN[2], MEAN[3]});
            wild.add(new double[] {MEAN[0] + 1.0, MEAN[1], MEAN[2], MEAN[3]});
        }
        // part names interleave the outliers with the rest, so that sorting does not group them
        int total = normal + wild.size();
        int every = wild.isEmpty() ? Integer.MAX_VALUE : total / wild.size();
        int w = 0;
        int n = 0;
        for (int idx = 0; idx < total; idx++) {
            String name = String.format(Locale.ROOT, "P%0" + width + "d", idx + 1);
            double[] theta;
            if (w < wild.size() && idx % every == every / 2) {
                theta = wild.get(w++);
                outlierNames.add(name);
            } else {
                theta = thetas.get(n++);
                normalNames.add(name);
            }
            truth.put(name, parameters(theta));
        }
        Curves curves = ngspice == null ? builtIn(truth, withCv)
                : NgspiceLot.simulate(ngspice, truth, CURRENTS, withCv ? BIASES : new double[0], CV_FREQUENCY,
                        dir.resolveSibling(dir.getFileName() + ".generating.cir"));
        String engine = ngspice == null ? "built-in engine = ngspice 39 equations" : "simulated in ngspice, tolerances reltol=1e-7 vntol=1e-10 abstol=1e-16";
        for (String name : truth.keySet()) {
            writePart(dir.resolve(name), name, curves.forward().get(name), withCv ? curves.capacitance().get(name) : null, rnd, engine);
        }
        List<String> bad = new ArrayList<>();
        if (withBad) {
            String b1 = String.format(Locale.ROOT, "P%0" + width + "d", total + 1);
            String b2 = String.format(Locale.ROOT, "P%0" + width + "d", total + 2);
            Files.writeString(dir.resolve(b1 + ".csv"), "# invented test data: an unreadable file (a cell that is not a number)\nV,I,T\n0.5,1e-6,25\n0.6,one milliamp,25\n",
                    StandardCharsets.UTF_8);
            Files.write(dir.resolve(b2 + ".csv"), new byte[] {0, 1, 2, (byte) 0xff, (byte) 0xfe, 10, 0, 0});
            bad.add(b1);
            bad.add(b2);
        }
        return new Lot(normalNames, outlierNames, bad, truth);
    }

    /** Forward currents of every part: 1 nA to 50 mA, 5 points a decade [A]. */
    static final double[] CURRENTS = currents();
    /** C-V biases [V]. */
    static final double[] BIASES = {-10, -7, -5, -3, -2, -1.5, -1, -0.7, -0.5, -0.3, -0.2, -0.1, 0, 0.1, 0.2};
    /** C-V measurement frequency [Hz]. */
    static final double CV_FREQUENCY = 1e6;

    private static double[] currents() {
        List<Double> out = new ArrayList<>();
        for (int k = 0; k <= 5 * 7 + 3; k++) {
            double i = 1e-9 * Math.pow(10, k / 5.0);
            if (i > 5.01e-2) {
                break;
            }
            out.add(Double.parseDouble(String.format(Locale.ROOT, "%.6e", i)));
        }
        return out.stream().mapToDouble(Double::doubleValue).toArray();
    }

    /**
     * Noise-free curves by part: forward voltages at {@link #CURRENTS}, capacitances at {@link #BIASES}.
     *
     * @param forward     part name to voltages [V]
     * @param capacitance part name to capacitances [F] (empty without C-V)
     */
    record Curves(Map<String, double[]> forward, Map<String, double[]> capacitance) {
    }

    private static Curves builtIn(Map<String, DiodeParameters> truth, boolean withCv) {
        Map<String, double[]> f = new java.util.LinkedHashMap<>();
        Map<String, double[]> c = new java.util.LinkedHashMap<>();
        for (var e : truth.entrySet()) {
            DiodeAtTemperature d = TemperatureLaws.at(e.getValue(), KELVIN_25C, SimulatorOptions.NGSPICE_DEFAULTS);
            double[] v = new double[CURRENTS.length];
            for (int k = 0; k < v.length; k++) {
                v[k] = DiodeSolver.voltageAtCurrent(d, CURRENTS[k]);
            }
            f.put(e.getKey(), v);
            if (withCv) {
                double[] cap = new double[BIASES.length];
                for (int k = 0; k < cap.length; k++) {
                    cap[k] = JunctionCapacitance.terminalParallel(d, BIASES[k], CV_FREQUENCY);
                }
                c.put(e.getKey(), cap);
            }
        }
        return new Curves(f, c);
    }

    private static void writePart(Path folder, String name, double[] voltages, double[] capacitances, Random rnd, String engine) throws IOException {
        Files.createDirectories(folder);
        StringBuilder f = new StringBuilder();
        f.append("# Invented test data, not a measurement: part ").append(name)
                .append(" of an invented lot (LotGenerator, ").append(engine).append(", seeded noise)\n");
        f.append(DISTRIBUTION);
        f.append("V [V],I [A],T [degC]\n");
        for (int k = 0; k < CURRENTS.length; k++) {
            double v = voltages[k] + VOLTAGE_NOISE * rnd.nextGaussian();
            f.append(String.format(Locale.ROOT, "%.7f,%.6e,25.0%n", v, CURRENTS[k]));
        }
        Files.writeString(folder.resolve("forward.csv"), f.toString(), StandardCharsets.UTF_8);
        if (capacitances != null) {
            StringBuilder c = new StringBuilder();
            c.append("# Invented test data, not a measurement: C-V of part ").append(name).append(" at 1 MHz (").append(engine).append(")\n");
            c.append(DISTRIBUTION);
            c.append("V [V],C [F],T [degC]\n");
            for (int k = 0; k < BIASES.length; k++) {
                double cap = capacitances[k] * (1 + CAPACITANCE_NOISE * rnd.nextGaussian());
                c.append(String.format(Locale.ROOT, "%.2f,%.6e,25.0%n", BIASES[k], cap));
            }
            Files.writeString(folder.resolve("cv.csv"), c.toString(), StandardCharsets.UTF_8);
        }
    }

    /** The generating distribution, as every part file states it in its header. */
    static final String DISTRIBUTION = String.format(Locale.ROOT,
            "# Generating distribution (multivariate normal, moment-matched): log10 IS, N, RS [ohm], log10 CJO with means %s,%n"
                    + "#   standard deviations %s, correlations %s; VJ 0.7 V, M 0.4; noise %.2g V on V, %.2g relative on C.%n"
                    + "#   Deliberate outliers: RS x4 (twice), N at 1.25, IS x10.%n",
            java.util.Arrays.toString(MEAN), java.util.Arrays.toString(STD), java.util.Arrays.deepToString(CORRELATION),
            VOLTAGE_NOISE, CAPACITANCE_NOISE);

    static DiodeParameters parameters(double[] theta) {
        Map<Param, Double> m = new EnumMap<>(Param.class);
        m.put(Param.IS, Math.pow(10, theta[0]));
        m.put(Param.N, theta[1]);
        m.put(Param.RS, theta[2]);
        m.put(Param.CJO, Math.pow(10, theta[3]));
        m.put(Param.VJ, 0.7);
        m.put(Param.M, 0.4);
        return DiodeParameters.of(m);
    }

    /** n standard normal 4-vectors, centred and whitened so that their sample mean is 0 and covariance the identity. */
    static double[][] momentMatched(int n, Random rnd) {
        double[][] z = new double[n][4];
        for (double[] row : z) {
            for (int i = 0; i < 4; i++) {
                row[i] = rnd.nextGaussian();
            }
        }
        double[] mean = new double[4];
        for (double[] row : z) {
            for (int i = 0; i < 4; i++) {
                mean[i] += row[i] / n;
            }
        }
        double[][] cov = new double[4][4];
        for (double[] row : z) {
            for (int i = 0; i < 4; i++) {
                row[i] -= mean[i];
            }
            for (int i = 0; i < 4; i++) {
                for (int j = 0; j < 4; j++) {
                    cov[i][j] += row[i] * row[j] / (n - 1);
                }
            }
        }
        double[][] lc = cholesky(cov);
        double[][] out = new double[n][4];
        for (int k = 0; k < n; k++) {
            // solve L y = z (forward substitution): y has identity sample covariance
            for (int i = 0; i < 4; i++) {
                double s = z[k][i];
                for (int j = 0; j < i; j++) {
                    s -= lc[i][j] * out[k][j];
                }
                out[k][i] = s / lc[i][i];
            }
        }
        return out;
    }

    static double[][] cholesky(double[][] a) {
        int n = a.length;
        double[][] l = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double s = a[i][j];
                for (int k = 0; k < j; k++) {
                    s -= l[i][k] * l[j][k];
                }
                if (i == j) {
                    if (!(s > 0)) {
                        throw new IllegalArgumentException("matrix is not positive definite");
                    }
                    l[i][i] = Math.sqrt(s);
                } else {
                    l[i][j] = s / l[j][j];
                }
            }
        }
        return l;
    }
}
