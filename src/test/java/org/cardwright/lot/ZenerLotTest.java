package org.cardwright.lot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.cardwright.cli.Main;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * A zener lot: the datasheet table states VZ at IZ and its temperature coefficient, measured over the parts and
 * from their cards. Eight invented 6.2 V zeners (the KS-Z6 card of fixtures/demo with BV spread by 1 %, seed 6262)
 * are simulated in ngspice 39, forward I-V at 25 degC and breakdown (current forced 10 uA to 50 mA) at -20, 25
 * and 85 degC, with 0.02 % noise on each voltage; the lot's measured TC of VZ must match ngspice's own slope of the
 * generating cards.
 */
class ZenerLotTest {
    private static final int PARTS = 8;
    private static final double[] TEMPS = {-20, 25, 85};
    private static final double[] BREAKDOWN = {1e-5, 2e-5, 5e-5, 1e-4, 2e-4, 5e-4, 1e-3, 2e-3, 5e-3, 1e-2, 2e-2, 5e-2};
    /** Voltage noise, relative, 1 sigma [1]. */
    private static final double NOISE = 2e-4;
    /**
     * The lot's median measured TC against ngspice's median slope: each part's slope from three readings of 0.02 %
     * noise (1.2 mV) over 105 K scatters by about 0.012 mV/K; the median of eight, four times that [V/K].
     */
    private static final double TC_TOLERANCE = 5e-5;

