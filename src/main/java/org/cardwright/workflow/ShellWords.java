package org.cardwright.workflow;

import java.util.regex.Pattern;

/**
 * Words for command lines that a user may paste into a POSIX shell (the {@code verify} hint in a card header): a
 * word of plain characters stays as it is, any other goes in single quotes, inside which a POSIX shell expands
 * nothing ({@code $(...)}, backquotes, {@code ;}, globs, {@code ~}); a single quote inside is written
 * {@code '\''}. A word that starts with {@code -} gets {@code ./} in front, so that no file is taken for an option.
 */
public final class ShellWords {
    private static final Pattern PLAIN = Pattern.compile("[A-Za-z0-9_./,:@%+=-]+");

    private ShellWords() {
    }

    /** {@code word} as one shell word. */
    public static String quote(String word) {
        String w = word.startsWith("-") ? "./" + word : word;
        if (PLAIN.matcher(w).matches()) {
            return w;
        }
        return "'" + w.replace("'", "'\\''") + "'";
    }
}
