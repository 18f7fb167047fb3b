/*
 * Makes the invented lot in fixtures/lot/: 24 parts of one invented switching diode type, the LT-1, whose
 * (log10 IS, N, RS) are drawn from a stated multivariate normal distribution (seeded java.util.Random), each part
 * simulated in ngspice 39 (forward I-V at 25 degC, 1 uA to 50 mA, 4 points a decade), with seeded Gaussian noise of
 * 0.2 mV on each voltage; one part carries a deliberate fault (RS four times the lot's), so that the lot command
 * has an outlier to name. Everything goes into one long table with a part column, plus the generating cards and
 * the netlist of the first part as it ran.
 *
 * Run from the repository root (JDK 17+ and ngspice 39 needed, nothing else):
 *
 *     java verify/tools/MakeLot.java [--out DIR] [--ngspice PATH] [--any-version]
 *
 * The output is byte-stable for one ngspice version (fixed seed, Locale.ROOT, "\n" line ends). The data are
 * invented, not a measurement, and say so in their header.
 */

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.concurrent.TimeUnit;

public final class MakeLot {
    static final String TOOL = "verify/tools/MakeLot.java";
    static final String EXPECTED_VERSION = "ngspice-39";
    static final int PARTS = 24;
    static final long SEED = 1313;
    /** Stated means of log10 IS [log10 A], N [1], RS [ohm]. */
    static final double[] MEAN = {-14.3, 1.03, 0.9};
    /** Stated standard deviations, same order. */
    static final double[] STD = {0.1, 0.01, 0.08};
    /** Stated correlations, same order. */
    static final double[][] CORRELATION = {{1, 0.7, -0.2}, {0.7, 1, -0.1}, {-0.2, -0.1, 1}};
    /** The faulty part (1-based) and its RS factor. */
    static final int FAULTY = 17;
    static final double FAULT_FACTOR = 4;
    static final double NOISE = 2e-4;
    static final long TIMEOUT_SECONDS = 120;

    public static void main(String[] args) throws Exception {
        Path out = Path.of("fixtures/lot");
        String ngspice = System.getenv().getOrDefault("CARDWRIGHT_NGSPICE", "ngspice");
        boolean anyVersion = false;
        for (int i = 0; i < args.length; i++) {
            switch (args[i]) {
                case "--out" -> out = Path.of(args[++i]);
                case "--ngspice" -> ngspice = args[++i];
                case "--any-version" -> anyVersion = true;
                default -> throw new IllegalArgumentException("usage: java " + TOOL + " [--out DIR] [--ngspice PATH] [--any-version]");
            }
        }
        String version = version(ngspice);
        if (!anyVersion && !version.equals(EXPECTED_VERSION)) {
            throw new IllegalStateException("found " + version + ", expected " + EXPECTED_VERSION + " (pass --any-version to accept it)");
        }
        Files.createDirectories(out);
        Random rnd = new Random(SEED);
        double[][] l = cholesky(CORRELATION);
        List<Double> currents = new ArrayList<>();
        for (int k = 0; ; k++) {
            double i = 1e-6 * Math.pow(10, k / 4.0);
            if (i > 5.01e-2) {
                break;
            }
            currents.add(Double.parseDouble(String.format(Locale.ROOT, "%.4g", i)));
        }
        StringBuilder table = new StringBuilder();
        table.append("# Invented demo data, not a measurement: a lot of 24 parts of the LT-1, an invented switching diode.\n");
        table.append("# Each part's log10 IS, N and RS drawn from a multivariate normal: means -14.3, 1.03, 0.9 ohm; std 0.1, 0.01, 0.08 ohm;\n");
        table.append("#   correlations IS-N 0.7, IS-RS -0.2, N-RS -0.1 (java.util.Random seed 1313); part LT1-17 has RS four times too high.\n");
        table.append("# Simulated in " + version + " (forward current forced from 1 uA to 50 mA, 4 points a decade, 25 degC),\n");
        table.append("#   then Gaussian noise of 0.2 mV added to each voltage. Cards: generating-cards.lib; netlist of the first part: generating-netlist.cir.\n");
        table.append("# Made by " + TOOL + "; regenerate with: java " + TOOL + " (from the repository root; needs ngspice 39)\n");
        table.append("part,V [V],I [A],T [degC]\n");
        StringBuilder cards = new StringBuilder("* Invented generating cards of the LT-1 lot (" + TOOL + "), not a real part\n");
        for (int p = 1; p <= PARTS; p++) {
            double[] z = {rnd.nextGaussian(), rnd.nextGaussian(), rnd.nextGaussian()};
            double[] theta = new double[3];
            for (int i = 0; i < 3; i++) {
                double s = 0;
                for (int j = 0; j <= i; j++) {
                    s += l[i][j] * z[j];
                }
                theta[i] = MEAN[i] + STD[i] * s;
            }
            if (p == FAULTY) {
                theta[2] *= FAULT_FACTOR;
            }
            String name = String.format(Locale.ROOT, "LT1-%02d", p);
            String card = String.format(Locale.ROOT, ".model LT1P D(IS=%.6e N=%.6f RS=%.6f)", Math.pow(10, theta[0]), theta[1], theta[2]);
            cards.append("* part ").append(name).append('\n').append(card.replace("LT1P", "LT1P" + p)).append('\n');
            StringBuilder deck = new StringBuilder("* " + name + " forward sweep (invented part, " + TOOL + ")\n");
            deck.append(card).append('\n');
            deck.append(".options reltol=1e-7 vntol=1e-10 abstol=1e-16\n.temp 25\nI1 0 a DC 1u\nD1 a 0 LT1P\n.control\n");
            for (double i : currents) {
                deck.append(String.format(Locale.ROOT, "alter i1 dc = %s%nop%nlet vv = v(a)%necho ROW %s $&vv%n", Double.toString(i), Double.toString(i)));
            }
            deck.append("quit\n.endc\n.end\n");
            if (p == 1) {
                Files.writeString(out.resolve("generating-netlist.cir"), deck.toString(), StandardCharsets.UTF_8);
            }
            for (String line : run(ngspice, deck.toString())) {
                if (line.startsWith("ROW ")) {
                    String[] f = line.trim().split("\\s+");
                    double v = Double.parseDouble(f[2]) + NOISE * rnd.nextGaussian();
                    table.append(String.format(Locale.ROOT, "%s,%.5f,%s,25%n", name, v, f[1]));
                }
            }
        }
        Files.writeString(out.resolve("lt1-lot-forward.csv"), table.toString(), StandardCharsets.UTF_8);
        Files.writeString(out.resolve("generating-cards.lib"), cards.toString(), StandardCharsets.UTF_8);
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
                l[i][j] = i == j ? Math.sqrt(s) : s / l[j][j];
            }
        }
        return l;
    }

    static String version(String ngspice) throws IOException, InterruptedException {
        Process p = new ProcessBuilder(ngspice, "-v").redirectErrorStream(true).start();
        String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS);
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("ngspice-\\d+").matcher(text);
        return m.find() ? m.group() : "unknown";
    }

    static List<String> run(String ngspice, String deck) throws IOException, InterruptedException {
        Path file = Files.createTempFile("makelot-", ".cir");
        try {
            Files.writeString(file, deck, StandardCharsets.UTF_8);
            Process p = new ProcessBuilder(ngspice, "-b", file.toString()).redirectErrorStream(true).start();
            String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
            if (!p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS) || p.exitValue() != 0) {
                throw new IllegalStateException("ngspice failed: " + text);
            }
            return List.of(text.split("\n"));
        } finally {
            Files.deleteIfExists(file);
        }
    }
}
