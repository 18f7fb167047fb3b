package org.cardwright.card;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import org.cardwright.card.CardText.Statement;

/**
 * Reads a diode card file. A card is data, never netlist text: the file must be exactly one
 * {@code .model NAME D(...)} statement with its {@code +} continuations, {@code *} comment lines, inline comments
 * after {@code ;}, {@code $} or {@code //}, and blank lines. Anything else, in any letter case, indentation or
 * position (a {@code .control} block, {@code .include}/{@code .lib}, {@code .system}, gnucap's {@code !} and
 * {@code .!} shell lines, an element line such as {@code R99 a 0 10}, any other dot command, a second
 * {@code .model}) is refused with a one-line {@link CardFormatException} naming the file, the line and what the
 * line was (a short, escaped excerpt). What a simulator later receives is written from the parsed name and numbers
 * alone.
 *
 * <p>Within the statement: parentheses around all parameters or none, any letter case, {@code key=value} with or
 * without blanks around {@code =}, SPICE suffixes and the dialect's aliases. Values become SI at this boundary
 * (TNOM: degrees C to kelvin), and take their ngspice 39 meaning ({@link Dialect#fromCard}: a gnucap card's XTI is
 * read as N times the value). A keyword that is not a parameter the dialect carries is not taken; it is reported,
 * with its value as written, in {@link ParsedCard#notices()}.
 *
 * <p>The shapes a file may have are {@link CardForm}s, listed in {@link #FORMS}; a new exactly-shaped form is one
 * more entry there.
 */
public final class CardReader {
    /** Largest card file read [bytes]: a diode card is a few hundred bytes; this bounds work on a hostile file. */
    public static final long MAX_CARD_BYTES = 1L << 20;

    /** The shapes a card file may have, each opened by its own keyword. */
    static final List<CardForm> FORMS = List.of(new ModelForm());

    /** Reads the card in {@code path}; see {@link #parse(String, String, Dialect)}. */
    public ParsedCard read(Path path, Dialect dialect) throws IOException {
        return read(path, path.toString(), dialect, Optional.empty());
    }

    /** Reads the card in {@code path}, which must be called {@code name} when a name is given. */
    public ParsedCard read(Path path, Dialect dialect, Optional<String> name) throws IOException {
        return read(path, path.toString(), dialect, name);
    }

    /**
     * Reads the card in {@code path}, naming it {@code sourceName} in notices and errors. Only a regular file of at
     * most {@link #MAX_CARD_BYTES} in UTF-8 is read.
     *
     * @throws CardFormatException when the file is not a regular file, too large, not UTF-8, or not a card
     * @throws IOException when the file cannot be read
     */
    public ParsedCard read(Path path, String sourceName, Dialect dialect, Optional<String> name) throws IOException {
        return parse(readText(path, sourceName), sourceName, dialect, name);
    }

    /** The text of a card file: a regular file, at most {@link #MAX_CARD_BYTES}, strict UTF-8. */
    public static String readText(Path path, String sourceName) throws IOException {
        if (!Files.exists(path)) {
            throw new java.nio.file.NoSuchFileException(sourceName);
        }
        if (!Files.isRegularFile(path)) {
            throw new CardFormatException(sourceName, 0, "not a regular file (a card is a text file)", null);
        }
        byte[] bytes;
        try (InputStream in = Files.newInputStream(path)) {
            bytes = in.readNBytes((int) MAX_CARD_BYTES + 1);
        }
        if (bytes.length > MAX_CARD_BYTES) {
            throw new CardFormatException(sourceName, 0, "larger than " + MAX_CARD_BYTES
                    + " bytes; a card file holds one .model statement", null);
        }
        try {
            return StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw new CardFormatException(sourceName, 0, "not UTF-8 text", null);
        }
    }

    /**
     * Reads the one card in {@code text}.
     *
     * @param sourceName the file name or label used in notices and errors
     * @throws CardFormatException when the text is not exactly one card, or the card is malformed
     */
    public ParsedCard parse(String text, String sourceName, Dialect dialect) {
        return parse(text, sourceName, dialect, Optional.empty());
    }

    /**
     * Reads the one card in {@code text}; when {@code name} is given, the card must carry that name (any letter
     * case, as SPICE compares names).
     *
     * @throws CardFormatException when the text is not exactly one card, the card is malformed, or it has another
     *     name
     */
    public ParsedCard parse(String text, String sourceName, Dialect dialect, Optional<String> name) {
        Objects.requireNonNull(text, "text");
        Objects.requireNonNull(sourceName, "sourceName");
        Objects.requireNonNull(dialect, "dialect");
        return parse(CardText.split(text, sourceName), sourceName, dialect, name);
    }

    /** {@link #parse(String, String, Dialect, Optional)} of a text already split into its statements and comments. */
    ParsedCard parse(CardText.Layout layout, String sourceName, Dialect dialect, Optional<String> name) {
        if (layout.statements().isEmpty()) {
            throw new CardFormatException(sourceName, 0, "no .model line", null);
        }
        Statement first = layout.statements().get(0);
        CardForm form = FORMS.stream().filter(f -> f.openingKeyword().equals(first.keyword())).findFirst()
                .orElseThrow(() -> refuse(sourceName, first, "before the .model statement"));
        ParsedCard card = form.read(layout, sourceName, dialect);
        if (name.isPresent() && !card.name().equalsIgnoreCase(name.get())) {
            throw new CardFormatException(sourceName, first.firstLine(),
                    "no .model named " + name.get() + "; the card holds", card.name());
        }
        return card;
    }

    /**
     * The refusal of a statement a card file may not hold: names the source, its line, what kind of line it is
     * and a short escaped excerpt, e.g. {@code a.lib:4: refused a simulator control block (.control) after the
     * .model statement: a card file holds one .model statement and comments only '.control'}.
     *
     * @param where where the statement stands, e.g. "after the .model statement"
     */
    static CardFormatException refuse(String source, Statement statement, String where) {
        return new CardFormatException(source, statement.firstLine(), "refused " + kind(statement.keyword()) + " "
                + where + ": a card file holds one .model statement and comments only;", statement.firstLineText());
    }

    /** What a statement is, in a few words, from its first token. */
    static String kind(String keyword) {
        String k = keyword.toUpperCase(Locale.ROOT);
        if (k.startsWith(".CONTROL") || k.startsWith(".ENDC")) {
            return "a simulator control block (" + k.toLowerCase(Locale.ROOT) + ")";
        }
        if (k.equals(".INCLUDE") || k.equals(".INC") || k.equals(".LIB") || k.equals(".ENDL") || k.equals(".GET")) {
            return "a file include (" + k.toLowerCase(Locale.ROOT) + ")";
        }
        if (k.startsWith("!") || k.startsWith(".!") || k.equals(".SYSTEM") || k.equals(".SHELL")) {
            return "a shell command line";
        }
        if (k.equals(ModelForm.MODEL_KEYWORD)) {
            return "a second .model statement";
        }
        if (k.startsWith(".")) {
            return "a dot command";
        }
        if (!k.isEmpty() && Character.isLetter(k.charAt(0))) {
            return "an element or command line";
        }
        return "a line that is not part of a card";
    }
}
