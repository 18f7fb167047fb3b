package org.cardwright.card;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Collectors;
import org.cardwright.card.CardText.Comment;
import org.cardwright.card.CardText.Statement;
import org.cardwright.card.CardText.Token;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * The plain card file: exactly one {@code .model NAME D(...)} statement with its {@code +} continuations, and
 * comment and blank lines anywhere. The statement is {@code .model}, a SPICE identifier, the type {@code D}, then
 * {@code key=value} pairs, either all inside one pair of parentheses that opens right after the type and closes
 * last, or with no parentheses at all. Any other statement, before or after, is refused.
 */
final class ModelForm implements CardForm {
    static final String MODEL_KEYWORD = ".MODEL";
    private static final String DIODE_TYPE = "D";
    /** A parameter keyword: a letter, then letters, digits and underscores (BV_MAX, TM1). */
    private static final java.util.regex.Pattern PARAMETER_NAME = java.util.regex.Pattern.compile("[A-Za-z][A-Za-z0-9_]*");

    @Override
    public String openingKeyword() {
        return MODEL_KEYWORD;
    }

    @Override
    public ParsedCard read(CardText.Layout layout, String source, Dialect dialect) {
        List<Statement> statements = layout.statements();
        if (statements.size() > 1) {
            throw CardReader.refuse(source, statements.get(1), "after the .model statement");
        }
        List<String> comments = layout.comments().stream().map(Comment::text).toList();
        return readModel(statements.get(0), comments, source, dialect);
    }

    /** Reads one {@code .model} statement into a card; used by this form and by forms that hold a model. */
    static ParsedCard readModel(Statement model, List<String> comments, String source, Dialect dialect) {
        List<Token> tokens = model.tokens();
        Token keyword = tokens.get(0);
        if (tokens.size() < 2 || isParenthesis(tokens.get(1))) {
            throw new CardFormatException(source, keyword.line(), ".model line without a model name:",
                    model.firstLineText());
        }
        Token name = tokens.get(1);
        if (!ModelCard.isSpiceIdentifier(name.text())) {
            throw new CardFormatException(source, name.line(), "model name is not a SPICE identifier:", name.text());
        }
        if (tokens.size() < 3 || isParenthesis(tokens.get(2))
                || (tokens.size() > 3 && tokens.get(3).text().equals("="))) {
            Token after = tokens.size() < 3 ? name : tokens.get(2);
            throw new CardFormatException(source, after.line(),
                    "no device type after the model name " + name.text() + " at", after.text());
        }
        Token type = tokens.get(2);
        if (!type.text().equalsIgnoreCase(DIODE_TYPE)) {
            throw new CardFormatException(source, type.line(),
                    "model " + name.text() + " is not a diode (type D); its type is", type.text());
        }
        int i = 3;
        int end = tokens.size();
        if (i < end && tokens.get(i).text().equals("(")) {
            int close = i + 1;
            while (close < end && !tokens.get(close).text().equals(")")) {
                close++;
            }
            if (close == end) {
                Token last = tokens.get(end - 1);
                throw new CardFormatException(source, last.line(),
                        "the parameter list opened by '(' is not closed; last token", last.text());
            }
            if (close != end - 1) {
                Token after = tokens.get(close + 1);
                throw new CardFormatException(source, after.line(),
                        "text after the ')' that closes the parameter list:", after.text());
            }
            i++;
            end--;
        }
        for (int k = i; k < end; k++) {
            if (isParenthesis(tokens.get(k))) {
                throw new CardFormatException(source, tokens.get(k).line(),
                        "a parenthesis out of place (one pair around all parameters, or none) in", rawAround(tokens, k));
            }
        }
        EnumMap<Param, Double> values = new EnumMap<>(Param.class);
        Map<Param, Token> givenAt = new EnumMap<>(Param.class);
        List<String> notices = new ArrayList<>();
        while (i < end) {
            Token key = tokens.get(i);
            if (key.text().equals("=")) {
                throw new CardFormatException(source, key.line(), "'=' without a parameter name before it in",
                        rawAround(tokens, i));
            }
            if (i + 1 >= end || !tokens.get(i + 1).text().equals("=")) {
                throw new CardFormatException(source, key.line(), "expected name=value, found", key.text());
            }
            if (i + 2 >= end || tokens.get(i + 2).text().equals("=")) {
                throw new CardFormatException(source, key.line(), "no value after", key.text() + "=");
            }
            if (!PARAMETER_NAME.matcher(key.text()).matches()) {
                throw new CardFormatException(source, key.line(), "not a parameter name:", key.text());
            }
            Token value = tokens.get(i + 2);
            String raw = key.text() + "=" + value.text();
            take(key, value, raw, source, dialect, values, givenAt, notices);
            i += 3;
        }
        // back to ngspice meaning (a gnucap card's XTI is XTI/N): the rest of the program sees nothing else
        return new ParsedCard(name.text(), dialect.fromCard(DiodeParameters.of(values)), notices, comments);
    }

    private static boolean isParenthesis(Token t) {
        return t.text().equals("(") || t.text().equals(")");
    }

    private static void take(Token key, Token value, String raw, String source, Dialect dialect,
            EnumMap<Param, Double> values, Map<Param, Token> givenAt, List<String> notices) {
        String where = source + ":" + key.line() + ": ";
        Optional<Param> resolved = dialect.resolve(key.text());
        if (resolved.isEmpty()) {
            notices.add(where + noticeFor(key.text(), CardFormatException.excerpt(raw), dialect));
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
}
