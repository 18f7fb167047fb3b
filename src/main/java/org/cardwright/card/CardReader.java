package org.cardwright.card;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.stream.Collectors;
import org.cardwright.card.CardText.Comment;
import org.cardwright.card.CardText.Statement;
import org.cardwright.card.CardText.Token;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * Reads diode {@code .model} cards from text: a card file or a netlist fragment.
 *
 * <p>Every line counts; there is no title line to skip. Accepted: {@code *} comment lines, inline comments after
 * {@code ;}, {@code $} or {@code //}, {@code +} continuation lines, parentheses or none, any letter case,
 * {@code key=value} with or without blanks around {@code =}, SPICE suffixes and the dialect's aliases. Statements
 * other than {@code .model} are passed over. Values become SI at this boundary (TNOM: degrees C to kelvin), and
 * take their ngspice 39 meaning ({@link Dialect#fromCard}: a gnucap card's XTI is read as N times the value).
 *
 * <p>A keyword that is not a parameter the dialect carries is not taken; it is reported, with its value as
 * written, in {@link ParsedCard#notices()}. Faults are a {@link CardFormatException} naming source, line and text.
 */
public final class CardReader {
    private static final String MODEL_KEYWORD = ".MODEL";
    private static final String DIODE_TYPE = "D";

    /** Reads the one card in {@code path}; see {@link #parse(String, String, Dialect)}. */
    public ParsedCard read(Path path, Dialect dialect) throws IOException {
        return parse(Files.readString(path, StandardCharsets.UTF_8), path.toString(), dialect);
    }

    /** Reads the card called {@code name} in {@code path}, or its only card when no name is given. */
    public ParsedCard read(Path path, Dialect dialect, Optional<String> name) throws IOException {
        return parse(Files.readString(path, StandardCharsets.UTF_8), path.toString(), dialect, name);
    }

    /** Reads every card in {@code path}, in file order. */
    public List<ParsedCard> readAll(Path path, Dialect dialect) throws IOException {
        return parseAll(Files.readString(path, StandardCharsets.UTF_8), path.toString(), dialect);
    }

    /**
     * Reads the one card in {@code text}.
     *
     * @param sourceName the file name or label used in notices and errors
     * @throws CardFormatException when the text holds no card or more than one, or a card is malformed
     */
    public ParsedCard parse(String text, String sourceName, Dialect dialect) {
        return parse(text, sourceName, dialect, Optional.empty());
    }

    /**
     * Reads the card called {@code name} (any letter case, as SPICE compares names), or the only card when
     * {@code name} is empty.
     *
     * @throws CardFormatException when no card matches, or the name is empty and there are several cards
     */
    public ParsedCard parse(String text, String sourceName, Dialect dialect, Optional<String> name) {
        List<ParsedCard> cards = parseAll(text, sourceName, dialect);
        if (name.isPresent()) {
            String wanted = name.get();
            return cards.stream().filter(c -> c.name().equalsIgnoreCase(wanted)).findFirst()
                    .orElseThrow(() -> new CardFormatException(sourceName, 0,
                            "no .model named " + wanted + " (found: " + names(cards) + ")", null));
        }
        if (cards.size() > 1) {
            throw new CardFormatException(sourceName, 0,
                    cards.size() + " .model cards (" + names(cards) + "); choose one by name", null);
        }
        return cards.get(0);
    }

    /**
     * Reads every diode card in {@code text}, in order. A comment line belongs to the next card, or to the last
     * card when no card follows it.
     *
     * @throws CardFormatException when there is no {@code .model} line, a model is not a diode, a name repeats, or
     *     a card is malformed
     */
    public List<ParsedCard> parseAll(String text, String sourceName, Dialect dialect) {
        Objects.requireNonNull(text, "text");
        Objects.requireNonNull(sourceName, "sourceName");
        Objects.requireNonNull(dialect, "dialect");
        CardText.Layout layout = CardText.split(text, sourceName);
        List<Statement> models = layout.statements().stream()
                .filter(s -> s.tokens().get(0).text().toUpperCase(Locale.ROOT).equals(MODEL_KEYWORD))
                .toList();
        if (models.isEmpty()) {
            throw new CardFormatException(sourceName, 0, "no .model line", null);
        }
        List<ParsedCard> cards = new ArrayList<>();
        Map<String, Integer> seenNames = new HashMap<>();
        int previousEnd = 0;
        for (int k = 0; k < models.size(); k++) {
            Statement model = models.get(k);
            int commentsUpTo = k == models.size() - 1 ? Integer.MAX_VALUE : model.lastLine();
            List<String> comments = commentsBetween(layout.comments(), previousEnd, commentsUpTo);
            ParsedCard card = readModel(model, comments, sourceName, dialect);
            Integer earlier = seenNames.putIfAbsent(card.name().toUpperCase(Locale.ROOT), model.firstLine());
            if (earlier != null) {
                throw new CardFormatException(sourceName, model.firstLine(),
                        "model name already used on line " + earlier + ":", card.name());
            }
            cards.add(card);
            previousEnd = model.lastLine();
        }
        return List.copyOf(cards);
    }

    private static List<String> commentsBetween(List<Comment> comments, int afterLine, int upToLine) {
        return comments.stream().filter(c -> c.line() > afterLine && c.line() <= upToLine)
                .map(Comment::text).toList();
    }

    private static ParsedCard readModel(Statement model, List<String> comments, String source, Dialect dialect) {
        List<Token> tokens = model.tokens();
        Token keyword = tokens.get(0);
        if (tokens.size() < 2) {
            throw new CardFormatException(source, keyword.line(), ".model line without a model name:",
                    keyword.text());
        }
        Token name = tokens.get(1);
        if (!ModelCard.isSpiceIdentifier(name.text())) {
            throw new CardFormatException(source, name.line(), "model name is not a SPICE identifier:", name.text());
        }
        if (tokens.size() < 3 || (tokens.size() > 3 && tokens.get(3).text().equals("="))) {
            Token after = tokens.size() < 3 ? name : tokens.get(2);
            throw new CardFormatException(source, after.line(),
                    "no device type after the model name " + name.text() + " at", after.text());
        }
        Token type = tokens.get(2);
        if (!type.text().equalsIgnoreCase(DIODE_TYPE)) {
            throw new CardFormatException(source, type.line(),
                    "model " + name.text() + " is not a diode (type D); its type is", type.text());
        }
        EnumMap<Param, Double> values = new EnumMap<>(Param.class);
        Map<Param, Token> givenAt = new EnumMap<>(Param.class);
        List<String> notices = new ArrayList<>();
        int i = 3;
        while (i < tokens.size()) {
            Token key = tokens.get(i);
            if (key.text().equals("=")) {
                throw new CardFormatException(source, key.line(), "'=' without a parameter name before it in",
                        rawAround(tokens, i));
            }
            if (i + 1 >= tokens.size() || !tokens.get(i + 1).text().equals("=")) {
                throw new CardFormatException(source, key.line(), "expected name=value, found", key.text());
            }
            if (i + 2 >= tokens.size() || tokens.get(i + 2).text().equals("=")) {
                throw new CardFormatException(source, key.line(), "no value after", key.text() + "=");
            }
            Token value = tokens.get(i + 2);
            String raw = key.text() + "=" + value.text();
            take(key, value, raw, source, dialect, values, givenAt, notices);
            i += 3;
        }
        // back to ngspice meaning (a gnucap card's XTI is XTI/N): the rest of the program sees nothing else
        return new ParsedCard(name.text(), dialect.fromCard(DiodeParameters.of(values)), notices, comments);
    }

    private static void take(Token key, Token value, String raw, String source, Dialect dialect,
            EnumMap<Param, Double> values, Map<Param, Token> givenAt, List<String> notices) {
        String where = source + ":" + key.line() + ": ";
        Optional<Param> resolved = dialect.resolve(key.text());
        if (resolved.isEmpty()) {
            notices.add(where + noticeFor(key.text(), raw, dialect));
            return;
        }
        Param p = resolved.get();
        Token earlier = givenAt.get(p);
        if (earlier != null) {
            throw new CardFormatException(source, key.line(), p.keyword() + " already given as " + earlier.text()
                    + " on line " + earlier.line() + "; repeated as", raw);
        }
        double cardValue;
        try {
            cardValue = SpiceNumbers.parse(value.text());
        } catch (NumberFormatException e) {
            throw new CardFormatException(source, value.line(), "not a number:", raw);
        }
        double si = p.fromCardValue(cardValue);
        try {
            DiodeParameters.defaults().with(p, si);
        } catch (IllegalArgumentException e) {
            throw new CardFormatException(source, value.line(), "value out of range (" + e.getMessage() + "):", raw);
        }
        values.put(p, si);
        givenAt.put(p, key);
    }

    private static String noticeFor(String keyword, String raw, Dialect dialect) {
        Optional<Param> elsewhere = Dialect.NGSPICE.resolve(keyword);
        if (elsewhere.isPresent() && dialect.carries(elsewhere.get())) {
            return "'" + raw + "' is not a " + dialect.simulator() + " spelling of " + elsewhere.get().keyword()
                    + "; ignored";
        }
        if (elsewhere.isPresent()) {
            return "'" + raw + "' (" + elsewhere.get().keyword() + ") is not carried by " + dialect.simulator()
                    + "; ignored";
        }
        if (dialect.isKnownUnsupported(keyword)) {
            return "'" + raw + "' is known to " + dialect.simulator() + " but not modelled by cardwright; ignored";
        }
        return "unknown parameter '" + raw + "' for " + dialect.simulator() + "; ignored";
    }

    private static String rawAround(List<Token> tokens, int index) {
        int from = Math.max(0, index - 1);
        int to = Math.min(tokens.size(), index + 2);
        return tokens.subList(from, to).stream().map(Token::text).collect(Collectors.joining(" "));
    }

    private static String names(List<ParsedCard> cards) {
        return cards.stream().map(ParsedCard::name).collect(Collectors.joining(", "));
    }
}
