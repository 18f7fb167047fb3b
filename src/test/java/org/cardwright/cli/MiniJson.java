package org.cardwright.cli;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A small strict JSON reader (RFC 8259) for tests, so that the machine-readable output is checked by a parser we
 * did not use to write it. Objects become {@link LinkedHashMap}, arrays {@link List}, numbers {@link Double},
 * and {@code true}/{@code false}/{@code null} {@link Boolean} or null. Anything else is an error with its offset.
 */
final class MiniJson {
    private final String text;
    private int at;

    private MiniJson(String text) {
        this.text = text;
    }

    /** Parses one JSON value filling the whole text (surrounding white space allowed). */
    static Object parse(String text) {
        MiniJson p = new MiniJson(text);
        Object v = p.value();
        p.blank();
        if (p.at != text.length()) {
            throw p.error("text after the JSON value");
        }
        return v;
    }

    /** The value at a dotted path of object keys, e.g. {@code parameters.IS.value}; fails when absent. */
    static Object at(Object root, String path) {
        Object v = root;
        for (String key : path.split("\\.")) {
            if (!(v instanceof Map<?, ?> m) || !m.containsKey(key)) {
                throw new IllegalArgumentException("no '" + key + "' on the path " + path);
            }
            v = m.get(key);
        }
        return v;
    }

    private Object value() {
        blank();
        if (at >= text.length()) {
            throw error("end of text where a value was expected");
        }
        char c = text.charAt(at);
        switch (c) {
            case '{':
                return object();
            case '[':
                return array();
            case '"':
                return string();
            case 't':
                return word("true", Boolean.TRUE);
            case 'f':
                return word("false", Boolean.FALSE);
            case 'n':
                return word("null", null);
            default:
                return number();
        }
    }

    private Map<String, Object> object() {
        Map<String, Object> m = new LinkedHashMap<>();
        at++;
        blank();
        if (peek() == '}') {
            at++;
            return m;
        }
        while (true) {
            blank();
            if (peek() != '"') {
                throw error("object key expected");
            }
            String key = string();
            if (m.containsKey(key)) {
                throw error("key '" + key + "' twice in one object");
            }
            blank();
            expect(':');
            m.put(key, value());
            blank();
            char c = next();
            if (c == '}') {
                return m;
            }
            if (c != ',') {
                throw error("',' or '}' expected");
            }
        }
    }

    private List<Object> array() {
        List<Object> l = new ArrayList<>();
        at++;
        blank();
        if (peek() == ']') {
            at++;
            return l;
        }
        while (true) {
            l.add(value());
            blank();
            char c = next();
            if (c == ']') {
                return l;
            }
            if (c != ',') {
                throw error("',' or ']' expected");
            }
        }
    }

    private String string() {
        expect('"');
        StringBuilder sb = new StringBuilder();
        while (true) {
            char c = next();
            if (c == '"') {
                return sb.toString();
            }
            if (c < 0x20) {
                throw error("control character in a string");
            }
            if (c != '\\') {
                sb.append(c);
                continue;
            }
            char e = next();
            switch (e) {
                case '"', '\\', '/' -> sb.append(e);
                case 'b' -> sb.append('\b');
                case 'f' -> sb.append('\f');
                case 'n' -> sb.append('\n');
                case 'r' -> sb.append('\r');
                case 't' -> sb.append('\t');
                case 'u' -> {
                    if (at + 4 > text.length()) {
                        throw error("short \\u escape");
                    }
                    sb.append((char) Integer.parseInt(text.substring(at, at + 4), 16));
                    at += 4;
                }
                default -> throw error("bad escape \\" + e);
            }
        }
    }

    private Double number() {
        int start = at;
        if (peek() == '-') {
            at++;
        }
        if (peek() == '0') {
            at++;
        } else if (Character.isDigit(peek())) {
            while (Character.isDigit(peek())) {
                at++;
            }
        } else {
            throw error("value expected");
        }
        if (peek() == '.') {
            at++;
            digits();
        }
        if (peek() == 'e' || peek() == 'E') {
            at++;
            if (peek() == '+' || peek() == '-') {
                at++;
            }
            digits();
        }
        return Double.valueOf(text.substring(start, at));
    }

    private void digits() {
        if (!Character.isDigit(peek())) {
            throw error("digit expected");
        }
        while (Character.isDigit(peek())) {
            at++;
        }
    }

    private Object word(String w, Object v) {
        if (!text.startsWith(w, at)) {
            throw error("value expected");
        }
        at += w.length();
        return v;
    }

    private void blank() {
        while (at < text.length() && " \t\r\n".indexOf(text.charAt(at)) >= 0) {
            at++;
        }
    }

    private char peek() {
        return at < text.length() ? text.charAt(at) : '\0';
    }

    private char next() {
        if (at >= text.length()) {
            throw error("unexpected end of text");
        }
        return text.charAt(at++);
    }

    private void expect(char c) {
        if (next() != c) {
            at--;
            throw error("'" + c + "' expected");
        }
    }

    private IllegalArgumentException error(String what) {
        return new IllegalArgumentException("JSON offset " + at + ": " + what);
    }
}
