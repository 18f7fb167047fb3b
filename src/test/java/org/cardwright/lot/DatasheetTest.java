package org.cardwright.lot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.cardwright.data.ReadOptions;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.testsupport.Simulators;
import org.cardwright.workflow.Inputs;
import org.junit.jupiter.api.Test;

/**
 * VZ at IZ and its temperature coefficient, measured on the invented zener KS-Z6's breakdown data (fixtures/demo:
 * simulated in ngspice 39 at -20, 25 and 85 degC from a stated card, with 0.02 % noise on each voltage) and computed
 * from that card, both against ngspice 39 run here on the same card.
 */
class DatasheetTest {
    /** Breakdown current of the check, inside the data's 10 uA .. 50 mA sweep [A]. */
    private static final double IZ = 1e-3;
    /** 25 degC [K]. */
    private static final double ROOM = 298.15;
    /**
     * Measured TC against ngspice's slope of the noise-free VZ: 0.02 % of 6 V is 1.2 mV per reading; a slope
     * over 105 K from three readings scatters by about 0.012 mV/K; four of those [V/K].
     */
    private static final double MEASURED_TC_TOLERANCE = 5e-5;
    /** Measured VZ against ngspice's noise-free VZ at 25 degC: about three times the 1.2 mV reading noise [V]. */
    private static final double MEASURED_VZ_TOLERANCE = 4e-3;
    /**
     * The card's VZ by the built-in engine against ngspice 39's for the same card: the same equations, but ngspice
     * echoes 6 significant digits, 10 uV at 6 V [V].
     */
    private static final double ENGINE_AGREEMENT = 1e-5;
    /** The same for the TC: the printed digits over the 50 K difference [V/K]. */
    private static final double ENGINE_TC_AGREEMENT = 1e-6;

    @Test
    void theTemperatureCoefficientOfVzIsMeasuredAndComputedAsNgspiceGivesIt() throws Exception {
        Path ngspice = Simulators.requireNgspice();
        Path demo = Simulators.projectDir().resolve("fixtures/demo");
        Inputs in = Inputs.read(List.of(demo.resolve("ksz6-reverse-minus20C.csv"), demo.resolve("ksz6-reverse-25C.csv"),
                demo.resolve("ksz6-reverse-85C.csv")), ReadOptions.defaults());
        Map<Datasheet.Quantity, Double> at = Map.of(Datasheet.Quantity.VZ, IZ, Datasheet.Quantity.TCVZ, IZ);
        Map<Datasheet.Quantity, Double> measured = Datasheet.measured(in, at, ROOM);

        // the generating card as the fixture's header states it
        Map<Param, Double> m = new EnumMap<>(Param.class);
        m.put(Param.IS, 3e-15);
        m.put(Param.N, 1.01);
        m.put(Param.RS, 1.5);
        m.put(Param.ISR, 2e-11);
        m.put(Param.NR, 1.9);
        m.put(Param.BV, 6.2);
        m.put(Param.IBV, 5e-4);
        m.put(Param.NBV, 3.0);
        m.put(Param.TCV, -2.2e-3);
        m.put(Param.EG, 1.11);
        m.put(Param.XTI, 3.0);
        DiodeParameters card = DiodeParameters.of(m);
        Map<Datasheet.Quantity, Double> fromCard = Datasheet.ofCard(card, at, ROOM);

        double[] temps = {-20, 25, 85, 25 - Datasheet.TC_HALF_SPAN, 25 + Datasheet.TC_HALF_SPAN};
        double[] vz = ngspiceVz(ngspice, temps);
        double slope = slope(new double[] {-20, 25, 85}, new double[] {vz[0], vz[1], vz[2]});
        double central = (vz[4] - vz[3]) / (2 * Datasheet.TC_HALF_SPAN);
        String report = String.format(Locale.ROOT, "VZ at 1 mA: measured %.5f V, card %.6f V, ngspice %.6f V; TC measured %.4f mV/K,"
                + " ngspice slope over the readings' temperatures %.4f mV/K; card %.5f mV/K, ngspice central %.5f mV/K",
                measured.get(Datasheet.Quantity.VZ), fromCard.get(Datasheet.Quantity.VZ), vz[1], measured.get(Datasheet.Quantity.TCVZ) * 1e3,
                slope * 1e3, fromCard.get(Datasheet.Quantity.TCVZ) * 1e3, central * 1e3);
        System.out.println(report);
        assertEquals(vz[1], measured.get(Datasheet.Quantity.VZ), MEASURED_VZ_TOLERANCE, report);
        assertEquals(slope, measured.get(Datasheet.Quantity.TCVZ), MEASURED_TC_TOLERANCE, report);
        assertEquals(vz[1], fromCard.get(Datasheet.Quantity.VZ), ENGINE_AGREEMENT, report);
        assertEquals(central, fromCard.get(Datasheet.Quantity.TCVZ), ENGINE_TC_AGREEMENT, report);
    }

