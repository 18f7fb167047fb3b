package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Written cards go through the real simulators: ngspice 39 for every dialect (each is a subset of what ngspice
 * reads) and gnucap for the gnucap dialect. A card must load with no warning, and ngspice must read back the
 * value each line states. The hand-written corpus is read by ngspice too and compared with our reader.
 */
class CardSimulatorTest {
    /**
     * Relative agreement between ngspice's reading of a number and ours [1]: ngspice multiplies by powers of ten
     * in double arithmetic and may land a few ulp from the nearest double.
     */
    private static final double NGSPICE_READ_TOLERANCE = 1e-14;
    /**
     * Relative distance allowed between ngspice's value and the card's own value [1]: rounding to 15 significant
     * digits moves a value by at most 5e-15 relative, plus ngspice's reading error above.
     */
    private static final double WRITTEN_VALUE_TOLERANCE = 5e-15 + NGSPICE_READ_TOLERANCE;
    /** Digits for the written cards: the documented upper limit, the hardest case for a reader. */
    private static final int DIGITS = 15;

    private static final List<String> NGSPICE_COMPLAINTS = List.of("warning", "unrecognized", "error");
    private static final List<String> GNUCAP_COMPLAINTS = List.of("bad parameter", "no match", "error");
    private static final Pattern PRINTED = Pattern.compile("@([\\w]+)\\[(\\w+)\\] = (\\S+)");

    @TempDir
    Path folder;

    private static List<ModelCard> cards() {
        List<ModelCard> cards = new ArrayList<>(RandomCards.generate(8, 29));
        cards.add(CardWriterTest.switchingDiode());
        cards.add(new ModelCard("dbare", DiodeParameters.defaults(), List.of("Invented card with nothing given")));
        cards.add(new ModelCard("d_odd.name-1+x", DiodeParameters.defaults().with(Param.IS, 3.3e-12)
                .with(Param.N, 1.2), List.of("Invented card whose name uses every allowed punctuation mark")));
        return cards;
    }

    @ParameterizedTest
    // Xyce cards use Xyce keywords (TBV1) that ngspice does not read; Xyce itself is not installed here
    @EnumSource(value = Dialect.class, names = {"NGSPICE", "SPICE3", "GNUCAP"})
    void everyWrittenCardLoadsInNgspiceWithoutWarningAndReadsBackItsValues(Dialect dialect) throws Exception {
        ExternalSimulator ngspice = ExternalSimulator.ngspice();
        CardWriter writer = new CardWriter(Optional.empty());
        StringBuilder deck = new StringBuilder("written cards, " + dialect.shortName() + " dialect\n");
        StringBuilder print = new StringBuilder();
        Map<String, Map<Param, String>> written = new HashMap<>();
        Map<String, ModelCard> originals = new HashMap<>();
        List<ModelCard> cards = cards();
        for (int i = 0; i < cards.size(); i++) {
            ModelCard card = cards.get(i);
            CardWriter.Rendered rendered = writer.render(card, dialect, DIGITS);
            Path cardFile = folder.resolve("card" + i + ".mod");
            Files.writeString(cardFile, rendered.text(), StandardCharsets.UTF_8);
            deck.append(".include ").append(cardFile.getFileName()).append('\n');
            deck.append("I").append(i).append(" 0 n").append(i).append(" DC 1m\n");
            deck.append("D").append(i).append(" n").append(i).append(" 0 ").append(card.name()).append('\n');
            if (card.name().matches("\\w+")) { // ngspice's print reads - and + in a name as arithmetic
                Map<Param, String> values = cardValues(rendered.text());
                written.put(card.name().toLowerCase(Locale.ROOT), values);
                originals.put(card.name().toLowerCase(Locale.ROOT), card);
                for (Param p : values.keySet()) {
                    print.append("print @").append(card.name()).append('[')
                            .append(p.keyword().toLowerCase(Locale.ROOT)).append("]\n");
                }
            }
        }
        print.append("print v(n").append(cards.size() - 1).append(")\n");
        deck.append(".control\nset numdgt=15\nop\n").append(print).append("quit\n.endc\n.end\n");
        Path netlist = folder.resolve("deck.cir");
        Files.writeString(netlist, deck, StandardCharsets.UTF_8);
        String output = ngspice.runBatch(netlist);
        ExternalSimulator.assertNoneOf(output, NGSPICE_COMPLAINTS, dialect + " cards in ngspice");
        assertTrue(output.contains("v(n" + (cards.size() - 1) + ") = "), "the odd-named diode was solved:\n" + output);

        Map<String, Double> printed = printedValues(output);
        int compared = 0;
        for (Map.Entry<String, Map<Param, String>> card : written.entrySet()) {
            for (Map.Entry<Param, String> line : card.getValue().entrySet()) {
                String key = card.getKey() + "[" + line.getKey().keyword().toLowerCase(Locale.ROOT) + "]";
                Double ngspiceValue = printed.get(key);
                assertNotNull(ngspiceValue, "ngspice printed nothing for " + key);
                double ours = SpiceNumbers.parse(line.getValue());
                assertEquals(ours, ngspiceValue, Math.abs(ours) * NGSPICE_READ_TOLERANCE, key);
                Param p = line.getKey();
                // the card states values in its dialect's meaning (gnucap: XTI/N)
                double original = p.toCardValue(dialect.toCard(originals.get(card.getKey()).parameters()).get(p));
                assertEquals(original, ngspiceValue, Math.abs(original) * WRITTEN_VALUE_TOLERANCE,
                        key + " against the card's own value");
                compared++;
            }
        }
        assertTrue(compared >= 8 * dialect.carriedParameters().size(), "compared " + compared + " values");
    }

