package org.cardwright.card;

/**
 * Short, escaped excerpts of text from files cardwright does not trust (cards, templates, device files), for
 * error messages: at most {@link #MAX_CHARS} characters, control characters, line breaks and non-ASCII shown as
 * escapes, so that a message stays one line and never carries more than a few words of a file's contents.
 */
public final class Excerpts {
    /** Most characters of a file's text quoted in one message. */
    public static final int MAX_CHARS = 60;

    private Excerpts() {
    }

    /** {@code text} escaped and cut to {@link #MAX_CHARS} characters (with "..." when cut). */
    public static String of(String text) {
        return of(text, MAX_CHARS);
    }

    /** {@code text} escaped and cut to {@code max} characters (with "..." when cut). */
    public static String of(String text, int max) {
        if (text == null) {
            return "";
        }
        StringBuilder sb = new StringBuilder();
        int shown = 0;
        for (int i = 0; i < text.length(); i++) {
            if (shown >= max) {
                sb.append("...");
                break;
            }
            char c = text.charAt(i);
            if (c == '\\') {
                sb.append("\\\\");
            } else if (c == '\n') {
                sb.append("\\n");
            } else if (c == '\r') {
                sb.append("\\r");
            } else if (c == '\t') {
                sb.append("\\t");
            } else if (c < 0x20 || c == 0x7f || (c >= 0x80 && !Character.isLetterOrDigit(c))) {
                sb.append(String.format(java.util.Locale.ROOT, "\\u%04x", (int) c));
            } else {
                sb.append(c);
            }
            shown++;
        }
        return sb.toString();
    }

    /** {@link #of} in single quotes. */
    public static String quoted(String text) {
        return "'" + of(text) + "'";
    }
}
