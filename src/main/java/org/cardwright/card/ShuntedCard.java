package org.cardwright.card;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import org.cardwright.card.CardText.Statement;
import org.cardwright.card.CardText.Token;

/**
 * The card of a diode with a resistor between its terminals (surface leakage, a cell's shunt): a subcircuit
 * that holds the diode, its {@code .model} and the resistor. {@code fit} writes it beside the plain card as
 * {@code NAME.shunted.DIALECT.lib}:
 *
 * <pre>
 * * comment lines
 * .subckt NAME_SHUNTED A K
 * DJ A K NAME
 * RSH A K 150k
 * .model NAME D(
 * + ...
 * + )
 * .ends NAME_SHUNTED
 * </pre>
 *
 * <p>Port A is the anode, K the cathode. {@link #read} is strict: it accepts exactly that shape (comment lines
 * anywhere; the diode and resistor lines in either order; the resistor's nodes either way round; any letter
 * case) and refuses everything else with the file, the line and the text at fault. The {@code .model} inside is
 * read by {@link CardReader}, so it obeys the same rules as a plain card.
 */
public final class ShuntedCard {
    /** The part of the file name between the model name and the dialect. */
    public static final String FILE_TAG = "shunted";
    /** Suffix of the subcircuit's name after the model name. */
    public static final String SUBCIRCUIT_SUFFIX = "_SHUNTED";
    /** The anode port. */
    public static final String ANODE = "A";
    /** The cathode port. */
    public static final String CATHODE = "K";
    /** The diode instance inside the subcircuit. */
    public static final String DIODE = "DJ";
    /** The resistor instance inside the subcircuit. */
    public static final String RESISTOR = "RSH";

    private static final String SUBCKT = ".SUBCKT";
    private static final String ENDS = ".ENDS";
    private static final String MODEL = ".MODEL";

    private ShuntedCard() {
    }

    /** {@code NAME.shunted.DIALECT.lib}. */
    public static String fileName(String model, Dialect dialect) {
        return model + "." + FILE_TAG + "." + dialect.shortName() + ".lib";
    }

    /** The subcircuit's name for model {@code model}. */
    public static String subcircuitName(String model) {
        return model + SUBCIRCUIT_SUFFIX;
    }

    /**
     * The subcircuit file: {@code header} as comment lines, then the subcircuit holding the diode, the resistor
     * and the {@code .model} statement of {@code plainCard} (the plain card's text as written; its own comment
     * lines stay in the plain card).
     *
     * @param resistance the resistor [ohm]
     * @param digits     significant digits of the resistance, as for the card's parameters
     */
    public static String render(String model, String plainCard, double resistance, List<String> header, int digits) {
        if (!(resistance > 0) || !Double.isFinite(resistance)) {
            throw new IllegalArgumentException("a shunt resistance must be positive and finite, got " + resistance);
        }
        StringBuilder sb = new StringBuilder();
        for (String line : header) {
            sb.append('*').append(line.isEmpty() ? "" : " " + line).append('\n');
        }
        String sub = subcircuitName(model);
        sb.append(".subckt ").append(sub).append(' ').append(ANODE).append(' ').append(CATHODE).append('\n');
        sb.append(DIODE).append(' ').append(ANODE).append(' ').append(CATHODE).append(' ').append(model).append('\n');
        sb.append(RESISTOR).append(' ').append(ANODE).append(' ').append(CATHODE).append(' ')
                .append(SpiceNumbers.format(resistance, digits)).append('\n');
        boolean inModel = false;
        for (String line : plainCard.split("\n", -1)) {
            if (!inModel && line.stripLeading().toUpperCase(Locale.ROOT).startsWith(MODEL)) {
                inModel = true;
            }
            if (inModel && !line.isEmpty()) {
                sb.append(line).append('\n');
            }
        }
        if (!inModel) {
            throw new IllegalArgumentException("the plain card holds no .model line");
        }
        sb.append(".ends ").append(sub).append('\n');
        return sb.toString();
    }

