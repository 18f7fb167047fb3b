package org.cardwright.hygiene;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads one test source as text and names the lines that break two house rules (DEVELOPERS.md, "House
 * rules": tolerances are named constants; tests read nothing outside the repository). It is a plain text
 * scanner, not a Java parser; its rules are kept simple on purpose:
 *
 * <ol>
 *   <li><b>Bare tolerance</b> (rule {@code tolerance}). The tolerance argument of {@code assertEquals},
 *       {@code assertNotEquals} and {@code assertArrayEquals} (their third argument, when there are at least
 *       three and the third is not a string literal or a lambda) must not contain a numeric literal other than
 *       {@code 0} or {@code 0.0}: {@code 1e-6}, {@code 1e-6 * x} and {@code 2 * TOL} are findings,
 *       {@code TOL}, {@code TOL * Math.abs(x)} and {@code 0.0} (an exact comparison) are not. A relative tolerance
 *       written as the expected value times a named constant is not a finding either: a number in the tolerance
 *       that also stands in the expected (first) argument is allowed when the tolerance names a constant
 *       ({@code assertEquals(3.5, x, 3.5 * REL)}; but {@code assertEquals(1e-6, x, 1e-6)} is a finding).</li>
 *   <li><b>Bare bound on a difference</b> (rule {@code abs-bound}). Anywhere in the code, a comparison
 *       ({@code <}, {@code <=}, {@code >}, {@code >=}) of {@code Math.abs(...)} against an operand that contains
 *       a numeric literal other than 0 ({@code Math.abs(a - b) < 1e-3}); the bound must be a named constant.</li>
 *   <li><b>Bare bound in a condition</b> (rule {@code condition-bound}). In the condition (first argument) of
 *       {@code assertTrue} or {@code assertFalse}, or of an {@code if} whose body starts with {@code fail(...)} or
 *       {@code throw new AssertionError(...)}, each part between {@code &&} and {@code ||} that holds a
 *       comparison must not hold a floating-point literal (one with a decimal point or an exponent) other than
 *       {@code 0.0}: {@code assertTrue(rms < 0.5e-3)} and {@code assertTrue(v > 0.9 * bv)} are findings. Integer
 *       literals are counts ({@code rows > 60}, {@code seconds < 60}) and are not.</li>
 *   <li><b>Path outside the repository</b> (rule {@code outside-path}). A string literal or a comment that
 *       names a folder of the machine rather than of the repository: {@code /work/}, {@code /home/},
 *       {@code /root/}, {@code /usr/}, {@code /opt/}, {@code /etc/}, {@code /var/}, {@code /tmp/},
 *       {@code /mnt/}, {@code /srv/}, {@code /media/}, {@code ~/}, the {@code user.home} property, or a
 *       string literal that starts with {@code ../} or contains {@code /../} (a climb out of the folder it is
 *       resolved against). The simulator look-up in {@code testsupport/Simulators.java} and
 *       {@code testsupport/Browser.java} may name {@code /usr/bin/} and {@code /usr/lib/}. Kernel interfaces
 *       ({@code /proc}) and the shell ({@code /bin/sh}) are not data files and are not findings. Text that only
 *       looks like a path (an input the code under test must refuse, an environment string to escape) is
 *       allowed on a line that carries the marker {@value #NOT_A_PATH} in a comment.</li>
 * </ol>
 *
 * Numbers are read from the code with comments and string contents blanked out, so a number in a message
 * or a comment is never a finding, nor is an array index ({@code v[1]}); paths are read from the string
 * literals and the comments only.
 */
public final class TestSourceScanner {

    /** One broken rule: file, 1-based line, the rule's name and the offending text. */
    public record Finding(String file, int line, String rule, String text) {
        @Override
        public String toString() {
            return file + ":" + line + ": " + rule + ": " + text;
        }
    }

    private static final Set<String> TOLERANCE_ASSERTIONS = Set.of("assertEquals", "assertNotEquals", "assertArrayEquals");
    private static final Pattern ASSERTION = Pattern.compile("\\b(assertEquals|assertNotEquals|assertArrayEquals)\\s*\\(");
    /** A Java numeric literal that stands alone (not part of a name such as {@code V1} or {@code x2}). */
    private static final Pattern NUMBER = Pattern.compile(
            "(?<![\\w.$])(0[xX][0-9a-fA-F_]+[lL]?|(?:\\d[\\d_]*\\.?[\\d_]*|\\.\\d[\\d_]*)(?:[eE][+-]?\\d+)?[dDfFlL]?)(?![\\w$])");
    private static final Pattern ZERO = Pattern.compile("0+(\\.0*)?[dDfFlL]?|\\.0+[dDfF]?");
    /** A named constant: an upper-case name such as {@code CONVERSION_TOLERANCE} or {@code Tolerances.ROUNDING}. */
    private static final Pattern NAME = Pattern.compile("\\b[A-Z][A-Z0-9_]*[A-Z0-9]\\b");
    /** An array index such as {@code [1]}: a position, not a quantity. */
    private static final Pattern INDEX = Pattern.compile("\\[[^\\[\\]]*\\]");
    private static final Pattern CONDITION = Pattern.compile("\\b(assertTrue|assertFalse|if)\\s*\\(");
    /** The start of a body that fails the test at once: {@code fail(...)} or {@code throw new AssertionError(...)}. */
    private static final Pattern FAILS = Pattern.compile("\\{?\\s*(fail\\s*\\(|throw\\s+new\\s+AssertionError\\b)");
    /** A comparison operator: not a shift, not a lambda arrow, not part of {@code <=>}-like text. */
    private static final Pattern COMPARISON = Pattern.compile("(?<![<>\\-])(<=?|>=?)(?![<>])");
    private static final Pattern ABS = Pattern.compile("\\bMath\\.abs\\s*\\(");
    private static final Pattern OUTSIDE = Pattern.compile(
            "/(work|home|root|usr|opt|etc|var|tmp|mnt|srv|media)/|~/|user\\.home");
    private static final Pattern CLIMB = Pattern.compile("^\\.\\./|/\\.\\./");
    /** Files that find the simulators and the browser where the system installs them. */
    private static final Set<String> SYSTEM_LOOKUP_FILES = Set.of("testsupport/Simulators.java", "testsupport/Browser.java");
    private static final Pattern SYSTEM_PROGRAMS = Pattern.compile("/usr/(bin|lib)/");

    /** The marker that allows path-like text on its line: the text is test input, not a file the test reads. */
    public static final String NOT_A_PATH = "hygiene: not a path";

    private TestSourceScanner() {
    }

    /** The findings of one source, in the order of its lines. {@code file} names it in the findings. */
    public static List<Finding> scan(String file, String source) {
        Views views = Views.of(source);
        List<Finding> out = new ArrayList<>();
        toleranceArguments(file, source, views.code, out);
        absoluteBounds(file, source, views.code, out);
        conditionBounds(file, source, views.code, out);
        outsidePaths(file, source, views, out);
        out.sort((a, b) -> Integer.compare(a.line(), b.line()));
        return out;
    }

    private static void toleranceArguments(String file, String source, String code, List<Finding> out) {
        Matcher m = ASSERTION.matcher(code);
        while (m.find()) {
            if (!TOLERANCE_ASSERTIONS.contains(m.group(1))) {
                continue;
            }
            List<int[]> args = arguments(code, m.end());
            if (args.size() < 3) {
                continue;
            }
            int[] third = args.get(2);
            String raw = source.substring(third[0], third[1]).strip();
            if (raw.startsWith("\"") || raw.contains("->")) {
                continue;
            }
            String tolerance = code.substring(third[0], third[1]);
            if (NAME.matcher(tolerance).find()) {
                Set<String> expected = numbers(code.substring(args.get(0)[0], args.get(0)[1]));
                Matcher n = NUMBER.matcher(tolerance);
                StringBuilder rest = new StringBuilder();
                int last = 0;
                while (n.find()) {
                    if (expected.contains(n.group(1))) {
                        rest.append(tolerance, last, n.start()).append(' ');
                        last = n.end();
                    }
                }
                tolerance = rest.append(tolerance.substring(last)).toString();
            }
            String literal = nonZeroNumber(tolerance);
            if (literal != null) {
                out.add(new Finding(file, lineOf(source, skipSpace(code, third[0])), "tolerance",
                        m.group(1) + " tolerance '" + oneLine(raw) + "' holds the bare number " + literal));
            }
        }
    }

    private static void absoluteBounds(String file, String source, String code, List<Finding> out) {
        Matcher m = ABS.matcher(code);
        while (m.find()) {
            int close = closingParen(code, m.end());
            if (close < 0) {
                continue;
            }
            int start = m.start();
            // the comparison after the call: Math.abs(...) < bound
            String after = operandAfterComparison(code, close + 1);
            // or before it: bound > Math.abs(...)
            String before = operandBeforeComparison(code, start);
            for (String operand : new String[] {after, before}) {
                if (operand == null) {
                    continue;
                }
                String literal = nonZeroNumber(operand);
                if (literal != null) {
                    out.add(new Finding(file, lineOf(source, start), "abs-bound",
                            "Math.abs(...) compared with '" + oneLine(operand.strip()) + "', which holds the bare number " + literal));
                    break;
                }
            }
        }
    }

    private static void conditionBounds(String file, String source, String code, List<Finding> out) {
        Matcher m = CONDITION.matcher(code);
        while (m.find()) {
            List<int[]> args = arguments(code, m.end());
            if (args.isEmpty()) {
                continue;
            }
            int[] first = args.get(0);
            if (m.group(1).equals("if") && !failsAfter(code, first[1] + 1)) {
                continue; // an if whose body does not fail the test at once is ordinary code
            }
            String condition = code.substring(first[0], first[1]);
            for (String atom : condition.split("&&|\\|\\|")) {
                if (!COMPARISON.matcher(atom).find() || ABS.matcher(atom).find()) {
                    continue; // no comparison, or one the abs-bound rule already judges
                }
                String literal = nonZeroFloat(atom);
                if (literal != null) {
                    out.add(new Finding(file, lineOf(source, skipSpace(code, first[0])), "condition-bound",
                            m.group(1) + " compares against the bare number " + literal + ": '" + oneLine(atom.strip()) + "'"));
                    break;
                }
            }
        }
    }

    private static boolean failsAfter(String code, int from) {
        return FAILS.matcher(code).region(Math.min(skipSpace(code, from), code.length()), code.length()).lookingAt();
    }

    /**
     * The first floating-point literal (with a decimal point or an exponent) in {@code code} that is not zero, or
     * null.
     */
    static String nonZeroFloat(String code) {
        return firstNonZero(code, true);
    }

    private static void outsidePaths(String file, String source, Views views, List<Finding> out) {
        boolean systemLookup = SYSTEM_LOOKUP_FILES.stream().anyMatch(f -> file.replace('\\', '/').endsWith(f));
        for (int[] span : views.literalsAndComments) {
            String text = source.substring(span[0], span[1]);
            boolean literal = text.startsWith("\"");
            Matcher m = OUTSIDE.matcher(text);
            while (m.find()) {
                if (systemLookup && SYSTEM_PROGRAMS.matcher(text).region(m.start(), text.length()).lookingAt()) {
                    continue;
                }
                if (lineText(source, span[0] + m.start()).contains(NOT_A_PATH)) {
                    continue;
                }
                out.add(new Finding(file, lineOf(source, span[0] + m.start()), "outside-path",
                        "names '" + m.group() + "' outside the repository: " + oneLine(text)));
            }
            if (literal) {
                String inner = text.length() >= 2 ? text.substring(1, text.length() - 1) : "";
                if (CLIMB.matcher(inner).find() && !lineText(source, span[0]).contains(NOT_A_PATH)) {
                    out.add(new Finding(file, lineOf(source, span[0]), "outside-path",
                            "climbs out with '../': " + oneLine(text)));
                }
            }
        }
    }

    /** The numeric literals of {@code code}, as written. */
    private static Set<String> numbers(String code) {
        Set<String> out = new java.util.HashSet<>();
        Matcher n = NUMBER.matcher(code);
        while (n.find()) {
            out.add(n.group(1));
        }
        return out;
    }

    /** The first numeric literal in {@code code} that is not zero, or null. */
    static String nonZeroNumber(String code) {
        return firstNonZero(code, false);
    }

    /** The first numeric literal outside array indices that is not zero (only floating-point ones, when asked). */
    private static String firstNonZero(String code, boolean floatingOnly) {
        String outsideIndices = code;
        for (String before = null; !outsideIndices.equals(before); ) {
            before = outsideIndices;
            outsideIndices = INDEX.matcher(outsideIndices).replaceAll(" ");
        }
        Matcher n = NUMBER.matcher(outsideIndices);
        while (n.find()) {
            String number = n.group(1);
            if (number.isEmpty() || number.equals(".")) {
                continue;
            }
            if (floatingOnly && !number.matches("[^xX]*[.eEdDfF].*")) {
                continue;
            }
            if (!ZERO.matcher(number).matches()) {
                return number;
            }
        }
        return null;
    }

    /** The spans of the top-level arguments of the call whose '(' ends just before {@code from}. */
    private static List<int[]> arguments(String code, int from) {
        List<int[]> args = new ArrayList<>();
        int depth = 0;
        int start = from;
        for (int i = from; i < code.length(); i++) {
            char c = code.charAt(i);
            if (c == '(' || c == '[' || c == '{') {
                depth++;
            } else if (c == ')' || c == ']' || c == '}') {
                if (depth == 0) {
                    if (i > start || !args.isEmpty()) {
                        args.add(new int[] {start, i});
                    }
                    return args;
                }
                depth--;
            } else if (c == ',' && depth == 0) {
                args.add(new int[] {start, i});
                start = i + 1;
            }
        }
        return args;
    }

    private static int closingParen(String code, int from) {
        int depth = 0;
        for (int i = from; i < code.length(); i++) {
            char c = code.charAt(i);
            if (c == '(') {
                depth++;
            } else if (c == ')') {
                if (depth == 0) {
                    return i;
                }
                depth--;
            }
        }
        return -1;
    }

    /** After {@code Math.abs(...)}: if a comparison follows, the operand up to the end of the expression. */
    private static String operandAfterComparison(String code, int from) {
        int i = skipSpace(code, from);
        if (i >= code.length()) {
            return null;
        }
        char c = code.charAt(i);
        if (!(c == '<' || c == '>') || (i + 1 < code.length() && (code.charAt(i + 1) == c))) {
            return null; // not a comparison (or a shift)
        }
        i++;
        if (i < code.length() && code.charAt(i) == '=') {
            i++;
        }
        int depth = 0;
        int j = i;
        for (; j < code.length(); j++) {
            char d = code.charAt(j);
            if (d == '(') {
                depth++;
            } else if (d == ')') {
                if (depth == 0) {
                    break;
                }
                depth--;
            } else if (depth == 0 && (d == ',' || d == ';' || d == '?' || d == ':' || d == '&' || d == '|')) {
                break;
            }
        }
        return code.substring(i, j);
    }

    /** Before {@code Math.abs(...)}: if a comparison precedes it, the operand back to the start of the expression. */
    private static String operandBeforeComparison(String code, int start) {
        int i = start - 1;
        while (i >= 0 && Character.isWhitespace(code.charAt(i))) {
            i--;
        }
        if (i < 0) {
            return null;
        }
        if (code.charAt(i) == '=') {
            i--;
        }
        if (i < 0 || !(code.charAt(i) == '<' || code.charAt(i) == '>')) {
            return null;
        }
        if (i > 0 && (code.charAt(i - 1) == code.charAt(i) || code.charAt(i - 1) == '-')) {
            return null; // a shift or a lambda arrow
        }
        int end = i;
        int depth = 0;
        int j = i - 1;
        for (; j >= 0; j--) {
            char d = code.charAt(j);
            if (d == ')') {
                depth++;
            } else if (d == '(') {
                if (depth == 0) {
                    break;
                }
                depth--;
            } else if (depth == 0 && (d == ',' || d == ';' || d == '?' || d == ':' || d == '&' || d == '|'
                    || d == '=' || d == '{' || d == '}')) {
                break;
            }
        }
        return code.substring(j + 1, end);
    }

    private static int skipSpace(String code, int i) {
        while (i < code.length() && Character.isWhitespace(code.charAt(i))) {
            i++;
        }
        return i;
    }

    private static int lineOf(String source, int offset) {
        int line = 1;
        for (int i = 0; i < offset && i < source.length(); i++) {
            if (source.charAt(i) == '\n') {
                line++;
            }
        }
        return line;
    }

    private static String lineText(String source, int offset) {
        int from = source.lastIndexOf('\n', Math.max(0, offset - 1)) + 1;
        int to = source.indexOf('\n', offset);
        return source.substring(from, to < 0 ? source.length() : to);
    }

    private static String oneLine(String text) {
        String s = text.replaceAll("\\s+", " ");
        return s.length() > 100 ? s.substring(0, 100) + "..." : s;
    }

    /**
     * The source with comments and the insides of string and character literals replaced by spaces (same
     * length, same line breaks), and the spans of those literals and comments in the original.
     */
    private record Views(String code, List<int[]> literalsAndComments) {
        static Views of(String source) {
            StringBuilder code = new StringBuilder(source);
            List<int[]> spans = new ArrayList<>();
            int n = source.length();
            int i = 0;
            while (i < n) {
                char c = source.charAt(i);
                if (c == '/' && i + 1 < n && source.charAt(i + 1) == '/') {
                    int end = source.indexOf('\n', i);
                    end = end < 0 ? n : end;
                    blank(code, i, end);
                    spans.add(new int[] {i, end});
                    i = end;
                } else if (c == '/' && i + 1 < n && source.charAt(i + 1) == '*') {
                    int end = source.indexOf("*/", i + 2);
                    end = end < 0 ? n : end + 2;
                    blank(code, i, end);
                    spans.add(new int[] {i, end});
                    i = end;
                } else if (c == '"' && source.startsWith("\"\"\"", i)) {
                    int end = source.indexOf("\"\"\"", i + 3);
                    end = end < 0 ? n : end + 3;
                    blank(code, i + 1, end - 1);
                    spans.add(new int[] {i, end});
                    i = end;
                } else if (c == '"' || c == '\'') {
                    int j = i + 1;
                    while (j < n && source.charAt(j) != c && source.charAt(j) != '\n') {
                        j += source.charAt(j) == '\\' ? 2 : 1;
                    }
                    int end = Math.min(j + 1, n);
                    blank(code, i + 1, end - 1);
                    if (c == '"') {
                        spans.add(new int[] {i, end});
                    }
                    i = end;
                } else {
                    i++;
                }
            }
            return new Views(code.toString(), spans);
        }

        private static void blank(StringBuilder code, int from, int to) {
            for (int k = from; k < to && k < code.length(); k++) {
                if (code.charAt(k) != '\n') {
                    code.setCharAt(k, ' ');
                }
            }
        }
    }
}
