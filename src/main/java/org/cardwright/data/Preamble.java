package org.cardwright.data;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The lines before a file's header row: comments, blank lines, and settings. A setting is either a comment
 * {@code # key = value} whose key is words of letters (so {@code # .model D1 D(IS=...)} stays a comment), or,
 * before the header only, a plain line {@code key: value} whose key starts with a letter and whose colon
 * comes before any comma, semicolon or tab (so no header row or data row can be taken for one). Anything else
 * that is not blank and not a comment is the header row.
 *
 * @param headerIndex 0-based index of the header row in the lines, or -1 when there is none [1]
 * @param settings    every setting line before the header, in file order, known keys or not
 */
record Preamble(int headerIndex, List<Line> settings) {

    /**
     * One setting line.
     *
     * @param line    physical 1-based line [1]
     * @param key     the key as written
     * @param value   the value as written, stripped
     * @param comment whether it was written as a {@code #} comment (else as {@code key: value})
     */
    record Line(int line, String key, String value, boolean comment) {
        /** The setting the key names, empty for a key cardwright does not read. */
        Optional<SettingKey> known() {
            return SettingKey.of(key);
        }
    }

    private static final Pattern COMMENT_SETTING = Pattern.compile("#\\s*([A-Za-z]+(?:[ _-]+[A-Za-z]+)*)\\s*=(.*)");
    private static final Pattern PLAIN_KEY = Pattern.compile("[A-Za-z][A-Za-z0-9 _./()-]*");

    Preamble {
        settings = List.copyOf(settings);
    }

    /** Scans the lines up to the first one that is neither blank, nor a comment, nor a setting. */
    static Preamble scan(List<String> lines) {
        List<Line> settings = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            String stripped = lines.get(i).strip();
            if (stripped.isEmpty()) {
                continue;
            }
            Optional<Line> setting = setting(i + 1, stripped);
            if (setting.isPresent()) {
                settings.add(setting.get());
            } else if (!stripped.startsWith("#")) {
                return new Preamble(i, settings);
            }
        }
        return new Preamble(-1, settings);
    }

    /**
     * The setting a non-blank line before the header states: a {@code # key = value} comment or a plain
     * {@code key: value} line; empty for any other comment and for the header row itself.
     */
    static Optional<Line> setting(int line, String stripped) {
        return stripped.startsWith("#") ? commentSetting(line, stripped) : plainSetting(line, stripped);
    }

    /** The setting a comment line states, if it has the form {@code # words = value}. */
    static Optional<Line> commentSetting(int line, String stripped) {
        Matcher m = COMMENT_SETTING.matcher(stripped);
        return m.matches() ? Optional.of(new Line(line, m.group(1).strip(), m.group(2).strip(), true))
                : Optional.empty();
    }

    private static Optional<Line> plainSetting(int line, String stripped) {
        int colon = stripped.indexOf(':');
        if (colon < 0) {
            return Optional.empty();
        }
        for (char c : new char[] {',', ';', '\t'}) {
            int at = stripped.indexOf(c);
            if (at >= 0 && at < colon) {
                return Optional.empty();
            }
        }
        // the key is the text before the first colon; matched on its own so the work stays linear in the line
        String key = stripped.substring(0, colon).strip();
        return PLAIN_KEY.matcher(key).matches()
                ? Optional.of(new Line(line, key, stripped.substring(colon + 1).strip(), false))
                : Optional.empty();
    }
}
