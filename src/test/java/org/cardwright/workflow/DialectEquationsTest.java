package org.cardwright.workflow;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.cardwright.card.CardReader;
import org.cardwright.card.Dialect;
import org.cardwright.card.ParsedCard;
import org.cardwright.fit.DeviceKind;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Flavour;
import org.cardwright.model.Param;
import org.cardwright.sim.Bias;
import org.cardwright.sim.BuiltinEngine;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.GnucapEngine;
import org.cardwright.sim.NgspiceEngine;
import org.cardwright.sim.OperatingPoint;
import org.cardwright.sim.process.SimulatorProcess;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Each card is fitted with the equations of the simulator that will read it. Data simulated in ngspice 39 at
 * three temperatures are fitted once; the gnucap card, run in gnucap itself (the second outside reference),
 * reproduces the data as closely as the ngspice card does in ngspice.
 */
class DialectEquationsTest {
    /** What the fit leaves on noise-free data (under 1 uV) plus gnucap's convergence (RELTOL 1e-6, a few uV) [V]. */
    private static final double REPRODUCE = 10e-6;
    private static final DiodeParameters TRUTH = DiodeParameters.of(Map.of(Param.IS, 2e-14, Param.N, 1.6,
            Param.RS, 0.9, Param.EG, 1.11, Param.XTI, 3.0));

    @Test
    void theGnucapCardReproducesTheDataInGnucap() throws Exception {
        SimulatorProcess ngspice = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(), Duration.ofSeconds(60));
        SimulatorProcess gnucap = new SimulatorProcess(SimulatorProcess.Kind.GNUCAP, Simulators.requireGnucap(), Duration.ofSeconds(60));
        Path dir = Simulators.tempDir("dialect-equations");
        List<Bias> biases = new ArrayList<>();
        for (double c : new double[] {-20, 27, 100}) {
            for (int k = 0; k <= 40; k++) {
                biases.add(Bias.current(1e-8 * Math.pow(10, k / 8.0), c + 273.15));
            }
        }
        List<OperatingPoint> ops = new NgspiceEngine(ngspice, dir.resolve("work"))
                .dc(CardUnderTest.ngspice("truth", TRUTH), biases);
        StringBuilder csv = new StringBuilder("# invented test data: simulated in ngspice from an invented card\nV,I,T [K]\n");
        for (int i = 0; i < ops.size(); i++) {
            csv.append(String.format(Locale.ROOT, "%.9f,%.9e,%.2f%n", ops.get(i).voltage(), biases.get(i).value(), biases.get(i).temperature()));
        }
        Path data = dir.resolve("fwd.csv");
        Files.writeString(data, csv.toString(), StandardCharsets.UTF_8);
        FitRequest request = new FitRequest(List.of(data), "DQ1", List.of(Dialect.NGSPICE, Dialect.GNUCAP, Dialect.XYCE),
                dir.resolve("out"), Optional.empty(), OptionalDouble.empty(), DeviceKind.SILICON_PN, List.of(), 7, true,
                Optional.empty());
        new FitWorkflow().run(request, o -> "");

        double inNgspice = worst(read(dir, Dialect.NGSPICE), new NgspiceEngine(ngspice, dir.resolve("work")), biases, ops);
        double inGnucap = worst(read(dir, Dialect.GNUCAP), new GnucapEngine(gnucap, dir.resolve("work")), biases, ops);
        double xyceOwn = worst(read(dir, Dialect.XYCE), new BuiltinEngine(Flavour.XYCE.options()), biases, ops);
        System.out.printf("worst deviation from the data: ngspice card in ngspice %.2f uV, gnucap card in gnucap %.2f uV,"
                + " Xyce card under Xyce's equations %.2f uV%n", inNgspice * 1e6, inGnucap * 1e6, xyceOwn * 1e6);
        assertTrue(inNgspice < REPRODUCE, "ngspice " + inNgspice);
        assertTrue(inGnucap < REPRODUCE, "gnucap " + inGnucap);
        assertTrue(xyceOwn < REPRODUCE, "xyce " + xyceOwn);
    }

    private static CardUnderTest read(Path dir, Dialect d) throws Exception {
        Path f = dir.resolve("out/DQ1." + d.shortName() + ".lib");
        String text = Files.readString(f, StandardCharsets.UTF_8);
        ParsedCard p = new CardReader().parse(text, f.toString(), d);
        return Engines.underTest(p, d);
    }

    private static double worst(CardUnderTest card, org.cardwright.sim.SimulationEngine engine, List<Bias> biases,
                                List<OperatingPoint> data) throws Exception {
        List<OperatingPoint> sim = engine.dc(card, biases);
        double w = 0;
        for (int i = 0; i < biases.size(); i++) {
            w = Math.max(w, Math.abs(sim.get(i).voltage() - data.get(i).voltage()));
        }
        return w;
    }
}