    @Test
    void everyWrittenGnucapCardLoadsInGnucap() throws Exception {
        ExternalSimulator gnucap = ExternalSimulator.gnucap();
        CardWriter writer = new CardWriter(Optional.empty());
        StringBuilder deck = new StringBuilder("written cards, gnucap dialect\n");
        List<ModelCard> cards = cards();
        for (int i = 0; i < cards.size(); i++) {
            deck.append(writer.render(cards.get(i), Dialect.GNUCAP, DIGITS).text());
            deck.append("I").append(i).append(" 0 n").append(i).append(" dc 1m\n");
            deck.append("D").append(i).append(" n").append(i).append(" 0 ").append(cards.get(i).name()).append('\n');
        }
        deck.append(".print op v(n0) v(n").append(cards.size() - 1).append(")\n.op 27\n.end\n");
        Path netlist = folder.resolve("deck.ckt");
        Files.writeString(netlist, deck, StandardCharsets.UTF_8);
        String output = gnucap.runBatch(netlist);
        ExternalSimulator.assertNoneOf(output, GNUCAP_COMPLAINTS, "gnucap cards in gnucap");
        // the op line: temperature then two node voltages, each a number
        assertTrue(output.lines().anyMatch(l -> l.trim().matches("27\\.\\s+\\S+\\s+\\S+")), output);
    }

    @Test
    void ngspiceReadsTheCorpusAsOurReaderDoes() throws Exception {
        ExternalSimulator ngspice = ExternalSimulator.ngspice();
        CardReader reader = new CardReader();
        List<String> files = List.of("one-line.mod", "continuation.mod", "lower-no-parens.mod",
                "mixed-case-units.mod", "aliases.mod", "unknown-parameter.mod", "exponent-forms.mod",
                "recombination-knee.mod", "schottky-tnom.mod", "spice3-classic.mod");
        StringBuilder deck = new StringBuilder("corpus read by ngspice\n");
        StringBuilder print = new StringBuilder();
        Map<String, DiodeParameters> ours = new HashMap<>();
        int diode = 0;
        for (String file : files) {
            deck.append(".include ").append(Fixtures.card(file)).append('\n');
            for (ParsedCard card : List.of(reader.read(Fixtures.card(file), Dialect.NGSPICE))) {
                String name = card.name().toLowerCase(Locale.ROOT);
                ours.put(name, card.parameters());
                deck.append("I").append(diode).append(" 0 n").append(diode).append(" DC 1m\n");
                deck.append("D").append(diode).append(" n").append(diode).append(" 0 ").append(name).append('\n');
                diode++;
                for (Param p : card.parameters().givenParameters()) {
                    print.append("print @").append(name).append('[').append(p.keyword().toLowerCase(Locale.ROOT))
                            .append("]\n");
                }
            }
        }
        deck.append(".control\nset numdgt=15\nop\n").append(print).append("quit\n.endc\n.end\n");
        Path netlist = folder.resolve("corpus.cir");
        Files.writeString(netlist, deck, StandardCharsets.UTF_8);
        Map<String, Double> printed = printedValues(ngspice.runBatch(netlist));
        int compared = 0;
        for (Map.Entry<String, DiodeParameters> card : ours.entrySet()) {
            for (Param p : card.getValue().givenParameters()) {
                String key = card.getKey() + "[" + p.keyword().toLowerCase(Locale.ROOT) + "]";
                Double ngspiceValue = printed.get(key);
                assertNotNull(ngspiceValue, "ngspice printed nothing for " + key);
                double expected = p.toCardValue(card.getValue().get(p));
                assertEquals(expected, ngspiceValue, Math.abs(expected) * NGSPICE_READ_TOLERANCE, key);
                compared++;
            }
        }
        assertTrue(compared > 60, "compared " + compared + " values");
    }

    private static Map<Param, String> cardValues(String text) {
        Map<Param, String> values = new HashMap<>();
        Matcher m = Pattern.compile("^\\+ (\\w+)=(\\S+)$", Pattern.MULTILINE).matcher(text);
        while (m.find()) {
            values.put(Param.byKeyword(m.group(1)).orElseThrow(), m.group(2));
        }
        return values;
    }

    private static Map<String, Double> printedValues(String output) {
        Map<String, Double> printed = new HashMap<>();
        Matcher m = PRINTED.matcher(output);
        while (m.find()) {
            printed.put(m.group(1).toLowerCase(Locale.ROOT) + "[" + m.group(2).toLowerCase(Locale.ROOT) + "]",
                    Double.parseDouble(m.group(3)));
        }
        return printed;
    }
}
