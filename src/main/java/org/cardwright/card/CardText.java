package org.cardwright.card;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Splits SPICE card text into comment lines and logical statements (a line and its {@code +} continuations), and
 * a statement into tokens that remember their physical line. Parentheses are tokens of their own; commas separate
 * tokens like blanks; {@code =} is a token of its own. Inline comments start at {@code ;}, {@code $} or
 * {@code //}. Nothing here decides what a statement may be: that is {@link CardReader}'s and its forms' job.
 */
final class CardText {
    /** A token as written and the 1-based line it stands on. */
    record Token(String text, int line) {
    }

    /**
     * One logical statement: its tokens, in order, and its first physical line as written (for error messages).
     */
    record Statement(List<Token> tokens, int firstLine, int lastLine, String firstLineText) {
        /** The first token in upper case: {@code .MODEL}, {@code .CONTROL}, {@code R99}. */
        String keyword() {
            return tokens.get(0).text().toUpperCase(Locale.ROOT);
        }
    }

    /** A {@code *} comment line without the {@code *} and one following blank. */
    record Comment(String text, int line) {
    }

    /** The statements and the comment lines of a text. */
    record Layout(List<Statement> statements, List<Comment> comments) {
    }

    private CardText() {
    }

    static Layout split(String text, String source) {
        String body = text.startsWith("\uFEFF") ? text.substring(1) : text;
        String[] lines = lines(body);
        List<Statement> statements = new ArrayList<>();
        List<Comment> comments = new ArrayList<>();
        List<Token> current = null;
        int firstLine = 0;
        int lastLine = 0;
        String firstText = "";
        for (int i = 0; i < lines.length; i++) {
            int lineNumber = i + 1;
            String line = lines[i];
            String stripped = line.stripLeading();
            if (stripped.startsWith("*")) {
                comments.add(new Comment(commentText(stripped), lineNumber));
                continue;
            }
            String code = withoutInlineComment(line);
            String codeStripped = code.strip();
            if (codeStripped.isEmpty()) {
                continue;
            }
            if (codeStripped.startsWith("+")) {
                if (current == null) {
                    throw new CardFormatException(source, lineNumber,
                            "continuation line with no statement before it", line.strip());
                }
                current.addAll(tokens(codeStripped.substring(1), lineNumber));
                lastLine = lineNumber;
                continue;
            }
            if (current != null) {
                statements.add(new Statement(List.copyOf(current), firstLine, lastLine, firstText));
            }
            current = new ArrayList<>(tokens(codeStripped, lineNumber));
            firstLine = lineNumber;
            lastLine = lineNumber;
            firstText = line.strip();
        }
        if (current != null) {
            statements.add(new Statement(List.copyOf(current), firstLine, lastLine, firstText));
        }
        return new Layout(List.copyOf(statements), List.copyOf(comments));
    }

    /**
     * The physical lines of {@code text}, split at each {@code \r\n}, lone {@code \r} and lone {@code \n}, with every
     * empty line kept (also a leading and a trailing one): exactly {@code text.split("\r\n|\r|\n", -1)}, in one
     * pass without a regular expression.
     */
    static String[] lines(String text) {
        if (text.indexOf('\r') < 0) {
            // only \n breaks (the cards this program writes): found by the JDK's own fast search
            int count = 1;
            for (int at = text.indexOf('\n'); at >= 0; at = text.indexOf('\n', at + 1)) {
                count++;
            }
            String[] out = new String[count];
            int start = 0;
            for (int k = 0; k < count - 1; k++) {
                int at = text.indexOf('\n', start);
                out[k] = text.substring(start, at);
                start = at + 1;
            }
            out[count - 1] = text.substring(start);
            return out;
        }
        int n = text.length();
        int count = 1;
        for (int i = 0; i < n; i++) {
            char c = text.charAt(i);
            if (c == '\n' || c == '\r') {
                count++;
                if (c == '\r' && i + 1 < n && text.charAt(i + 1) == '\n') {
                    i++;
                }
            }
        }
        String[] out = new String[count];
        int k = 0;
        int start = 0;
        for (int i = 0; i < n; i++) {
            char c = text.charAt(i);
            if (c == '\n' || c == '\r') {
                out[k++] = text.substring(start, i);
                if (c == '\r' && i + 1 < n && text.charAt(i + 1) == '\n') {
                    i++;
                }
                start = i + 1;
            }
        }
        out[k] = text.substring(start);
        return out;
    }

    private static String commentText(String stripped) {
        String afterStar = stripped.substring(1);
        return afterStar.startsWith(" ") ? afterStar.substring(1) : afterStar;
    }

    private static String withoutInlineComment(String line) {
        int end = line.length();
        for (String marker : new String[] {";", "$", "//"}) {
            int at = line.indexOf(marker);
            if (at >= 0 && at < end) {
                end = at;
            }
        }
        return line.substring(0, end);
    }

    private static List<Token> tokens(String code, int lineNumber) {
        List<Token> out = new ArrayList<>();
        StringBuilder word = new StringBuilder();
        for (int i = 0; i < code.length(); i++) {
            char c = code.charAt(i);
            if (Character.isWhitespace(c) || c == ',') {
                flush(word, lineNumber, out);
            } else if (c == '=' || c == '(' || c == ')') {
                flush(word, lineNumber, out);
                out.add(new Token(String.valueOf(c), lineNumber));
            } else {
                word.append(c);
            }
        }
        flush(word, lineNumber, out);
        return out;
    }

    private static void flush(StringBuilder word, int lineNumber, List<Token> out) {
        if (word.length() > 0) {
            out.add(new Token(word.toString(), lineNumber));
            word.setLength(0);
        }
    }
}
