package org.cardwright.library;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import org.cardwright.cli.Main;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.model.ShuntedJunction;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 9, item 7, in a library: a part with a resistor between its terminals gets, beside each card, the
 * subcircuit file, and {@code check} simulates that file as written (a resistor edited by hand fails it).
 * The data are invented, made by the built-in ngspice 39 equations without noise.
 */
class ShuntedLibraryTest {
    private static final int OK = 0;
    private static final int NOT_REPRODUCED = 1;
    /** The invented part's resistor [ohm]. */
    private static final double SHUNT = 470e3;

    private static String cli(int expected, String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.execute(new PrintWriter(out), new PrintWriter(err), args);
        assertEquals(expected, code, out + "\n" + err);
        return out.toString();
    }

    @Test
    void buildWritesTheSubcircuitAndCheckSimulatesIt() throws Exception {
        Path root = Simulators.tempDir("shunted-library");
        Path part = root.resolve("leaky");
        Files.createDirectories(part.resolve("data"));
        DiodeParameters junction = DiodeParameters.of(Map.of(Param.IS, 5e-15, Param.N, 1.05, Param.RS, 1.2));
        DiodeAtTemperature d = TemperatureLaws.at(junction, 298.15, SimulatorOptions.NGSPICE_DEFAULTS);
        StringBuilder fwd = new StringBuilder("# Invented test data, not a measurement: diode with 470k beside it, built-in model, no noise.\nV [V],I [A]\n");
        for (int k = 0; k <= 40; k++) {
            double i = 2e-7 * Math.pow(10, k / 8.0);
            fwd.append(String.format(Locale.ROOT, "%.12g,%.12g%n", ShuntedJunction.voltageAtCurrent(d, i, 1 / SHUNT), i));
        }
        Files.writeString(part.resolve("data/lk-forward-25C.csv"), fwd.toString(), StandardCharsets.UTF_8);
        Files.writeString(part.resolve("LK1.device.yaml"), """
                # Invented test part, not a real one: a small diode with a surface-leakage path.
                model: LK1
                kind: silicon-pn
                data:
                  - file: data/lk-forward-25C.csv
                    kind: forward
                    temperature: 25
                dialects: [ngspice, gnucap]
                tolerance:
                  forward-rms-mv: 2
                  forward-max-mv: 5
                """, StandardCharsets.UTF_8);
        cli(OK, "build", root.toString());
        for (String dialect : new String[] {"ngspice", "gnucap"}) {
            assertTrue(Files.exists(part.resolve("LK1.shunted." + dialect + ".lib")), dialect + " subcircuit written");
            String plain = Files.readString(part.resolve("LK1." + dialect + ".lib"));
            assertTrue(plain.contains("* junction alone: "), "the plain card says it is the junction alone:\n" + plain);
        }
        String out = cli(OK, "check", root.toString());
        assertTrue(out.contains("leaky/LK1.shunted.ngspice.lib: pass") && out.contains("leaky/LK1.shunted.gnucap.lib: pass"), out);

        // halve the resistor by hand: check now simulates that, and fails the part
        Path sub = part.resolve("LK1.shunted.ngspice.lib");
        String text = Files.readString(sub);
        String edited = text.replaceFirst("(?m)^RSH A K .*$", "RSH A K 235k");
        assertTrue(!edited.equals(text), "the resistor line is where the format says");
        Files.writeString(sub, edited, StandardCharsets.UTF_8);
        String after = cli(NOT_REPRODUCED, "check", root.toString());
        assertTrue(after.contains("leaky/LK1.shunted.ngspice.lib: fail"), after);
    }
}
