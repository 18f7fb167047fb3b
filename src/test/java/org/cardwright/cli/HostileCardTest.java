package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;
import org.cardwright.testsupport.TestCopies;

/**
 * Issue 10, item 1: a hostile card cannot run anything or forge a pass. Every card in fixtures/hostile/cards goes
 * through the real command line ({@code verify} with ngspice, gnucap and the built-in engine, {@code compare} on
 * either side, {@code check} of a library holding it): the card reader refuses it with exit 3 and one line naming
 * the file and the line its header gives, no stack trace, and the canary file the card tries to create never
 * appears. The canary is shown to work: the same card text pasted into a deck, as cardwright once did, does create
 * it in ngspice and gnucap.
 */
class HostileCardTest {
    private static final Pattern REFUSED_AT = Pattern.compile("\\* Refused at: line (\\d+)");
    /** The corpus had 20 cards when this test was written; fewer means cards went missing. */
    private static final int MIN_CARDS = 20;
    private static final long SIMULATOR_SECONDS = 60;

    private static Path corpus() {
        return Simulators.projectDir().resolve("fixtures/hostile/cards");
    }

    /** A scratch copy of the card with its placeholders filled: the canary and the included file. */
    private record Planted(Path card, Path canary, int line) {
    }

    private static Planted plant(Path fixture, Path dir) throws IOException {
        Files.createDirectories(dir);
        Path canary = dir.resolve("CANARY");
        Path included = dir.resolve("included-control.inc");
        String inc = Files.readString(corpus().resolve("included-control.inc"), StandardCharsets.UTF_8);
        Files.writeString(included, inc.replace("@CANARY@", canary.toString()), StandardCharsets.UTF_8);
        String text = Files.readString(fixture, StandardCharsets.UTF_8)
                .replace("@CANARY@", canary.toString()).replace("@INCLUDED@", included.toString());
        Path card = dir.resolve(fixture.getFileName().toString());
        Files.writeString(card, text, StandardCharsets.UTF_8);
        Matcher m = REFUSED_AT.matcher(text);
        assertTrue(m.find(), fixture + ": no '* Refused at: line N' header");
        return new Planted(card, canary, Integer.parseInt(m.group(1)));
    }

    private static List<Path> cards() throws IOException {
        try (Stream<Path> s = Files.list(corpus())) {
            return s.filter(Files::isRegularFile).sorted().toList();
        }
    }

    @TestFactory
    Stream<DynamicTest> everyHostileCardIsRefusedByEveryCommandAndEngine() throws IOException {
        Simulators.requireNgspice();
        Simulators.requireGnucap();
        List<Path> cards = cards();
        assertTrue(cards.size() >= MIN_CARDS, "found only " + cards.size() + " hostile cards");
        Path data = Simulators.projectDir().resolve("fixtures/demo/ks1-forward-25C.csv");
        Path good = Simulators.projectDir().resolve("fixtures/compare/cmp-b.mod");
        return cards.stream().map(f -> DynamicTest.dynamicTest(f.getFileName().toString(), () -> {
            String stem = f.getFileName().toString().replace('.', '-');
            Planted p = plant(f, Simulators.tempDir("hostile-" + stem));
            String where = "cardwright: " + p.card() + ":" + p.line() + ": ";
            List<String[]> commands = List.of(
                    new String[] {"verify", p.card().toString(), data.toString(), "--engine", "ngspice"},
                    new String[] {"verify", p.card().toString(), data.toString(), "--engine", "gnucap"},
                    new String[] {"verify", p.card().toString(), data.toString(), "--engine", "builtin"},
                    new String[] {"compare", p.card().toString(), good.toString(), "--engine", "ngspice"},
                    new String[] {"compare", good.toString(), p.card().toString(), "--engine", "gnucap"});
            for (String[] args : commands) {
                CliRun run = CliRun.of(args);
                String label = String.join(" ", args);
                assertEquals(ExitCodes.BAD_INPUT, run.exitCode(), label + "\n" + run.describe());
                List<String> lines = run.errLines();
                assertEquals(1, lines.size(), label + ": one line\n" + run.describe());
                assertTrue(lines.get(0).startsWith(where), label + ": expected '" + where + "' in " + lines.get(0));
                assertFalse(run.err().contains("\tat "), label + ": no stack trace\n" + run.err());
                assertFalse(Files.exists(p.canary()), label + ": the card ran a command: " + p.canary() + " exists");
            }
        }));
    }

