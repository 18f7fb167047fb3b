package org.cardwright.card;

import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The bundled card layouts written directly, without the template engine: the same bytes as the bundled templates
 * ({@code templates/*.ftl}) give for the same data, which {@code CardWriterTest} checks for every dialect against
 * FreeMarker itself. A run that writes only bundled layouts so never loads or configures FreeMarker (about 500
 * classes and a template parse per writer); a user's template of the same name still goes through FreeMarker.
 */
final class BuiltinLayout {
    private BuiltinLayout() {
    }

    /**
     * The card: each provenance line as a comment ({@code *}, then a blank and the line unless it is empty), the
     * dialect's {@code .model} line, one {@code + KEYWORD=VALUE} line per parameter and {@code + )}.
     *
     * @param parameters entries with {@code keyword} and {@code value}, formatted already
     */
    static String render(Dialect dialect, String name, List<String> provenance, List<Map<String, String>> parameters) {
        StringBuilder sb = new StringBuilder(64 + 24 * parameters.size() + 64 * provenance.size());
        for (String line : provenance) {
            sb.append('*');
            if (!line.isEmpty()) {
                sb.append(' ').append(line);
            }
            sb.append('\n');
        }
        // a switch expression: a new dialect does not compile until its layout is here
        String header = switch (dialect) {
            case NGSPICE, SPICE3 -> ".model " + name + " D(\n";
            // gnucap's own listing: lower-case type, a blank before the parenthesis, lower-case keywords
            case GNUCAP -> ".model " + name + " d (\n";
            case XYCE -> ".MODEL " + name + " D (\n";
        };
        sb.append(header);
        boolean lower = dialect == Dialect.GNUCAP;
        for (Map<String, String> p : parameters) {
            String keyword = p.get("keyword");
            sb.append("+ ").append(lower ? keyword.toLowerCase(Locale.ROOT) : keyword).append('=').append(p.get("value"))
                    .append('\n');
        }
        return sb.append("+ )\n").toString();
    }
}
