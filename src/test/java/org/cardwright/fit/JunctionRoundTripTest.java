package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.cardwright.sim.Bias;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.NgspiceEngine;
import org.cardwright.sim.OperatingPoint;
import org.cardwright.sim.process.SimulatorProcess;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Round trips of the whole-junction fit through ngspice 39 (issue 3 acceptance): forward and reverse data
 * simulated from a known invented card at three temperatures, with instrument noise, fitted together.
 */
class JunctionRoundTripTest {
    /** Issue 3: breakdown voltage at the measured currents within 0.2 %. */
    private static final double BREAKDOWN_VOLTAGE_TOLERANCE = 0.002;
    /** Issue 3: NBV within 5 %. */
    private static final double NBV_TOLERANCE = 0.05;
    /** Issue 3: TT from recovery records within 2 % of the relation's value. */
    private static final double TT_TOLERANCE = 0.02;
    /** The joint fit's TT against the relation's own least-squares TT: the optimiser's convergence [1]. */
    private static final double SAME_TT_RELATIVE = 1e-6;
    /**
     * VJ and M of the joint card within 5 % of the generating values: the curve itself is held to 1 % by CV_TOLERANCE,
     * and VJ and M trade off along it, so each alone is held more loosely (a judgement, no source) [1].
     */
    private static final double CV_PARAMETER_TOLERANCE = 0.05;
    /** Issue 4's remedy: RS from the cool points alone within 20 % counts as close; else it must be reported [1]. */
    private static final double COOL_RS_TOLERANCE = 0.2;

    private static final double[] CELSIUS = {-20, 27, 100};
    private static final DiodeParameters TRUTH = DiodeParameters.of(Map.of(Param.IS, 1e-13, Param.N, 1.02,
            Param.RS, 1.0, Param.BV, 47.0, Param.IBV, 5e-4, Param.NBV, 2.5, Param.TCV, -0.04, Param.EG, 1.11,
            Param.XTI, 3.0));

