package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.junit.jupiter.api.Test;

/** Device-kind presets and what they change in a fit. */
class DeviceKindTest {
    /** N from a noise-free sweep: the fit's convergence, far below any data's resolution [1]. */
    private static final double NOISE_FREE_N = 1e-6;

    @Test
    void presetsFollowThePublishedTable() {
        // check-values.md "Silicon and SPICE facts": ngspice manual (READ) typical EG 1.11 eV silicon, 0.69 eV
        // Schottky, 0.67 eV germanium; XTI 3 pn junction, 2 Schottky
        assertEquals(1.11, DeviceKind.SILICON_PN.activationEnergy());
        assertEquals(0.69, DeviceKind.SCHOTTKY.activationEnergy());
        assertEquals(0.67, DeviceKind.GERMANIUM.activationEnergy());
        assertEquals(3.0, DeviceKind.SILICON_PN.temperatureExponent());
        assertEquals(2.0, DeviceKind.SCHOTTKY.temperatureExponent());
        assertEquals(DeviceKind.BASE_EMITTER, DeviceKind.byOptionName("base-emitter"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> DeviceKind.byOptionName("tunnel"));
        assertTrue(e.getMessage().contains("silicon-pn, schottky, germanium, led, zener, base-emitter"), e.getMessage());
    }

    private static List<FitPoint> sweep(DiodeParameters p, double celsius) {
        DiodeAtTemperature d = TemperatureLaws.at(p, celsius + 273.15, SimulatorOptions.NGSPICE_DEFAULTS);
        List<FitPoint> pts = new ArrayList<>();
        for (int k = 0; k <= 56; k++) {
            double i = 1e-9 * Math.pow(10, k / 8.0);
            pts.add(new FitPoint(i, DiodeSolver.voltageAtCurrent(d, i), celsius + 273.15, 1e-3, "synthetic", k + 1));
        }
        return pts;
    }

    @Test
    void oneTemperatureHoldsTheKindsActivationEnergyAndSaysSo() throws Exception {
        DiodeParameters truth = DiodeParameters.of(Map.of(Param.IS, 1e-9, Param.N, 1.04, Param.RS, 2.0,
                Param.EG, 0.69, Param.XTI, 2.0));
        FitSettings schottky = FitSettings.defaults().withKind(DeviceKind.SCHOTTKY);
        FitResult r = new JunctionExtraction(schottky, CapacitanceOptions.DEFAULT)
                .fit(ExtractionData.forwardOnly(sweep(truth, 27)));
        assertEquals(0.69, r.parameters().get(Param.EG));
        assertEquals(2.0, r.parameters().get(Param.XTI));
        assertEquals(FittedParameter.Origin.PRESET, r.parameter(Param.EG).orElseThrow().origin());
        assertTrue(r.warnings().stream().anyMatch(w -> w.startsWith("EG held at 0.69 eV (Schottky barrier)")), r.warnings().toString());
        assertEquals(1.04, r.parameters().get(Param.N), NOISE_FREE_N, "N itself is fitted, inside the Schottky range");
    }

    @Test
    void ledAndZenerKindsTellTheUserWhatIsMissing() throws Exception {
        DiodeParameters truth = DiodeParameters.of(Map.of(Param.IS, 1e-22, Param.N, 2.2, Param.RS, 6.0, Param.EG, 2.0));
        FitResult led = new JunctionExtraction(FitSettings.defaults().withKind(DeviceKind.LED), CapacitanceOptions.DEFAULT)
                .fit(ExtractionData.forwardOnly(sweep(truth, 25)));
        assertTrue(led.warnings().stream().anyMatch(w -> w.contains("1239.84/lambda")), led.warnings().toString());
        FitResult zener = new JunctionExtraction(FitSettings.defaults().withKind(DeviceKind.ZENER), CapacitanceOptions.DEFAULT)
                .fit(ExtractionData.forwardOnly(sweep(DiodeParameters.of(Map.of(Param.IS, 1e-14, Param.RS, 1.0)), 25)));
        assertTrue(zener.warnings().stream().anyMatch(w -> w.contains("no reverse data reach breakdown")), zener.warnings().toString());
    }

    @Test
    void sweepsAFewTenthsOfADegreeApartCountAsOneTemperature() throws Exception {
        DiodeParameters truth = DiodeParameters.of(Map.of(Param.IS, 2e-14, Param.N, 1.02, Param.RS, 0.8));
        List<FitPoint> pts = new ArrayList<>(sweep(truth, 25.0));
        pts.addAll(sweep(truth, 25.3));
        FitResult r = new JunctionExtraction(FitSettings.defaults(), CapacitanceOptions.DEFAULT).fit(ExtractionData.forwardOnly(pts));
        assertEquals(FittedParameter.Origin.PRESET, r.parameter(Param.EG).orElseThrow().origin(), "EG held, not fitted");
        assertTrue(r.warnings().stream().anyMatch(w -> w.contains("less than 5 K apart")), r.warnings().toString());
        assertEquals(2, ForwardExtraction.distinctTemperatures(List.of(300.0, 300.2, 310.0, 312.0), 5), "groups");
    }
}
