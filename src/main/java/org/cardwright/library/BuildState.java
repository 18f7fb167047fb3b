package org.cardwright.library;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * The build record of one part, {@code CARDS/MODEL.state}: the SHA-256 of the recipe that made the cards and of
 * each card's text as written, and the residuals per temperature of each card. Plain text, one fact per line, no
 * time stamps, so it is byte-stable and reads well in a diff; it belongs in version control beside the cards.
 *
 * <pre>
 * # cardwright build record of model RX10: written by cardwright build; do not edit.
 * recipe 3f0c...
 * card RX10.ngspice.lib 9a41...
 * residual RX10.ngspice.lib 25 0.254 0.556
 * </pre>
 *
 * <p>While a build replaces cards, the record lists each card's old hash and, on a {@code pending} line, its new
 * one, so that a build interrupted between two cards leaves a record that accepts either text and never mistakes
 * its own output for a hand edit.
 *
 * @param recipe     SHA-256 of the recipe
 * @param cards      per card file name, the hashes of texts cardwright wrote (more than one only while pending)
 * @param residuals  per card file name, per temperature: RMS and max residual
 */
public record BuildState(String recipe, Map<String, Set<String>> cards, Map<String, List<Residual>> residuals) {
    private static final Pattern HEX = Pattern.compile("[0-9a-f]{64}");

    /**
     * Residuals of one card at one temperature, as recorded.
     *
     * @param celsius temperature as text, degrees C
     * @param rmsMillivolts RMS residual, mV with three decimals, as text
     * @param maxMillivolts largest residual, mV with three decimals, as text
     */
    public record Residual(String celsius, String rmsMillivolts, String maxMillivolts) {
    }

    public BuildState {
        Map<String, Set<String>> c = new LinkedHashMap<>();
        cards.forEach((k, v) -> c.put(k, Set.copyOf(new LinkedHashSet<>(v))));
        cards = java.util.Collections.unmodifiableMap(c);
        Map<String, List<Residual>> r = new LinkedHashMap<>();
        residuals.forEach((k, v) -> r.put(k, List.copyOf(v)));
        residuals = java.util.Collections.unmodifiableMap(r);
    }

    /** True when {@code hash} is the hash of a text cardwright wrote to card {@code fileName}. */
    public boolean wrote(String fileName, String hash) {
        return cards.getOrDefault(fileName, Set.of()).contains(hash);
    }

    /** The record as text; cards and pending hashes sorted, so the text depends only on the content. */
    public String text(String model) {
        StringBuilder sb = new StringBuilder();
        sb.append("# cardwright state file of model ").append(model).append(": written by cardwright build; do not edit.\n");
        sb.append("# It says what the cards beside it were made from, so that a build can skip what has not changed and notice hand edits.\n");
        sb.append("inputs ").append(recipe).append('\n');
        for (Map.Entry<String, Set<String>> e : cards.entrySet()) {
            List<String> hashes = new ArrayList<>(e.getValue());
            hashes.sort(null);
            String keyword = hashes.size() == 1 ? "card " : "pending ";
            for (String h : hashes) {
                sb.append(keyword).append(e.getKey()).append(' ').append(h).append('\n');
            }
        }
        for (Map.Entry<String, List<Residual>> e : residuals.entrySet()) {
            for (Residual r : e.getValue()) {
                sb.append("residual ").append(e.getKey()).append(' ').append(r.celsius()).append(' ')
                        .append(r.rmsMillivolts()).append(' ').append(r.maxMillivolts()).append('\n');
            }
        }
        return sb.toString();
    }

    /**
     * Reads a record; empty when there is none.
     *
     * @throws IOException naming file and line when the record is not one cardwright wrote
     */
    public static Optional<BuildState> read(Path file) throws IOException {
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (NoSuchFileException e) {
            return Optional.empty();
        }
        String recipe = null;
        Map<String, Set<String>> cards = new LinkedHashMap<>();
        Map<String, List<Residual>> residuals = new LinkedHashMap<>();
        for (int i = 0; i < lines.size(); i++) {
            String line = lines.get(i).strip();
            if (line.isEmpty() || line.startsWith("#")) {
                continue;
            }
            String[] f = line.split(" ");
            boolean ok = switch (f[0]) {
                case "inputs", "recipe" -> f.length == 2 && HEX.matcher(f[1]).matches();  // "recipe": the earlier word
                case "card", "pending" -> f.length == 3 && HEX.matcher(f[2]).matches();
                case "residual" -> f.length == 5;
                default -> false;
            };
            if (!ok) {
                throw new IOException(file + ":" + (i + 1) + ": not a line of a cardwright state file: '" + line
                        + "'; delete the state file to rebuild the part from scratch");
            }
            switch (f[0]) {
                case "inputs", "recipe" -> recipe = f[1];
                case "card", "pending" -> cards.computeIfAbsent(f[1], k -> new LinkedHashSet<>()).add(f[2]);
                default -> residuals.computeIfAbsent(f[1], k -> new ArrayList<>()).add(new Residual(f[2], f[3], f[4]));
            }
        }
        if (recipe == null) {
            throw new IOException(file + ":0: state file without an inputs line; delete it to rebuild the part from scratch");
        }
        return Optional.of(new BuildState(recipe, cards, residuals));
    }
}