    @Test
    void oneTemperatureGivesNoCoefficient() throws Exception {
        Path demo = Simulators.projectDir().resolve("fixtures/demo");
        Inputs in = Inputs.read(List.of(demo.resolve("ksz6-reverse-25C.csv")), ReadOptions.defaults());
        Map<Datasheet.Quantity, Double> measured = Datasheet.measured(in, Map.of(Datasheet.Quantity.VZ, IZ, Datasheet.Quantity.TCVZ, IZ), ROOM);
        assertTrue(measured.containsKey(Datasheet.Quantity.VZ));
        assertTrue(!measured.containsKey(Datasheet.Quantity.TCVZ), measured.toString());
    }

    /** |V| of the card at -IZ (current forced into the cathode) at each temperature [degC], in ngspice 39. */
    private static double[] ngspiceVz(Path ngspice, double[] temps) throws Exception {
        Path dir = Simulators.tempDir("datasheet-tc");
        StringBuilder d = new StringBuilder("* VZ of the KS-Z6 generating card at IZ (invented part)\n");
        d.append(".model KSZ6 D(IS=3e-15 N=1.01 RS=1.5 ISR=2e-11 NR=1.9 BV=6.2 IBV=5e-4 NBV=3 TCV=-2.2e-3 EG=1.11 XTI=3)\n");
        d.append(".options reltol=1e-7 vntol=1e-10 abstol=1e-16\nI2 0 k DC ").append(IZ).append("\nD2 0 k KSZ6\n.control\n");
        for (int i = 0; i < temps.length; i++) {
            d.append("option temp=").append(temps[i]).append("\nop\nlet vv = v(k)\necho VZ ").append(i).append(" $&vv\n");
        }
        d.append("quit\n.endc\n.end\n");
        Path cir = dir.resolve("vz.cir");
        Files.writeString(cir, d.toString(), StandardCharsets.US_ASCII);
        Process p = new ProcessBuilder(ngspice.toString(), "-b", cir.toString()).redirectError(dir.resolve("vz.err").toFile()).start();
        String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(120, TimeUnit.SECONDS) && p.exitValue() == 0, text);
        double[] out = new double[temps.length];
        List<Integer> seen = new ArrayList<>();
        for (String line : text.split("\n")) {
            String[] f = line.trim().split("\\s+");
            if (f.length == 3 && f[0].equals("VZ")) {
                int i = Integer.parseInt(f[1]);
                out[i] = Math.abs(Double.parseDouble(f[2]));
                seen.add(i);
            }
        }
        assertEquals(temps.length, seen.size(), text);
        return out;
    }

    private static double slope(double[] x, double[] y) {
        double mx = 0;
        double my = 0;
        for (int i = 0; i < x.length; i++) {
            mx += x[i] / x.length;
            my += y[i] / x.length;
        }
        double sxy = 0;
        double sxx = 0;
        for (int i = 0; i < x.length; i++) {
            sxy += (x[i] - mx) * (y[i] - my);
            sxx += (x[i] - mx) * (x[i] - mx);
        }
        return sxy / sxx;
    }
}