    /** True when the first statement of {@code text} is a {@code .subckt}: a subcircuit card, for {@link #read}. */
    public static boolean isSubcircuit(String text, String source) {
        return startsWithSubcircuit(CardText.split(text, source).statements());
    }

    private static boolean startsWithSubcircuit(List<Statement> st) {
        return !st.isEmpty() && st.get(0).tokens().get(0).text().equalsIgnoreCase(SUBCKT);
    }

    /**
     * What a subcircuit card gives.
     *
     * @param card            the {@code .model} inside, as {@link CardReader} reads it
     * @param shuntResistance the resistor between the ports [ohm]
     * @param subcircuit      the subcircuit's name as written
     * @param modelText       the lines of the {@code .model} statement, as written
     */
    public record Read(ParsedCard card, double shuntResistance, String subcircuit, String modelText) {
    }

    /**
     * Reads a subcircuit card strictly (see the class comment).
     *
     * @throws CardFormatException naming the source, the line and the text at fault
     */
    public static Read read(String text, String source, Dialect dialect) {
        Objects.requireNonNull(text, "text");
        return read(text, CardText.split(text, source), source, dialect);
    }

    /**
     * A card file that is either kind: a subcircuit card when its first statement is a {@code .subckt}
     * ({@link #isSubcircuit}), else a plain card.
     *
     * @param card       the diode's card: the {@code .model} inside the subcircuit, or the plain card
     * @param subcircuit the subcircuit as {@link #read} reads it, when the file is one
     */
    public record Either(ParsedCard card, Optional<Read> subcircuit) {
    }

    /**
     * Reads {@code text} as {@link #isSubcircuit} tells it: a subcircuit card through {@link #read}, else a plain card
     * through {@link CardReader#parse(String, String, Dialect, Optional)} with {@code plainName} (the name a plain card
     * must carry, when given); the same results and refusals as those calls one after the other, with the text split
     * into statements once.
     */
    public static Either readEither(String text, String source, Dialect dialect, Optional<String> plainName) {
        Objects.requireNonNull(text, "text");
        Objects.requireNonNull(source, "sourceName");
        Objects.requireNonNull(dialect, "dialect");
        CardText.Layout layout = CardText.split(text, source);
        if (startsWithSubcircuit(layout.statements())) {
            Read sub = read(text, layout, source, dialect);
            return new Either(sub.card(), Optional.of(sub));
        }
        return new Either(new CardReader().parse(layout, source, dialect, plainName), Optional.empty());
    }

