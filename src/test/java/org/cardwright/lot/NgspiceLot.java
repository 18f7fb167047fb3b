package org.cardwright.lot;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * Simulates every part of an invented lot in ngspice, all in one deck: part k is a diode {@code Dk} with its own
 * {@code .model Pk}, fed by a behavioural current source that copies one control voltage ({@code Bk 0 ak
 * I=v(ctl)}), so that one {@code alter} and one {@code op} per forward current solve every part at once; for C-V,
 * a second copy of each diode hangs on one bias source through a 0 V ammeter, and one small-signal analysis per bias
 * gives each part's terminal admittance, whose imaginary part over 2πf is the parallel capacitance a C-V meter
 * reads. Tight tolerances (reltol 1e-7, vntol 1e-10, abstol 1e-16). ngspice prints 6 significant digits: 1 µV on
 * a forward voltage, 1e-6 relative on C, far below the noise the generator adds.
 */
final class NgspiceLot {
    private static final long TIMEOUT_SECONDS = 300;

    private NgspiceLot() {
    }

    static LotGenerator.Curves simulate(Path ngspice, Map<String, DiodeParameters> parts, double[] currents, double[] biases, double frequency,
            Path deckFile) throws IOException {
        List<String> names = new ArrayList<>(parts.keySet());
        StringBuilder d = new StringBuilder("* invented lot, every part in one deck (test support: LotGenerator / NgspiceLot)\n");
        for (int k = 1; k <= names.size(); k++) {
            DiodeParameters p = parts.get(names.get(k - 1));
            d.append(String.format(Locale.ROOT, ".model P%d D(IS=%.9e N=%.9f RS=%.9f CJO=%.9e VJ=%.6f M=%.6f)%n", k, p.get(Param.IS), p.get(Param.N),
                    p.get(Param.RS), p.get(Param.CJO), p.get(Param.VJ), p.get(Param.M)));
        }
        d.append(".options reltol=1e-7 vntol=1e-10 abstol=1e-16\n.temp 25\nVctl ctl 0 DC 1e-9\n");
        for (int k = 1; k <= names.size(); k++) {
            d.append(String.format(Locale.ROOT, "B%d 0 a%d I=v(ctl)%nD%d a%d 0 P%d%n", k, k, k, k, k));
        }
        if (biases.length > 0) {
            d.append("Vb b 0 DC 0 AC 1\n");
            for (int k = 1; k <= names.size(); k++) {
                d.append(String.format(Locale.ROOT, "Vm%d b m%d DC 0%nDX%d m%d 0 P%d%n", k, k, k, k, k));
            }
        }
        d.append(".control\n");
        for (int j = 0; j < currents.length; j++) {
            d.append(String.format(Locale.ROOT, "alter vctl dc = %s%nop%n", Double.toString(currents[j])));
            for (int k = 1; k <= names.size(); k++) {
                d.append(String.format(Locale.ROOT, "let vv = v(a%d)%necho F %d %d $&vv%n", k, j, k));
            }
        }
        for (int j = 0; j < biases.length; j++) {
            d.append(String.format(Locale.ROOT, "alter vb dc = %s%nac lin 1 %s %s%n", Double.toString(biases[j]), Double.toString(frequency),
                    Double.toString(frequency)));
            for (int k = 1; k <= names.size(); k++) {
                d.append(String.format(Locale.ROOT, "let cc = imag(i(vm%d))/(2*pi*%s)%necho C %d %d $&cc%n", k, Double.toString(frequency), j, k));
            }
        }
        d.append("quit\n.endc\n.end\n");
        Files.writeString(deckFile, d.toString(), StandardCharsets.US_ASCII);
        double[][] v = new double[names.size()][currents.length];
        double[][] c = new double[names.size()][biases.length];
        boolean[][] seenV = new boolean[names.size()][currents.length];
        boolean[][] seenC = new boolean[names.size()][biases.length];
        for (String line : run(ngspice, deckFile)) {
            String[] f = line.trim().split("\\s+");
            if (f.length == 4 && (f[0].equals("F") || f[0].equals("C"))) {
                int j = Integer.parseInt(f[1]);
                int k = Integer.parseInt(f[2]) - 1;
                double x = Double.parseDouble(f[3]);
                if (f[0].equals("F")) {
                    v[k][j] = x;
                    seenV[k][j] = true;
                } else {
                    c[k][j] = x;
                    seenC[k][j] = true;
                }
            }
        }
        Map<String, double[]> forward = new LinkedHashMap<>();
        Map<String, double[]> cap = new LinkedHashMap<>();
        for (int k = 0; k < names.size(); k++) {
            for (int j = 0; j < currents.length; j++) {
                if (!seenV[k][j]) {
                    throw new IllegalStateException("ngspice gave no forward voltage for part " + names.get(k) + " at " + currents[j] + " A");
                }
            }
            for (int j = 0; j < biases.length; j++) {
                if (!seenC[k][j]) {
                    throw new IllegalStateException("ngspice gave no capacitance for part " + names.get(k) + " at " + biases[j] + " V");
                }
            }
            forward.put(names.get(k), v[k]);
            cap.put(names.get(k), c[k]);
        }
        return new LotGenerator.Curves(forward, cap);
    }

    private static List<String> run(Path ngspice, Path deck) throws IOException {
        // ngspice's progress lines go to stderr and would split the rows on stdout; keep them apart
        Path errors = deck.resolveSibling(deck.getFileName() + ".stderr");
        Process p = new ProcessBuilder(ngspice.toString(), "-b", deck.toString()).redirectError(errors.toFile()).start();
        String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        try {
            if (!p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS) || p.exitValue() != 0) {
                p.destroyForcibly();
                throw new IllegalStateException("ngspice failed on " + deck + ": " + Files.readString(errors, StandardCharsets.UTF_8));
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException("interrupted", e);
        }
        return List.of(text.split("\n"));
    }
}
