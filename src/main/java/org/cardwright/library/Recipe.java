package org.cardwright.library;

import org.cardwright.data.Sha256;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import org.cardwright.card.Dialect;
import org.cardwright.workflow.ToolVersion;

/**
 * Everything that decides a part's cards, as canonical text: the tool version, the device file's settings (not
 * its layout or comments), the SHA-256 of every data file it lists and of every card template used. Two builds
 * with the same recipe write the same cards, so a build compares the recipe's hash with the build record's and
 * skips the part when they agree. Time stamps play no part.
 *
 * @param text the canonical text
 * @param sha256 its SHA-256
 * @param dataSha256 the SHA-256 of each data file as the text states it, by the file's name as the device file writes
 *                   it: the cards' provenance names the same hashes without reading the files again
 */
public record Recipe(String text, String sha256, java.util.Map<String, String> dataSha256) {
    public Recipe {
        dataSha256 = java.util.Map.copyOf(dataSha256);
    }

    /** Bump when the meaning of the recipe text changes. */
    static final String FORMAT = "cardwright build recipe 1";

    /** The recipe of {@code part}. */
    public static Recipe of(DeviceFile part) throws DeviceFileException, IOException {
        StringBuilder sb = new StringBuilder();
        sb.append(FORMAT).append('\n');
        sb.append("tool ").append(ToolVersion.get()).append('\n');
        sb.append("device-file ").append(part.path().getFileName()).append('\n');
        sb.append(part.canonicalSettings());
        java.util.Map<String, String> hashes = new java.util.HashMap<>();
        for (DataSource s : part.data()) {
            Path p = s.resolve(part.folder());
            if (Files.exists(p) && !Files.isRegularFile(p)) {
                throw new DeviceFileException(part.path(), s.line(), "data file " + org.cardwright.card.Excerpts.quoted(s.file())
                        + " is not a regular file (a folder, FIFO or device); refused");
            }
            if (!Files.isRegularFile(p)) {
                throw new DeviceFileException(part.path(), s.line(), "data file not found: " + org.cardwright.card.Excerpts.quoted(s.file()));
            }
            String hash = Sha256.hex(p);
            hashes.put(s.file(), hash);
            sb.append("data-sha256 ").append(s.file()).append(' ').append(hash).append('\n');
        }
        for (Dialect d : part.dialects()) {
            sb.append("template ").append(d.shortName()).append(' ').append(templateSha256(part, d)).append('\n');
        }
        String text = sb.toString();
        return new Recipe(text, Sha256.hex(text), hashes);
    }

    /** The bundled templates' SHA-256, by dialect: the same for every part of a run, so read from the jar once. */
    private static final java.util.Map<Dialect, String> BUNDLED_SHA256 = new java.util.concurrent.ConcurrentHashMap<>();

    /** The SHA-256 of the template the card writer will use for {@code d}. */
    private static String templateSha256(DeviceFile part, Dialect d) throws IOException {
        if (part.templates().isEmpty()) {
            String known = BUNDLED_SHA256.get(d);
            if (known == null) {
                known = Sha256.hex(templateBytes(part, d));
                BUNDLED_SHA256.put(d, known);
            }
            return known;
        }
        return Sha256.hex(templateBytes(part, d));
    }

    /** The template the card writer will use for {@code d}: the part's template folder first, then the bundled one. */
    private static byte[] templateBytes(DeviceFile part, Dialect d) throws IOException {
        if (part.templates().isPresent()) {
            Path folder = part.folder().resolve(part.templates().get());
            Path own = folder.resolve(d.templateFileName());
            if (Files.exists(own, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
                // the same rules as the card writer's: a regular file of bounded size, inside its folder
                String shown = own.toString().replace('\\', '/');
                if (!Files.exists(own) || !own.toRealPath().startsWith(folder.toRealPath())) {
                    throw new IOException(shown + ": leads outside the template folder, or nowhere; refused");
                }
                if (!Files.isRegularFile(own)) {
                    throw new IOException(shown + ": not a regular file; refused");
                }
                if (Files.size(own) > org.cardwright.card.CardWriter.MAX_TEMPLATE_BYTES) {
                    throw new IOException(shown + ": more than " + org.cardwright.card.CardWriter.MAX_TEMPLATE_BYTES
                            + " bytes, the limit for a template; refused");
                }
                return Files.readAllBytes(own);
            }
        }
        try (InputStream in = Recipe.class.getResourceAsStream("/org/cardwright/templates/" + d.templateFileName())) {
            if (in == null) {
                throw new IOException("bundled template " + d.templateFileName() + " is missing from this build");
            }
            return in.readAllBytes();
        }
    }
}
