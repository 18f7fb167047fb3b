package org.cardwright.report;

/** Escaping for text placed in HTML and SVG (valid in both, and in XML). */
final class Markup {
    private Markup() {
    }

    /** {@code text} with &amp;, &lt;, &gt;, &quot; and ' escaped; control characters other than tab and newline dropped. */
    static String escape(String text) {
        StringBuilder sb = new StringBuilder(text.length());
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            switch (c) {
                case '&' -> sb.append("&amp;");
                case '<' -> sb.append("&lt;");
                case '>' -> sb.append("&gt;");
                case '"' -> sb.append("&quot;");
                case '\'' -> sb.append("&#39;");
                default -> {
                    if (c >= 0x20 || c == '\t' || c == '\n') {
                        sb.append(c);
                    }
                }
            }
        }
        return sb.toString();
    }
}
