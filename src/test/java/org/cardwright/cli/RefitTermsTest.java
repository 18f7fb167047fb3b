package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 11: the Xyce refit put TRS1 (and VJ, M) on the card although the fit's summary called the term "not
 * warranted", and nothing said so. A dialect refit that brings in a term the full fit weighed and rejected (with its
 * own equations, by the same criterion) must report it on the card. Data: the invented demo switching diode
 * (fixtures/demo/ks1-*), four temperatures, where the full fit rejects TRS1 and the recombination factor (VJ, M).
 */
class RefitTermsTest {
    /** A term line of the fit's summary: name, parameters in parentheses, then yes or no. */
    private static final Pattern TERM = Pattern.compile("^\\s+.*\\(([A-Z0-9, ]+)\\)\\s+(yes|no)\\s.*$");

    @Test
    void noDialectCardCarriesATermTheFullFitRejected() throws Exception {
        Path out = Simulators.tempDir("refit-terms");
        Path demo = Simulators.projectDir().resolve("fixtures/demo");
        List<String> args = new ArrayList<>(List.of("fit"));
        for (String t : List.of("forward-minus40C", "forward-25C", "forward-85C", "forward-125C", "reverse-25C")) {
            args.add(demo.resolve("ks1-" + t + ".csv").toString());
        }
        args.addAll(List.of("--name", "KS1", "--dialect", "ngspice,xyce,spice3", "--out", out.toString()));
        CliRun r = CliRun.of(args.toArray(String[]::new));
        assertEquals(ExitCodes.OK, r.exitCode(), r.describe());
        List<String> rejected = new ArrayList<>();
        for (String line : r.out().lines().toList()) {
            Matcher m = TERM.matcher(line);
            if (m.matches() && m.group(2).equals("no")) {
                for (String p : m.group(1).split(",\\s*")) {
                    rejected.add(p.trim());
                }
            }
        }
        // the case of the report: TRS1 weighed and rejected by the full fit
        assertTrue(rejected.contains("TRS1"), r.out());
        for (String dialect : List.of("ngspice", "xyce", "spice3")) {
            String card = Files.readString(out.resolve("KS1." + dialect + ".lib"), StandardCharsets.UTF_8);
            for (String p : rejected) {
                String keyword = dialect.equals("xyce") && p.equals("TCV") ? "TBV1" : p;
                boolean carried = card.lines().anyMatch(l -> l.toUpperCase(java.util.Locale.ROOT).startsWith("+ " + keyword + "="));
                boolean reported = card.lines().anyMatch(l -> l.startsWith("* " + dialect + " refit brings in ")
                        && l.contains(" " + keyword + " ") && l.contains("which the full fit rejected"));
                assertEquals(carried, reported, dialect + " card, " + p + ": on the card " + carried + ", reported " + reported
                        + "\n" + card);
            }
        }
        // the case of the report: with Xyce's equations TRS1 follows the data, and the card says so
        String xyce = Files.readString(out.resolve("KS1.xyce.lib"), StandardCharsets.UTF_8);
        assertTrue(xyce.contains("* xyce refit brings in TRS1 (RS temperature coefficient), which the full fit rejected (not warranted"),
                xyce);
        assertFalse(Files.readString(out.resolve("KS1.ngspice.lib"), StandardCharsets.UTF_8).contains("TRS1="));
        // the Xyce card still reproduces the data within verify's forward limits
        List<String> verify = new ArrayList<>(List.of("verify", out.resolve("KS1.xyce.lib").toString()));
        verify.addAll(args.subList(1, 6));
        verify.addAll(List.of("--verdict", "fixed"));
        CliRun v = CliRun.of(verify.toArray(String[]::new));
        assertEquals(ExitCodes.OK, v.exitCode(), v.describe());
    }
}