    @Test
    void theDatasheetTableStatesVzAndItsTemperatureCoefficientMeasuredAndFromTheCards() throws Exception {
        Path ngspice = Simulators.requireNgspice();
        Path dir = Simulators.tempDir("zener-lot");
        Random rnd = new Random(6262);
        double[] bv = new double[PARTS];
        StringBuilder d = new StringBuilder("* invented zener lot (ZenerLotTest), every part in one deck\n");
        for (int k = 0; k < PARTS; k++) {
            bv[k] = 6.2 * (1 + 0.01 * rnd.nextGaussian());
            d.append(String.format(Locale.ROOT, ".model Z%d D(IS=3e-15 N=1.01 RS=1.5 ISR=2e-11 NR=1.9 BV=%.6f IBV=5e-4 NBV=3 TCV=-2.2e-3 EG=1.11 XTI=3)%n", k, bv[k]));
            d.append(String.format(Locale.ROOT, "B%d 0 a%d I=v(ctl)%nD%d a%d 0 Z%d%nBR%d 0 k%d I=v(ctr)%nDR%d 0 k%d Z%d%n", k, k, k, k, k, k, k, k, k, k));
        }
        d.append(".options reltol=1e-7 vntol=1e-10 abstol=1e-16\nVctl ctl 0 DC 1e-9\nVctr ctr 0 DC 1e-5\n.control\n");
        double[] forward = new double[29];
        for (int j = 0; j < forward.length; j++) {
            forward[j] = Double.parseDouble(String.format(Locale.ROOT, "%.4g", 1e-9 * Math.pow(10, j / 4.0)));
        }
        d.append("option temp=25\n");
        for (int j = 0; j < forward.length; j++) {
            d.append("alter vctl dc = ").append(forward[j]).append("\nop\n");
            for (int k = 0; k < PARTS; k++) {
                d.append("let vv = v(a").append(k).append(")\necho F ").append(j).append(' ').append(k).append(" $&vv\n");
            }
        }
        for (int t = 0; t < TEMPS.length; t++) {
            d.append("option temp=").append(TEMPS[t]).append('\n');
            for (int j = 0; j < BREAKDOWN.length; j++) {
                d.append("alter vctr dc = ").append(BREAKDOWN[j]).append("\nop\n");
                for (int k = 0; k < PARTS; k++) {
                    d.append("let vv = v(k").append(k).append(")\necho R ").append(t).append(' ').append(j).append(' ').append(k).append(" $&vv\n");
                }
            }
        }
        d.append("quit\n.endc\n.end\n");
        Path cir = dir.resolve("zener-lot.cir");
        Files.writeString(cir, d.toString(), StandardCharsets.US_ASCII);
        Process p = new ProcessBuilder(ngspice.toString(), "-b", cir.toString()).redirectError(dir.resolve("zener-lot.err").toFile()).start();
        String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(300, TimeUnit.SECONDS) && p.exitValue() == 0, text);
        double[][] vf = new double[PARTS][forward.length];
        double[][][] vz = new double[PARTS][TEMPS.length][BREAKDOWN.length];
        int rows = 0;
        for (String line : text.split("\n")) {
            String[] f = line.trim().split("\\s+");
            if (f.length == 4 && f[0].equals("F")) {
                vf[Integer.parseInt(f[2])][Integer.parseInt(f[1])] = Double.parseDouble(f[3]);
                rows++;
            } else if (f.length == 5 && f[0].equals("R")) {
                vz[Integer.parseInt(f[3])][Integer.parseInt(f[1])][Integer.parseInt(f[2])] = Math.abs(Double.parseDouble(f[4]));
                rows++;
            }
        }
        assertEquals(PARTS * (forward.length + TEMPS.length * BREAKDOWN.length), rows, text);
        Path parts = dir.resolve("parts");
        for (int k = 0; k < PARTS; k++) {
            Path folder = Files.createDirectories(parts.resolve(String.format(Locale.ROOT, "Z%02d", k + 1)));
            StringBuilder fw = new StringBuilder("# Invented test data, not a measurement: forward I-V of an invented zener (ngspice 39, noise added)\nV [V],I [A],T [degC]\n");
            for (int j = 0; j < forward.length; j++) {
                fw.append(String.format(Locale.ROOT, "%.7f,%s,25%n", vf[k][j] * (1 + NOISE * rnd.nextGaussian()), forward[j]));
            }
            Files.writeString(folder.resolve("forward.csv"), fw.toString(), StandardCharsets.UTF_8);
            StringBuilder rv = new StringBuilder("# Invented test data, not a measurement: breakdown of an invented zener (ngspice 39, noise added)\nV [V],I [A],T [degC]\n");
            for (int t = 0; t < TEMPS.length; t++) {
                for (int j = 0; j < BREAKDOWN.length; j++) {
                    rv.append(String.format(Locale.ROOT, "%.7f,%s,%s%n", -vz[k][t][j] * (1 + NOISE * rnd.nextGaussian()), -BREAKDOWN[j], TEMPS[t]));
                }
            }
            Files.writeString(folder.resolve("reverse.csv"), rv.toString(), StandardCharsets.UTF_8);
        }
        StringWriter out = new StringWriter();
        int code = Main.execute(new PrintWriter(out), new PrintWriter(out), "lot", parts.toString(), "--name", "ZL", "--out",
                dir.resolve("out").toString(), "--kind", "zener", "--at-iz", "1m", "--jobs", "2", "--no-progress");
        assertEquals(0, code, out.toString());
        JsonNode json = new ObjectMapper().readTree(dir.resolve("out/ZL.lot.json").toFile());
        JsonNode tc = null;
        JsonNode vzRow = null;
        for (JsonNode q : json.get("datasheet").get("quantities")) {
            if (q.get("quantity").asText().equals("TCVZ")) {
                tc = q;
            }
            if (q.get("quantity").asText().equals("VZ")) {
                vzRow = q;
            }
        }
        assertTrue(tc != null && vzRow != null, json.get("datasheet").toString());
        assertEquals(1e-3, tc.get("IZ").asDouble(), 0.0);
        // ngspice's slope of VZ at 1 mA (index 6) over the three temperatures, part by part
        double[] slopes = new double[PARTS];
        for (int k = 0; k < PARTS; k++) {
            double mt = Arrays.stream(TEMPS).average().orElseThrow();
            double mv = (vz[k][0][6] + vz[k][1][6] + vz[k][2][6]) / 3;
            double sxy = 0;
            double sxx = 0;
            for (int t = 0; t < 3; t++) {
                sxy += (TEMPS[t] - mt) * (vz[k][t][6] - mv);
                sxx += (TEMPS[t] - mt) * (TEMPS[t] - mt);
            }
            slopes[k] = sxy / sxx;
        }
        Arrays.sort(slopes);
        double ngspiceMedian = 0.5 * (slopes[PARTS / 2 - 1] + slopes[PARTS / 2]);
        JsonNode measured = tc.get("measured");
        JsonNode cards = tc.get("cards");
        String report = String.format(Locale.ROOT, "TC of VZ at 1 mA: measured min/typ/max %.4f/%.4f/%.4f mV/K (n %d), cards typ %.4f mV/K,"
                        + " ngspice median %.4f mV/K; VZ measured typ %.4f V, cards typ %.4f V", measured.get("min").asDouble() * 1e3,
                measured.get("typ").asDouble() * 1e3, measured.get("max").asDouble() * 1e3, measured.get("n").asInt(),
                cards.get("typ").asDouble() * 1e3, ngspiceMedian * 1e3, vzRow.get("measured").get("typ").asDouble(), vzRow.get("cards").get("typ").asDouble());
        System.out.println(report);
        assertEquals(json.get("inStatistics").asInt(), measured.get("n").asInt(), report);
        assertEquals(json.get("inStatistics").asInt(), cards.get("n").asInt(), report);
        assertEquals(ngspiceMedian, measured.get("typ").asDouble(), TC_TOLERANCE, report);
        assertEquals(ngspiceMedian, cards.get("typ").asDouble(), TC_TOLERANCE, report);
        assertTrue(tc.get("lotCards").has("typical"), tc.toString());
        String html = Files.readString(dir.resolve("out/ZL.lot.html"), StandardCharsets.UTF_8);
        assertTrue(html.contains("<td>TCVZ [V/K]</td>"), "the page's datasheet table has the TC row");
    }
}
