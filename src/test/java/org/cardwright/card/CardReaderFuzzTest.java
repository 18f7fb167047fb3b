package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.workflow.Engines;
import org.junit.jupiter.api.Test;

/**
 * Issue 10, a seeded fuzz of the card reader: 3000 mutations of the good and hostile card corpora (lines of
 * simulator commands inserted anywhere in any case and indentation, lines duplicated, dropped or swapped,
 * characters flipped, control and non-ASCII characters, line-break styles). For every one the reader either
 * refuses it with a {@link CardFormatException} whose message is one printable line starting with the source name,
 * or accepts it; and it accepts only what an independent check finds to be a card: after comments, every statement
 * line is the one {@code .model} line or a {@code +} continuation of it. What it accepts becomes a deck statement
 * of the expected shape only. No other exception may escape.
 */
class CardReaderFuzzTest {
    private static final long SEED = 20261203L;
    private static final int MUTATIONS = 3000;

    private static final List<String> HOSTILE_LINES = List.of(".control", ".endc", "shell touch CANARY",
            ".include other.lib", ".inc other.lib", ".lib other.lib tt", ".system touch CANARY", "!touch CANARY",
            ".!touch CANARY", "R99 a 0 10", ".param x=1", ".end", ".model dsecond D(IS=1n)", "echo 1 2 3 4",
            ".options gmin=1", ".op", "V9 a 0 DC 1", "X1 a 0 sub", ".subckt sub a b", ".ends", "+ .control",
            "+ R99 a 0 10", "* a comment", "", "   ", "+ N=1.5", "+ )", "+ (", "; inline only", "$ dollar only");
    private static final Pattern DECK_STATEMENT = Pattern.compile(
            "\\.model [A-Za-z][A-Za-z0-9_.+-]* D\\(\\n(\\+ [A-Za-z][A-Za-z0-9_]*=-?[0-9]+\\.[0-9]+(E-?[0-9]+)?\\n)*\\+ \\)\\n");

    private static List<String> seeds() throws IOException {
        List<String> out = new ArrayList<>();
        for (Path dir : List.of(Fixtures.cards(), Fixtures.cards().resolveSibling("hostile").resolve("cards"))) {
            try (Stream<Path> s = Files.list(dir)) {
                for (Path f : s.filter(p -> !p.toString().endsWith(".md")).sorted().toList()) {
                    out.add(Files.readString(f, StandardCharsets.UTF_8));
                }
            }
        }
        return out;
    }

    @Test
    void everyMutationIsReadAsACardOrRefusedWithOneLine() throws IOException {
        List<String> seeds = seeds();
        assertTrue(seeds.size() > 30, "corpus too small: " + seeds.size());
        Random random = new Random(SEED);
        CardReader reader = new CardReader();
        int accepted = 0;
        int refused = 0;
        for (int i = 0; i < MUTATIONS; i++) {
            String text = mutate(seeds.get(random.nextInt(seeds.size())), random);
            String source = "fuzz-" + i + ".lib";
            ParsedCard card;
            try {
                card = reader.parse(text, source, Dialect.values()[random.nextInt(Dialect.values().length)]);
            } catch (CardFormatException e) {
                refused++;
                String m = e.getMessage();
                assertTrue(m.startsWith(source + ":") || m.startsWith(source + " "), "names the source: " + m);
                assertTrue(m.chars().allMatch(c -> c >= 0x20 && c < 0x7f), "one printable line: " + m);
                continue;
            } catch (RuntimeException e) {
                fail("mutation " + i + " escaped as " + e + "\n" + text);
                return;
            }
            accepted++;
            assertTrue(isOneModelStatement(text), "accepted a text that is not one .model statement:\n" + text);
            CardUnderTest cut = Engines.underTest(card, Dialect.NGSPICE);
            assertTrue(DECK_STATEMENT.matcher(cut.modelStatement()).matches(), cut.modelStatement());
        }
        System.out.printf(Locale.ROOT, "card reader fuzz: %d mutations, %d accepted, %d refused%n", MUTATIONS,
                accepted, refused);
        assertEquals(MUTATIONS, accepted + refused);
        assertTrue(accepted > 0 && refused > 0, "the mutations exercise both outcomes");
    }