    @Test
    void aHostileCardInALibraryIsAnErrorOfCheckAndRunsNothing() throws Exception {
        Simulators.requireNgspice();
        for (String fixture : List.of("control-after.mod", "forged-pass.mod", "element-line.mod")) {
            Path root = Simulators.tempDir("hostile-check-" + fixture.replace('.', '-'));
            TestCopies.copyTree(Simulators.projectDir().resolve("fixtures/library/rectifiers"), root.resolve("rectifiers"), StandardCopyOption.REPLACE_EXISTING);
            Planted p = plant(corpus().resolve(fixture), root.resolve("scratch"));
            Path card = root.resolve("rectifiers/cards/RB4.ngspice.lib");
            Files.copy(p.card(), card, StandardCopyOption.REPLACE_EXISTING);
            CliRun run = CliRun.of("check", root.toString(), "--engine", "ngspice");
            assertTrue(run.out().contains("RB4.ngspice.lib:" + p.line() + ": refused"), run.describe());
            // check reports each card's error in its table and exits 1 when any card does not pass (README)
            assertEquals(ExitCodes.NOT_REPRODUCED, run.exitCode(), "a refused card never passes: " + run.describe());
            assertFalse(run.err().contains("\tat ") || run.out().contains("\tat "), run.describe());
            assertFalse(Files.exists(p.canary()), fixture + ": the card ran a command");
        }
    }

    /**
     * The canary works: pasted into a deck the way cardwright once pasted card text, the control block and the
     * gnucap .system line do create it. Without this, a canary that never appears would prove nothing.
     */
    @Test
    void theSameCardsPastedIntoADeckDoRunTheirCommands() throws Exception {
        Path ngspice = Simulators.requireNgspice();
        Path gnucap = Simulators.requireGnucap();
        Planted a = plant(corpus().resolve("control-after.mod"), Simulators.tempDir("hostile-canary-ngspice"));
        String deck = "pasted deck\n" + Files.readString(a.card(), StandardCharsets.UTF_8) + ".end\n";
        run(List.of(ngspice.toString(), "-b", write(a.card().resolveSibling("deck.cir"), deck)), a.card().getParent());
        assertTrue(Files.exists(a.canary()), "ngspice ran the pasted control block");

        Planted b = plant(corpus().resolve("gnucap-system.ckt"), Simulators.tempDir("hostile-canary-gnucap"));
        String ckt = "pasted deck\n" + Files.readString(b.card(), StandardCharsets.UTF_8) + ".end\n";
        run(List.of(gnucap.toString(), "-b", write(b.card().resolveSibling("deck.ckt"), ckt)), b.card().getParent());
        assertTrue(Files.exists(b.canary()), "gnucap ran the pasted .system line");
    }

    private static String write(Path file, String text) throws IOException {
        Files.writeString(file, text, StandardCharsets.UTF_8);
        return file.toString();
    }

    private static void run(List<String> command, Path dir) throws Exception {
        Process p = new ProcessBuilder(new ArrayList<>(command)).directory(dir.toFile())
                .redirectErrorStream(true).redirectOutput(dir.resolve("console.txt").toFile()).start();
        assertTrue(p.waitFor(Duration.ofSeconds(SIMULATOR_SECONDS).toSeconds(), TimeUnit.SECONDS), "simulator hung");
    }

}