    private static List<OperatingPoint> ngspice(List<Bias> biases) throws Exception {
        SimulatorProcess ngspice = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(),
                Duration.ofSeconds(60));
        CardUnderTest card = CardUnderTest.ngspice("truth", TRUTH);
        return new NgspiceEngine(ngspice, Simulators.tempDir("junction-roundtrip")).dc(card, biases);
    }

    @Test
    void breakdownComesBackFromNoisyReverseData() throws Exception {
        List<FitPoint> forward = ForwardRoundTripTest.simulate(TRUTH, CELSIUS, 11, true);
        List<Bias> biases = new ArrayList<>();
        for (double c : CELSIUS) {
            for (int k = 0; k <= 20; k++) {
                biases.add(Bias.current(-1e-6 * Math.pow(10, k / 5.0), c + 273.15));
            }
            for (int k = 1; k <= 8; k++) {
                biases.add(Bias.voltage(-4.0 * k, c + 273.15));
            }
        }
        List<OperatingPoint> ops = ngspice(biases);
        Random rnd = new Random(20261202L);
        List<ReversePoint> reverse = new ArrayList<>();
        for (int i = 0; i < ops.size(); i++) {
            Bias b = biases.get(i);
            double v = ops.get(i).voltage();
            double cur = ops.get(i).current();
            if (b.forcing() == Bias.Forcing.CURRENT) {
                v *= 1 + 2e-4 * rnd.nextGaussian(); // issue 3: 0.02 % on breakdown voltage
            } else {
                cur *= 1 + 1e-2 * rnd.nextGaussian(); // issue 3: 1 % on leakage current
            }
            reverse.add(new ReversePoint(v, cur, b.temperature(), 1e-3 + 2e-4 * Math.abs(v), "simulated", i + 1));
        }
        FitResult fit = new JunctionExtraction(FitSettings.defaults(), CapacitanceOptions.DEFAULT)
                .fit(new ExtractionData(forward, reverse, List.of(), List.of()));
        System.out.println("breakdown round trip: " + fit.otherResiduals() + " warnings " + fit.warnings());
        for (Param p : List.of(Param.BV, Param.NBV, Param.IBV, Param.TCV)) {
            System.out.printf("  %-4s truth %-10.5g fitted %-10.5g%n", p, TRUTH.get(p), fit.parameters().get(p));
        }
        assertEquals(TRUTH.get(Param.NBV), fit.parameters().get(Param.NBV), NBV_TOLERANCE * TRUTH.get(Param.NBV));
        double worst = 0;
        for (int i = 0; i < biases.size(); i++) {
            if (biases.get(i).forcing() != Bias.Forcing.CURRENT) {
                continue;
            }
            double t = biases.get(i).temperature();
            DiodeAtTemperature a = TemperatureLaws.at(TRUTH, t, SimulatorOptions.NGSPICE_DEFAULTS);
            DiodeAtTemperature b = TemperatureLaws.at(fit.parameters(), t, SimulatorOptions.NGSPICE_DEFAULTS);
            double va = DiodeSolver.voltageAtCurrent(a, biases.get(i).value());
            double vb = DiodeSolver.voltageAtCurrent(b, biases.get(i).value());
            worst = Math.max(worst, Math.abs(vb / va - 1));
        }
        System.out.printf("breakdown voltage at the measured currents: worst relative error %.4f %%%n", 100 * worst);
        assertTrue(worst < BREAKDOWN_VOLTAGE_TOLERANCE, "worst " + worst);
    }

    @Test
    void transitTimeFromRecoveryRecordsFollowsTheChargeControlRelation() throws Exception {
        // records made from the relation itself with TT = 4 ns and 1 % noise: the fit must return the relation's
        // TT within 2 % (issue 3)
        double tt = 4e-9;
        Random rnd = new Random(5);
        List<RecoveryPoint> rec = new ArrayList<>();
        double[][] conditions = {{10e-3, 10e-3}, {10e-3, 1e-3}, {30e-3, 10e-3}, {1e-3, 10e-3}, {50e-3, 5e-3}};
        int line = 2;
        for (double[] c : conditions) {
            double trr = tt * Math.log1p(c[0] / c[1]) * (1 + 0.01 * rnd.nextGaussian());
            rec.add(new RecoveryPoint(c[0], c[1], trr, 300.15, 0.02 * trr, "records.csv", line++));
        }
        List<FitPoint> forward = ForwardRoundTripTest.simulate(TRUTH, new double[] {27}, 3, true);
        FitResult fit = new JunctionExtraction(FitSettings.defaults(), CapacitanceOptions.DEFAULT)
                .fit(new ExtractionData(forward, List.of(), List.of(), rec));
        double got = fit.parameters().get(Param.TT);
        System.out.printf("TT from recovery records: %.4g s (relation's value %.4g s)%n", got, tt);
        assertEquals(tt, got, TT_TOLERANCE * tt);
        assertEquals(RecoveryBlock.closedForm(rec), got, SAME_TT_RELATIVE * got, "the joint fit keeps the relation's own least-squares TT");
    }

    /** Issue 3: the joint fit's forward residuals no worse than the forward-only fit's by more than this [V]. */
    private static final double JOINT_FORWARD_ALLOWANCE = 0.05e-3;
    /** Issue 3: the fitted card reproduces the noise-free C-V within 1 %. */
    private static final double CV_TOLERANCE = 0.01;

    @Test
    void jointFitGivesJunctionPotentialAndGradingThatServeBothCurrentAndCapacitance() throws Exception {
        // a part whose recombination current is strong, so VJ and M shape the forward curve as well as C-V
        DiodeParameters truth = DiodeParameters.of(Map.ofEntries(Map.entry(Param.IS, 2e-15), Map.entry(Param.N, 1.01),
                Map.entry(Param.RS, 0.7), Map.entry(Param.ISR, 3e-11), Map.entry(Param.NR, 2.0),
                Map.entry(Param.EG, 1.11), Map.entry(Param.XTI, 3.0), Map.entry(Param.CJO, 25e-12),
                Map.entry(Param.VJ, 0.68), Map.entry(Param.M, 0.38), Map.entry(Param.BV, 80.0),
                Map.entry(Param.IBV, 1e-4), Map.entry(Param.NBV, 3.0)));
        List<FitPoint> forward = ForwardRoundTripTest.simulate(truth, CELSIUS, 21, true);
        SimulatorProcess ngspice = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(),
                Duration.ofSeconds(60));
        CardUnderTest card = CardUnderTest.ngspice("truth", truth);
        List<Bias> cvBias = new ArrayList<>();
        for (double c : CELSIUS) {
            for (double v : new double[] {0, -0.5, -1, -2, -3, -5, -7.5, -10, -15, -20}) {
                cvBias.add(Bias.voltage(v, c + 273.15));
            }
        }
        List<Double> caps = new org.cardwright.sim.NgspiceCapacitance(ngspice, Simulators.tempDir("joint-cv"))
                .capacitance(card, cvBias, CapacitanceOptions.DEFAULT_FREQUENCY);
        Random rnd = new Random(77);
        List<CapacitancePoint> cv = new ArrayList<>();
        for (int i = 0; i < caps.size(); i++) {
            double c = caps.get(i) * (1 + 0.005 * rnd.nextGaussian()) + 20e-15 * rnd.nextGaussian();
            cv.add(CapacitancePoint.withDefaultSigma(cvBias.get(i).value(), c, cvBias.get(i).temperature(), "cv", i + 1));
        }
        List<Bias> revBias = new ArrayList<>();
        for (double c : CELSIUS) {
            for (int k = 0; k <= 15; k++) {
                revBias.add(Bias.current(-1e-6 * Math.pow(10, k / 5.0), c + 273.15));
            }
        }
        List<OperatingPoint> rev = new NgspiceEngine(ngspice, Simulators.tempDir("joint-rev")).dc(card, revBias);
        List<ReversePoint> reverse = new ArrayList<>();
        for (int i = 0; i < rev.size(); i++) {
            double v = rev.get(i).voltage() * (1 + 2e-4 * rnd.nextGaussian());
            reverse.add(new ReversePoint(v, revBias.get(i).value(), revBias.get(i).temperature(),
                    1e-3 + 2e-4 * Math.abs(v), "rev", i + 1));
        }

        FitResult forwardOnly = new JunctionExtraction(FitSettings.defaults(), CapacitanceOptions.DEFAULT)
                .fit(ExtractionData.forwardOnly(forward));
        FitResult joint = new JunctionExtraction(FitSettings.defaults(), CapacitanceOptions.DEFAULT)
                .fit(new ExtractionData(forward, reverse, cv, List.of()));
        System.out.println("joint fit: " + joint.otherResiduals());
        for (Param p : List.of(Param.VJ, Param.M, Param.CJO, Param.ISR, Param.NR)) {
            System.out.printf("  %-4s truth %-10.5g forward-only %-10.5g joint %-10.5g%n", p, truth.get(p),
                    forwardOnly.parameters().get(p), joint.parameters().get(p));
        }
        for (int k = 0; k < CELSIUS.length; k++) {
            double a = forwardOnly.residuals().get(k).rms();
            double b = joint.residuals().get(k).rms();
            System.out.printf("  forward RMS at %.0f degC: forward-only %.4f mV, joint %.4f mV%n", CELSIUS[k], a * 1e3, b * 1e3);
            assertTrue(b <= a + JOINT_FORWARD_ALLOWANCE, "forward residual at " + CELSIUS[k] + " degC");
        }
        double worst = 0;
        for (Bias b : cvBias) {
            var ta = TemperatureLaws.at(truth, b.temperature(), SimulatorOptions.NGSPICE_DEFAULTS);
            var tb = TemperatureLaws.at(joint.parameters(), b.temperature(), SimulatorOptions.NGSPICE_DEFAULTS);
            double ca = org.cardwright.model.JunctionCapacitance.total(ta, b.value());
            double cb = org.cardwright.model.JunctionCapacitance.total(tb, b.value());
            worst = Math.max(worst, Math.abs(cb / ca - 1));
        }
        System.out.printf("  joint card against the noise-free C-V: worst %.3f %%%n", 100 * worst);
        assertTrue(worst < CV_TOLERANCE);
        assertEquals(truth.get(Param.VJ), joint.parameters().get(Param.VJ), CV_PARAMETER_TOLERANCE * truth.get(Param.VJ));
        assertEquals(truth.get(Param.M), joint.parameters().get(Param.M), CV_PARAMETER_TOLERANCE * truth.get(Param.M));
    }

    /** Issue 4: the thermal fit recovers RTH0 within 10 %. */
    private static final double RTH0_TOLERANCE = 0.10;
    /** Issue 4: RS stays within 2 % of the generating value. */
    private static final double RS_TOLERANCE = 0.02;

    @Test
    void selfHeatingIsFlaggedAndItsThermalResistanceRecovered() throws Exception {
        List<FitPoint> pts = heatedData();
        FitResult fit = new JunctionExtraction(FitSettings.defaults(), CapacitanceOptions.DEFAULT).fit(ExtractionData.forwardOnly(pts));
        System.out.println("self-heating: " + fit.terms() + " warnings " + fit.warnings());
        System.out.printf("  RTH0 truth 150 fitted %.4g K/W; RS truth 0.3 fitted %.5g ohm%n",
                fit.parameters().get(Param.RTH0), fit.parameters().get(Param.RS));
        assertTrue(fit.parameters().isGiven(Param.RTH0), "self-heating found by the tool");
        assertTrue(fit.warnings().stream().anyMatch(w -> w.startsWith("self-heating")), fit.warnings().toString());
        assertEquals(150.0, fit.parameters().get(Param.RTH0), RTH0_TOLERANCE * 150.0);
        assertEquals(0.3, fit.parameters().get(Param.RS), RS_TOLERANCE * 0.3);
    }

    @Test
    void theOtherRemedyLeavesOutTheHeatedPointsAndSaysWhich() throws Exception {
        List<FitPoint> pts = heatedData();
        FitSettings exclude = FitSettings.defaults().withSelfHeating(FitSettings.SelfHeatingRemedy.EXCLUDE);
        FitResult fit = new JunctionExtraction(exclude, CapacitanceOptions.DEFAULT).fit(ExtractionData.forwardOnly(pts));
        String note = fit.warnings().stream().filter(w -> w.contains("left out")).findFirst().orElseThrow();
        System.out.println("exclude: " + note.substring(0, Math.min(240, note.length())) + " ... RS " + fit.parameters().get(Param.RS));
        assertTrue(!fit.parameters().isGiven(Param.RTH0), "no RTH0 on the card");
        assertTrue(note.contains("simulated:68"), "the hottest point is named");
        assertTrue(fit.points() < pts.size(), "points were left out");
        // what stays was measured below the heating: the cool points alone pin RS only loosely, so the card's RS is
        // either close or reported as undetermined, never silently wrong
        boolean close = Math.abs(fit.parameters().get(Param.RS) / 0.3 - 1) < COOL_RS_TOLERANCE;
        boolean flagged = fit.warnings().stream().anyMatch(w -> w.startsWith("RS is not determined"));
        assertTrue(close || flagged, "RS " + fit.parameters().get(Param.RS) + " warnings " + fit.warnings());
    }

    private static List<FitPoint> heatedData() throws Exception {
        DiodeParameters truth = DiodeParameters.of(Map.of(Param.IS, 1e-14, Param.N, 1.02, Param.RS, 0.3,
                Param.RTH0, 150.0, Param.EG, 1.11, Param.XTI, 3.0));
        SimulatorProcess ngspice = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(),
                Duration.ofSeconds(60));
        List<Bias> biases = new ArrayList<>();
        for (double c : CELSIUS) {
            for (int k = 0; k <= 67; k++) {
                biases.add(Bias.current(1e-9 * Math.pow(10, k / 8.0), c + 273.15));
            }
        }
        CardUnderTest card = CardUnderTest.ngspice("truth", truth);
        List<OperatingPoint> ops = new NgspiceEngine(ngspice, Simulators.tempDir("self-heating")).dc(card, biases);
        Random rnd = new Random(4242);
        List<FitPoint> pts = new ArrayList<>();
        for (int i = 0; i < ops.size(); i++) {
            double v = ops.get(i).voltage() + rnd.nextGaussian() * (0.15e-3 + 2e-4 * ops.get(i).voltage());
            double cur = biases.get(i).value() * (1 + 1e-3 * rnd.nextGaussian());
            pts.add(new FitPoint(cur, v, biases.get(i).temperature(), 1e-3, "simulated", i + 1));
        }
        return pts;
    }
}
