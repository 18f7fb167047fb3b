package org.cardwright.corpus;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.cardwright.verify.JunctionVerification;

/**
 * Writes docs/corpus.md: every invented corpus part's figures (fit from its noisy and its noise-free data,
 * compared with the generating card; verify with both engines; a card moved by 3 standard errors). A plain
 * program, not a test. Run from the repository root (the shaded jar carries the libraries):
 *
 * <pre>
 * mvn -B -q -o package -DskipTests &amp;&amp; mvn -B -q -o test-compile
 * java -cp target/test-classes:target/cardwright.jar org.cardwright.corpus.CorpusTable [OUT]
 * </pre>
 * It needs ngspice 39 for the ngspice column (about 5 minutes on 2 cores).
 */
public final class CorpusTable {
    private CorpusTable() {
    }

    public static void main(String[] args) throws Exception {
        Path project = Path.of("").toAbsolutePath();
        Path out = args.length > 0 ? Path.of(args[0]) : project.resolve("docs/corpus.md");
        Path work = Files.createTempDirectory("cardwright-corpus-table-");
        StringBuilder b = new StringBuilder();
        b.append("# The invented corpus: figures per part\n\n");
        b.append("Made by `org.cardwright.corpus.CorpusTable` (src/test/java) from the invented parts in\n");
        b.append("[fixtures/corpus](../fixtures/corpus/README.md). Each part's data are fitted as a user would (`fit` with\n");
        b.append("the part's device kind and fixture stray, ngspice dialect); the fitted card is compared with the generating\n");
        b.append("card at the measured points, each row at its own temperature, both through the built-in engine (ngspice\n");
        b.append("39's equations). Forward: worst voltage difference at the measured currents (generating junction with\n");
        b.append("its shunt, where it has one). BV: worst relative voltage difference at the forced breakdown currents.\n");
        b.append("C: worst relative difference of the junction capacitance at the measured biases (stray excluded).\n");
        b.append("TT: relative, where the C-V data show it. Shunt: the parallel resistor written beside the card.\n");
        b.append("verify: `--verdict noise` on the noisy data with the fitted card, built-in and ngspice engines.\n");
        b.append("3 SE: verify (built-in) of the card with IS moved by 3 standard errors; \"fails\" is wanted.\n\n");
        b.append("Targets (issue 9): noisy forward 0.3 mV, BV 0.05 %, C 1 %, TT 5 %, shunt 2 %; noise-free 10 times\n");
        b.append("tighter. A figure beyond its target is marked with `!`; `-` means the data do not show it.\n\n");
        b.append("| part | kind | data | fit | forward [mV] | BV [%] | C [%] | TT [%] | shunt [%] | verify builtin | verify ngspice | 3 SE |\n");
        b.append("| --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- |\n");
        for (CorpusFigures.Part part : CorpusFigures.parts(project)) {
            for (boolean noisy : new boolean[] {true, false}) {
                double scale = noisy ? 1 : 0.1;
                Path dir = Files.createDirectories(work.resolve(part.name() + (noisy ? "" : "-noisefree")));
                CorpusFigures.Figures f = CorpusFigures.of(part, noisy, dir);
                b.append("| ").append(part.name()).append(" | ").append(part.kind()).append(" | ")
                        .append(noisy ? "noisy" : "noise-free").append(" | ");
                if (f.refused() != null) {
                    b.append("REFUSED: ").append(f.refused().replace("|", "/")).append(" | | | | | | | | |\n");
                    System.out.println(part.name() + (noisy ? "" : " noise-free") + ": refused: " + f.refused());
                    continue;
                }
                b.append("ok | ").append(fig(f.forwardMv(), 0.3 * scale, "%.3g")).append(" | ")
                        .append(fig(f.breakdownPct(), 0.05 * scale, "%.3g")).append(" | ")
                        .append(fig(f.capacitancePct(), 1.0 * scale, "%.3g")).append(" | ")
                        .append(fig(f.ttPct(), 5.0 * scale, "%.3g")).append(" | ")
                        .append(fig(f.shuntPct(), 2.0 * scale, "%.3g")).append(" | ");
                if (noisy) {
                    b.append(verdict(part, f.card(), "builtin")).append(" | ")
                            .append(verdict(part, f.card(), "ngspice")).append(" | ");
                    Path moved = CorpusFigures.movedCard(f, dir);
                    b.append(verdict(part, moved, "builtin").equals("pass") ? "passes!" : "fails").append(" |\n");
                } else {
                    b.append("- | - | - |\n");
                }
                System.out.println(part.name() + (noisy ? "" : " noise-free") + ": done");
            }
        }
        Files.writeString(out, b.toString(), StandardCharsets.UTF_8);
        System.out.println("wrote " + out);
    }

    private static String fig(double value, double target, String format) {
        if (Double.isNaN(value)) {
            return "-";
        }
        if (Double.isInfinite(value)) {
            return "none written!";
        }
        return String.format(Locale.ROOT, format, value) + (value <= target ? "" : " !");
    }

    private static String verdict(CorpusFigures.Part part, Path card, String engine) {
        try {
            JunctionVerification v = CorpusFigures.verify(part, card, engine);
            if (v.pass()) {
                return "pass";
            }
            StringBuilder failed = new StringBuilder("FAIL:");
            v.forward().filter(x -> !x.pass()).ifPresent(x -> failed.append(" forward"));
            v.breakdown().filter(x -> !x.pass()).ifPresent(x -> failed.append(" breakdown"));
            v.capacitance().filter(x -> !x.pass()).ifPresent(x -> failed.append(" C-V"));
            v.leakage().filter(x -> !x.pass()).ifPresent(x -> failed.append(" leakage"));
            v.recovery().filter(x -> !x.pass()).ifPresent(x -> failed.append(" recovery"));
            return failed.toString();
        } catch (Exception e) {
            String m = String.valueOf(e.getMessage());
            return "error: " + m.lines().findFirst().orElse(m).replace("|", "/");
        }
    }
}
