package org.cardwright.card;

/**
 * A card text that cannot be read. The one-line message names the source, the line and the raw text at fault,
 * as {@code source:line: what is wrong 'raw'} (the raw text as a short escaped {@link #excerpt}); line 0 means the fault belongs to the whole source.
 */
public final class CardFormatException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    private final String source;
    private final int line;
    private final String rawText;

    /**
     * @param source the file name or other label of the text
     * @param line 1-based line number, or 0 for the whole source
     * @param problem what is wrong, in a few words
     * @param rawText the text at fault as written, or null when there is none
     */
    public CardFormatException(String source, int line, String problem, String rawText) {
        super(describe(source, line, problem, rawText));
        this.source = source;
        this.line = line;
        this.rawText = rawText;
    }

    private static String describe(String source, int line, String problem, String rawText) {
        String where = line > 0 ? source + ":" + line : source;
        return where + ": " + problem + (rawText == null ? "" : " '" + excerpt(rawText) + "'");
    }

    /** Longest excerpt of a raw text in a message [characters]; a card line is rarely longer. */
    static final int EXCERPT_CHARS = 80;

    /**
     * {@code raw} as it may be printed: at most {@link #EXCERPT_CHARS} characters (then "..."), every character
     * outside printable ASCII written as a backslash, u and four hex digits (tab as backslash t), so that a hostile card can neither
     * break the one-line message nor send control sequences to a terminal.
     */
    public static String excerpt(String raw) {
        StringBuilder sb = new StringBuilder();
        int n = Math.min(raw.length(), EXCERPT_CHARS);
        for (int i = 0; i < n; i++) {
            char c = raw.charAt(i);
            if (c == '\t') {
                sb.append("\\t");
            } else if (c < 0x20 || c > 0x7e) {
                sb.append(String.format(java.util.Locale.ROOT, "\\u%04x", (int) c));
            } else {
                sb.append(c);
            }
        }
        return raw.length() > EXCERPT_CHARS ? sb.append("...").toString() : sb.toString();
    }

    /** The file name or label of the text. */
    public String source() {
        return source;
    }

    /** The 1-based line number, or 0 when the fault belongs to the whole source. */
    public int line() {
        return line;
    }

    /** The text at fault as written, or null. */
    public String rawText() {
        return rawText;
    }
}
