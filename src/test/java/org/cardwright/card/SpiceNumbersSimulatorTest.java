package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** ngspice 39 itself reads the numbers: what it makes of a token must be what {@link SpiceNumbers#parse} makes. */
class SpiceNumbersSimulatorTest {
    /**
     * Relative agreement with ngspice [1]: ngspice builds a number as mantissa times a power of ten in double
     * arithmetic, which is not always the nearest double, so a few ulp (about 1e-15) may separate the two.
     */
    private static final double NGSPICE_READ_TOLERANCE = 1e-14;

    private static final Pattern PRINTED = Pattern.compile("@(\\w+)\\[(\\w+)\\] = (\\S+)");

    @TempDir
    Path folder;

    @Test
    void ngspiceReadsHandWrittenTokensAsWeDo() throws Exception {
        List<String> tokens = List.of("10pF", "1F", "3k3", "1MEG", "1Meg", "1meg", "1M", "1m", "1MIL", "2.5n",
                "1e-3", "4.7uF", "1e3k", "10V", ".5u", "1.5E+3", "1T", "1G", "-2.5n", "1e", "50mOhm", "2mil");
        assertTokensReadAlike(tokens);
    }

    @Test
    void ngspiceReadsWrittenNumbersBackToTheSameValue() throws Exception {
        Random random = new Random(7);
        List<String> tokens = new ArrayList<>();
        for (int i = 0; i < 150; i++) {
            double magnitude = Math.pow(10, -20 + 40 * random.nextDouble());
            tokens.add(SpiceNumbers.format(random.nextBoolean() ? magnitude : -magnitude, i % 2 == 0 ? 6 : 15));
        }
        assertTokensReadAlike(tokens);
    }

    /** Puts each token on its own model as TCV (a parameter of any sign) and asks ngspice for the value. */
    private void assertTokensReadAlike(List<String> tokens) throws IOException, InterruptedException {
        ExternalSimulator ngspice = ExternalSimulator.ngspice();
        StringBuilder netlist = new StringBuilder("number reading check\nV1 a 0 0.6\n");
        StringBuilder print = new StringBuilder();
        for (int i = 0; i < tokens.size(); i++) {
            netlist.append(".model m").append(i).append(" D(TCV=").append(tokens.get(i)).append(")\n");
            netlist.append("D").append(i).append(" a 0 m").append(i).append('\n');
            print.append("print @m").append(i).append("[tcv]\n");
        }
        netlist.append(".control\nset numdgt=15\nop\n").append(print).append("quit\n.endc\n.end\n");
        Path file = folder.resolve("numbers.cir");
        Files.writeString(file, netlist, StandardCharsets.UTF_8);
        String output = ngspice.runBatch(file);
        ExternalSimulator.assertNoneOf(output, List.of("warning", "error", "unrecognized"), "number deck");
        Map<String, Double> printed = new HashMap<>();
        Matcher m = PRINTED.matcher(output);
        while (m.find()) {
            printed.put(m.group(1).toLowerCase(Locale.ROOT), Double.parseDouble(m.group(3)));
        }
        for (int i = 0; i < tokens.size(); i++) {
            Double ngspiceValue = printed.get("m" + i);
            assertNotNull(ngspiceValue, "ngspice printed no value for token " + tokens.get(i) + "\n" + output);
            double ours = SpiceNumbers.parse(tokens.get(i));
            assertEquals(ngspiceValue, ours, Math.abs(ngspiceValue) * NGSPICE_READ_TOLERANCE,
                    "token " + tokens.get(i));
        }
    }
}
