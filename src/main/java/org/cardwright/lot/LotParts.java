package org.cardwright.lot;

import org.cardwright.data.Sha256;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.cardwright.data.DataFileException;

/**
 * Finds the parts of a lot and the measurement files of each.
 *
 * <ul>
 *   <li>A folder: every regular file in it is one part (the part's name is the file's stem), every sub-folder is
 *       one part (its name; all regular files inside, sorted, are that part's files). Hidden entries (a leading
 *       dot) are skipped.</li>
 *   <li>A file whose header has a {@code part} column: a long table; its rows are split by part into one file per
 *       part (with the table's comment lines and header, minus the part column) in the lot's state folder, and a
 *       line map sends error messages back to the table's own line numbers.</li>
 *   <li>Any other file: one part, named by its stem.</li>
 * </ul>
 * Part names are data: they never become a path without {@link #safeFileName}.
 */
public final class LotParts {

    /**
     * One part.
     *
     * @param name  the part's name
     * @param files its measurement files, sorted
     * @param lines for files split out of a long table: the file, its source table and the table line of each of
     *              its lines (index = line number - 1); empty otherwise
     */
    public record Part(String name, List<Path> files, Map<Path, LineMap> lines) {
        public Part {
            files = List.copyOf(files);
            lines = Map.copyOf(lines);
        }

        /** This part as one line of text, for engines that carry work between processes ({@link #decode}). */
        public String encode() {
            StringBuilder sb = new StringBuilder(escape(name));
            for (Path f : files) {
                sb.append("\tf\t").append(escape(f.toString()));
                LineMap m = lines.get(f);
                if (m != null) {
                    StringBuilder ls = new StringBuilder();
                    for (int i = 0; i < m.tableLines().length; i++) {
                        ls.append(i == 0 ? "" : ",").append(m.tableLines()[i]);
                    }
                    sb.append("\tm\t").append(escape(m.table().toString())).append('\t').append(ls);
                }
            }
            return sb.toString();
        }

        /** The part {@link #encode} wrote. */
        public static Part decode(String text) {
            String[] f = text.split("\t", -1);
            String name = unescape(f[0]);
            List<Path> files = new ArrayList<>();
            Map<Path, LineMap> lines = new LinkedHashMap<>();
            int i = 1;
            while (i < f.length) {
                if (f[i].equals("f")) {
                    files.add(Path.of(unescape(f[i + 1])));
                    i += 2;
                } else if (f[i].equals("m")) {
                    int[] ls = f[i + 2].isEmpty() ? new int[0] : java.util.Arrays.stream(f[i + 2].split(",")).mapToInt(Integer::parseInt).toArray();
                    lines.put(files.get(files.size() - 1), new LineMap(Path.of(unescape(f[i + 1])), ls));
                    i += 3;
                } else {
                    throw new IllegalArgumentException("not an encoded part: " + text);
                }
            }
            return new Part(name, files, lines);
        }

        private static String escape(String s) {
            return s.replace("\\", "\\\\").replace("\t", "\\t").replace("\n", "\\n").replace("\r", "\\r");
        }

        private static String unescape(String s) {
            StringBuilder sb = new StringBuilder();
            for (int i = 0; i < s.length(); i++) {
                char c = s.charAt(i);
                if (c == '\\' && i + 1 < s.length()) {
                    char n = s.charAt(++i);
                    sb.append(n == 't' ? '\t' : n == 'n' ? '\n' : n == 'r' ? '\r' : n);
                } else {
                    sb.append(c);
                }
            }
            return sb.toString();
        }

        /** The message of a reading error, with split files named by their table and the table's line number. */
        String describe(DataFileException e) {
            LineMap m = e.file() == null ? null : lines.get(e.file());
            if (m == null) {
                return e.getMessage();
            }
            int line = e.line() >= 1 && e.line() <= m.tableLines().length ? m.tableLines()[e.line() - 1] : 0;
            return new DataFileException(m.table(), line, e.problem(), e.rawValue()).getMessage();
        }
    }

