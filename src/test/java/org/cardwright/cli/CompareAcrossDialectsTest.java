package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * The ngspice and Xyce cards of one fit describe the same part, each in its own simulator's equations, so
 * compare (which evaluates each card with its own equations) finds them in agreement; read both as ngspice,
 * the Xyce card's high-injection law would make them differ.
 */
class CompareAcrossDialectsTest {
    @Test
    void cardsOfOneFitAgreeWhenEachIsEvaluatedWithItsOwnEquations() throws Exception {
        Path dir = Simulators.tempDir("compare-dialects");
        // invented part with a strong high-injection knee, data from the built-in ngspice equations
        DiodeParameters truth = DiodeParameters.of(Map.of(Param.IS, 1e-14, Param.N, 1.02, Param.RS, 0.5, Param.IKF, 5e-3));
        StringBuilder csv = new StringBuilder("# invented test data\nV,I,T [degC]\n");
        for (double c : new double[] {-40, 25, 125}) {
            DiodeAtTemperature d = TemperatureLaws.at(truth, c + 273.15, SimulatorOptions.NGSPICE_DEFAULTS);
            for (int k = 0; k <= 64; k++) {
                double i = 1e-9 * Math.pow(10, k / 8.0);
                csv.append(String.format(Locale.ROOT, "%.9f,%.9e,%.0f%n", DiodeSolver.voltageAtCurrent(d, i), i, c));
            }
        }
        Path data = dir.resolve("knee.csv");
        Files.writeString(data, csv.toString(), StandardCharsets.UTF_8);
        assertEquals(0, run("fit", data.toString(), "--name", "K1", "--out", dir.resolve("out").toString(),
                "--dialect", "ngspice,xyce", "--force").code);
        String a = dir.resolve("out/K1.ngspice.lib").toString();
        String b = dir.resolve("out/K1.xyce.lib").toString();
        Run own = run("compare", a, b);
        assertEquals(0, own.code, own.out);
        assertTrue(own.out.contains("Xyce level-1 diode equations"), own.out);
        Run asNgspice = run("compare", a, b, "--dialect-b", "xyce", "--engine", "builtin");
        assertEquals(0, asNgspice.code, "naming the dialect gives the same as the file name");
        // a Xyce card's values evaluated with ngspice's knee law do not describe the part
        String xyceText = Files.readString(Path.of(b), StandardCharsets.UTF_8);
        Path renamed = Files.writeString(dir.resolve("out/K1-as-ngspice.lib"), xyceText, StandardCharsets.UTF_8);
        Run wrong = run("compare", a, renamed.toString(), "--dialect-b", "ngspice");
        assertEquals(ExitCodes.NOT_REPRODUCED, wrong.code, wrong.out);
    }

    private record Run(int code, String out) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.execute(new PrintWriter(out), new PrintWriter(err), args);
        return new Run(code, out + err.toString());
    }
}