    private static Read read(String text, CardText.Layout layout, String source, Dialect dialect) {
        List<Statement> st = layout.statements();
        if (st.isEmpty() || !keyword(st.get(0)).equals(SUBCKT)) {
            throw new CardFormatException(source, st.isEmpty() ? 0 : st.get(0).firstLine(),
                    "a shunted card starts with .subckt NAME A K; found", st.isEmpty() ? null : raw(st.get(0)));
        }
        Statement head = st.get(0);
        if (head.tokens().size() != 4) {
            throw new CardFormatException(source, head.firstLine(),
                    "a shunted card's .subckt line has a name and exactly two ports (anode, cathode):", raw(head));
        }
        String sub = head.tokens().get(1).text();
        String anode = head.tokens().get(2).text();
        String cathode = head.tokens().get(3).text();
        if (!ModelCard.isSpiceIdentifier(sub)) {
            throw new CardFormatException(source, head.firstLine(), "subcircuit name is not a SPICE identifier:", sub);
        }
        if (anode.equalsIgnoreCase(cathode) || anode.equals("0") || cathode.equals("0")) {
            throw new CardFormatException(source, head.firstLine(), "the two ports must be distinct nodes other than 0:", raw(head));
        }
        Statement diode = null;
        Statement resistor = null;
        Statement model = null;
        Statement ends = null;
        for (int i = 1; i < st.size(); i++) {
            Statement s = st.get(i);
            String k = keyword(s);
            if (ends != null) {
                throw new CardFormatException(source, s.firstLine(), "nothing but comments may follow .ends; found", raw(s));
            }
            if (k.equals(ENDS)) {
                if (s.tokens().size() > 2 || (s.tokens().size() == 2 && !s.tokens().get(1).text().equalsIgnoreCase(sub))) {
                    throw new CardFormatException(source, s.firstLine(), ".ends must close subcircuit " + sub + ":", raw(s));
                }
                ends = s;
            } else if (k.equals(MODEL)) {
                model = once(model, s, source, "a second .model");
            } else if (k.startsWith("D")) {
                diode = once(diode, s, source, "a second diode");
            } else if (k.startsWith("R")) {
                resistor = once(resistor, s, source, "a second resistor");
            } else {
                throw new CardFormatException(source, s.firstLine(),
                        "a shunted card holds only .subckt, one diode, one resistor, the .model and .ends; found", raw(s));
            }
        }
        if (ends == null) {
            throw new CardFormatException(source, 0, "no .ends closing subcircuit", sub);
        }
        if (diode == null || resistor == null || model == null) {
            throw new CardFormatException(source, 0, "subcircuit " + sub + " lacks "
                    + (diode == null ? "its diode line" : resistor == null ? "its resistor line" : "its .model"), null);
        }
        // the .model, read by the card reader with every other line blanked, so that its line numbers stay true
        String[] lines = CardText.lines(text);
        StringBuilder only = new StringBuilder();
        StringBuilder modelText = new StringBuilder();
        for (int n = 1; n <= lines.length; n++) {
            String line = lines[n - 1];
            boolean inModel = n >= model.firstLine() && n <= model.lastLine();
            boolean comment = line.stripLeading().startsWith("*");
            only.append(inModel || comment ? line : "").append('\n');
            if (inModel) {
                modelText.append(line).append('\n');
            }
        }
        ParsedCard card = new CardReader().parse(only.toString(), source, dialect);

        List<Token> d = diode.tokens();
        if (d.size() != 4 || !d.get(1).text().equalsIgnoreCase(anode) || !d.get(2).text().equalsIgnoreCase(cathode)) {
            throw new CardFormatException(source, diode.firstLine(),
                    "the diode line must read D<name> " + anode + " " + cathode + " <model>; found", raw(diode));
        }
        if (!d.get(3).text().equalsIgnoreCase(card.name())) {
            throw new CardFormatException(source, diode.firstLine(),
                    "the diode must use the model " + card.name() + " defined in the file; found", raw(diode));
        }
        List<Token> r = resistor.tokens();
        boolean forward = r.size() == 4 && r.get(1).text().equalsIgnoreCase(anode) && r.get(2).text().equalsIgnoreCase(cathode);
        boolean backward = r.size() == 4 && r.get(1).text().equalsIgnoreCase(cathode) && r.get(2).text().equalsIgnoreCase(anode);
        if (!forward && !backward) {
            throw new CardFormatException(source, resistor.firstLine(),
                    "the resistor line must read R<name> " + anode + " " + cathode + " <ohms>; found", raw(resistor));
        }
        double ohms;
        try {
            ohms = SpiceNumbers.parse(r.get(3).text());
        } catch (NumberFormatException e) {
            throw new CardFormatException(source, resistor.firstLine(), "the resistance is not a number:", raw(resistor));
        }
        if (!(ohms > 0) || !Double.isFinite(ohms)) {
            throw new CardFormatException(source, resistor.firstLine(), "the resistance must be positive and finite:", raw(resistor));
        }
        return new Read(card, ohms, sub, modelText.toString());
    }

    private static Statement once(Statement seen, Statement s, String source, String what) {
        if (seen != null) {
            throw new CardFormatException(source, s.firstLine(),
                    what + " (the first is on line " + seen.firstLine() + "):", raw(s));
        }
        return s;
    }

    private static String keyword(Statement s) {
        return s.tokens().get(0).text().toUpperCase(Locale.ROOT);
    }

    private static String raw(Statement s) {
        List<String> parts = new ArrayList<>();
        for (Token t : s.tokens()) {
            parts.add(t.text());
        }
        return String.join(" ", parts);
    }
}