    /**
     * Where the lines of a file split out of a long table came from.
     *
     * @param table      the table
     * @param tableLines table line number of each line of the split file
     */
    public record LineMap(Path table, int[] tableLines) {
    }

    private LotParts() {
    }

    /**
     * The parts of {@code inputs}, sorted by name. Long tables are split into {@code splitDir}.
     *
     * @throws IOException when an input cannot be listed or read, or holds no part
     */
    public static List<Part> find(List<Path> inputs, Path splitDir) throws IOException {
        Map<String, List<Path>> files = new TreeMap<>();
        Map<String, Map<Path, LineMap>> lines = new TreeMap<>();
        int table = 0;
        for (Path in : inputs) {
            if (Files.isDirectory(in)) {
                List<Path> entries;
                try (Stream<Path> s = Files.list(in)) {
                    entries = s.filter(p -> !p.getFileName().toString().startsWith(".")).sorted().toList();
                }
                for (Path p : entries) {
                    if (Files.isDirectory(p)) {
                        List<Path> inside;
                        try (Stream<Path> s = Files.list(p)) {
                            inside = s.filter(Files::isRegularFile)
                                    .filter(f -> !f.getFileName().toString().startsWith(".")).sorted().toList();
                        }
                        files.computeIfAbsent(p.getFileName().toString(), k -> new ArrayList<>()).addAll(inside);
                    } else if (Files.isRegularFile(p)) {
                        files.computeIfAbsent(stem(p), k -> new ArrayList<>()).add(p);
                    }
                }
            } else if (!Files.exists(in)) {
                throw new java.nio.file.NoSuchFileException(in.toString());
            } else if (partColumn(in) >= 0) {
                table++;
                split(in, splitDir, table, files, lines);
            } else {
                files.computeIfAbsent(stem(in), k -> new ArrayList<>()).add(in);
            }
        }
        List<Part> parts = new ArrayList<>();
        for (Map.Entry<String, List<Path>> e : files.entrySet()) {
            List<Path> sorted = e.getValue().stream().sorted().toList();
            parts.add(new Part(e.getKey(), sorted, lines.getOrDefault(e.getKey(), Map.of())));
        }
        if (parts.isEmpty()) {
            throw new IOException(inputs.stream().map(Path::toString).reduce((a, b) -> a + ", " + b).orElse("")
                    + ": no parts found (a folder with one file or sub-folder per part, or a table with a part column)");
        }
        return parts;
    }

    /** A file name for {@code part}: the name itself when it is plain, else a readable part and a hash. */
    public static String safeFileName(String part) {
        if (part.matches("[A-Za-z0-9][A-Za-z0-9._+-]{0,80}")) {
            return part;
        }
        String plain = part.replaceAll("[^A-Za-z0-9._+-]", "_");
        if (plain.length() > 40) {
            plain = plain.substring(0, 40);
        }
        return "x" + plain + "-" + Sha256.hex(part).substring(0, 12);
    }

    private static String stem(Path p) {
        String n = p.getFileName().toString();
        int dot = n.lastIndexOf('.');
        return dot > 0 ? n.substring(0, dot) : n;
    }