    /**
     * The independent check: strip comment lines and inline comments; the remaining non-blank lines must be one
     * line starting with {@code .model} (any case) followed only by lines starting with {@code +}.
     */
    private static boolean isOneModelStatement(String text) {
        String body = text.startsWith("\uFEFF") ? text.substring(1) : text;
        boolean seenModel = false;
        for (String line : body.split("\r\n|\r|\n", -1)) {
            String t = line.strip();
            if (t.startsWith("*")) {
                continue;
            }
            for (String marker : new String[] {";", "$", "//"}) {
                int at = t.indexOf(marker);
                if (at >= 0) {
                    t = t.substring(0, at).strip();
                }
            }
            if (t.isEmpty()) {
                continue;
            }
            if (!seenModel) {
                if (!t.toLowerCase(Locale.ROOT).startsWith(".model")) {
                    return false;
                }
                seenModel = true;
            } else if (!t.startsWith("+")) {
                return false;
            }
        }
        return seenModel;
    }

    private static String mutate(String seed, Random r) {
        List<String> lines = new ArrayList<>(List.of(seed.split("\n", -1)));
        int steps = 1 + r.nextInt(3);
        for (int s = 0; s < steps; s++) {
            int at = r.nextInt(lines.size() + 1);
            switch (r.nextInt(9)) {
                case 0, 1 -> lines.add(at, indentAndCase(HOSTILE_LINES.get(r.nextInt(HOSTILE_LINES.size())), r));
                case 2 -> {
                    if (!lines.isEmpty()) {
                        lines.remove(Math.min(at, lines.size() - 1));
                    }
                }
                case 3 -> {
                    if (!lines.isEmpty()) {
                        lines.add(at, lines.get(r.nextInt(lines.size())));
                    }
                }
                case 4 -> lines.add(at, "\u0000\u001b[2J\u2028\u00e9\r" + (char) (r.nextInt(0x7f)));
                case 5, 6 -> {
                    if (!lines.isEmpty()) {
                        int k = r.nextInt(lines.size());
                        lines.set(k, flip(lines.get(k), r));
                    }
                }
                case 7 -> {
                    if (lines.size() > 1) {
                        int a = r.nextInt(lines.size());
                        int b = r.nextInt(lines.size());
                        String t = lines.get(a);
                        lines.set(a, lines.get(b));
                        lines.set(b, t);
                    }
                }
                default -> {
                    if (!lines.isEmpty()) {
                        int k = r.nextInt(lines.size());
                        lines.set(k, lines.get(k) + " " + indentAndCase(HOSTILE_LINES.get(r.nextInt(HOSTILE_LINES.size())), r).strip());
                    }
                }
            }
        }
        String sep = List.of("\n", "\r\n", "\r").get(r.nextInt(3));
        return String.join(sep, lines);
    }

    private static String indentAndCase(String line, Random r) {
        String cased = switch (r.nextInt(3)) {
            case 0 -> line.toUpperCase(Locale.ROOT);
            case 1 -> line.toLowerCase(Locale.ROOT);
            default -> line;
        };
        return " ".repeat(r.nextInt(3)) + (r.nextBoolean() ? "\t" : "") + cased;
    }

    private static String flip(String line, Random r) {
        if (line.isEmpty()) {
            return "(";
        }
        StringBuilder sb = new StringBuilder(line);
        int k = r.nextInt(sb.length());
        String pool = "()=+-.,;$*/!eE0123456789 \tD";
        switch (r.nextInt(3)) {
            case 0 -> sb.setCharAt(k, pool.charAt(r.nextInt(pool.length())));
            case 1 -> sb.deleteCharAt(k);
            default -> sb.insert(k, pool.charAt(r.nextInt(pool.length())));
        }
        return sb.toString();
    }
}