    /** Index of the {@code part} column in the header of {@code file}, or -1. */
    static int partColumn(Path file) throws IOException {
        try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String line;
            while ((line = r.readLine()) != null) {
                String t = line.strip();
                if (t.isEmpty() || t.startsWith("#")) {
                    continue;
                }
                return partIndex(cells(t));
            }
        } catch (java.nio.charset.MalformedInputException e) {
            return -1;
        }
        return -1;
    }

    private static int partIndex(List<String> header) {
        for (int i = 0; i < header.size(); i++) {
            String h = header.get(i).strip().toLowerCase(Locale.ROOT);
            if (h.equals("part") || h.startsWith("part ") || h.startsWith("part[") || h.startsWith("part(")) {
                return i;
            }
        }
        return -1;
    }

    /** Splits a long table by its part column; rows keep their order, comment lines go to every part. */
    private static void split(Path table, Path splitDir, int tableNumber, Map<String, List<Path>> files,
                              Map<String, Map<Path, LineMap>> lines) throws IOException {
        List<String> preamble = new ArrayList<>();
        List<Integer> preambleLines = new ArrayList<>();
        String header = null;
        int headerLine = 0;
        int partCol = -1;
        Map<String, List<String>> rows = new LinkedHashMap<>();
        Map<String, List<Integer>> rowLines = new LinkedHashMap<>();
        int n = 0;
        try (BufferedReader r = Files.newBufferedReader(table, StandardCharsets.UTF_8)) {
            String line;
            while ((line = r.readLine()) != null) {
                n++;
                String t = line.strip();
                if (header == null) {
                    if (t.isEmpty() || t.startsWith("#")) {
                        preamble.add(line);
                        preambleLines.add(n);
                        continue;
                    }
                    List<String> cells = cells(t);
                    partCol = partIndex(cells);
                    header = join(without(cells, partCol));
                    headerLine = n;
                    continue;
                }
                if (t.isEmpty() || t.startsWith("#")) {
                    continue;
                }
                List<String> cells = cells(t);
                String part = partCol < cells.size() ? unquote(cells.get(partCol).strip()) : "";
                if (part.isEmpty()) {
                    part = "(no part name)";
                }
                rows.computeIfAbsent(part, k -> new ArrayList<>()).add(join(without(cells, partCol)));
                rowLines.computeIfAbsent(part, k -> new ArrayList<>()).add(n);
            }
        }
        Files.createDirectories(splitDir);
        for (Map.Entry<String, List<String>> e : rows.entrySet()) {
            Path out = splitDir.resolve(safeFileName(e.getKey()) + ".table" + tableNumber + ".csv");
            int[] map = new int[preamble.size() + 1 + e.getValue().size()];
            int k = 0;
            try (Writer w = Files.newBufferedWriter(out, StandardCharsets.UTF_8)) {
                for (int i = 0; i < preamble.size(); i++) {
                    w.write(preamble.get(i));
                    w.write('\n');
                    map[k++] = preambleLines.get(i);
                }
                w.write(header);
                w.write('\n');
                map[k++] = headerLine;
                List<Integer> ln = rowLines.get(e.getKey());
                for (int i = 0; i < e.getValue().size(); i++) {
                    w.write(e.getValue().get(i));
                    w.write('\n');
                    map[k++] = ln.get(i);
                }
            }
            files.computeIfAbsent(e.getKey(), x -> new ArrayList<>()).add(out);
            lines.computeIfAbsent(e.getKey(), x -> new LinkedHashMap<>()).put(out, new LineMap(table, map));
        }
    }

    private static List<String> without(List<String> cells, int index) {
        List<String> out = new ArrayList<>(cells);
        if (index >= 0 && index < out.size()) {
            out.remove(index);
        }
        return out;
    }

    private static String join(List<String> cells) {
        return String.join(",", cells);
    }

    private static String unquote(String s) {
        return s.length() >= 2 && s.startsWith("\"") && s.endsWith("\"") ? s.substring(1, s.length() - 1).replace("\"\"", "\"") : s;
    }

    /** Comma-separated cells; a cell in double quotes may hold commas (kept quoted, so the reader sees the same cell). */
    static List<String> cells(String line) {
        List<String> out = new ArrayList<>();
        StringBuilder cur = new StringBuilder();
        boolean quoted = false;
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            if (c == '"') {
                quoted = !quoted;
                cur.append(c);
            } else if (c == ',' && !quoted) {
                out.add(cur.toString());
                cur.setLength(0);
            } else {
                cur.append(c);
            }
        }
        out.add(cur.toString());
        return out;
    }
}
