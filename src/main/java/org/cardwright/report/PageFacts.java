package org.cardwright.report;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * What an evidence page states besides the verification itself, so a reader can repeat it: the exact command, the
 * SHA-256 of every data file (FIPS 180-4), and the card's parameters, with standard errors when a fit made them.
 *
 * @param command    the command as run, ready to paste into a POSIX shell; empty when not known
 * @param dataFiles  the data files in the order given
 * @param parameters the card's parameters in the order of {@link Param}; empty when not known
 */
public record PageFacts(String command, List<DataFile> dataFiles, List<ParameterValue> parameters) {
    public PageFacts {
        dataFiles = List.copyOf(dataFiles);
        parameters = List.copyOf(parameters);
    }

    /**
     * One data file.
     *
     * @param name   as the user named it
     * @param sha256 64 lower-case hex digits
     * @param bytes  its size [bytes]
     */
    public record DataFile(String name, String sha256, long bytes) {
    }

    /**
     * One parameter of the card, as written on it.
     *
     * @param keyword       its SPICE keyword
     * @param value         the number on the card (TNOM in degrees Celsius)
     * @param unit          its unit for display; empty for a dimensionless one
     * @param standardError one standard error in the same unit; NaN when there is none
     */
    public record ParameterValue(String keyword, double value, String unit, double standardError) {
    }

    /** Nothing known: the page leaves the command, hash and parameter parts out. */
    public static PageFacts none() {
        return new PageFacts("", List.of(), List.of());
    }

    /** True when some parameter carries a standard error. */
    public boolean hasStandardErrors() {
        return parameters.stream().anyMatch(p -> Double.isFinite(p.standardError()));
    }

    /** The given parameters of a card, without standard errors. */
    public static List<ParameterValue> parametersOf(DiodeParameters card) {
        return parametersOf(card, Map.of());
    }

    /** The given parameters of a card, with the standard errors known for some of them (SI units, as the card). */
    public static List<ParameterValue> parametersOf(DiodeParameters card, Map<Param, Double> standardErrors) {
        List<ParameterValue> out = new ArrayList<>();
        for (Param p : Param.values()) {
            if (card.isGiven(p)) {
                double se = standardErrors.getOrDefault(p, Double.NaN);
                out.add(new ParameterValue(p.keyword(), p.toCardValue(card.get(p)), p == Param.TNOM ? "\u00b0C" : p.unit(),
                        se));
            }
        }
        return out;
    }

    /** Hashes each file; names are shown as given. */
    public static List<DataFile> hash(List<Path> files) throws IOException {
        List<DataFile> out = new ArrayList<>();
        for (Path f : files) {
            MessageDigest digest = org.cardwright.data.Sha256.digest();
            long size = 0;
            try (InputStream in = Files.newInputStream(f)) {
                byte[] buffer = new byte[1 << 16];
                for (int n; (n = in.read(buffer)) > 0; ) {
                    digest.update(buffer, 0, n);
                    size += n;
                }
            } catch (IOException e) {
                throw new IOException(f + ": cannot read the data file to hash it (" + e.getMessage() + ")", e);
            }
            out.add(new DataFile(f.toString(), org.cardwright.data.Sha256.hex(digest), size));
        }
        return out;
    }

    /**
     * {@code cardwright} and the arguments, each quoted for a POSIX shell where it needs it (single quotes, with a
     * single quote inside written as '\'').
     */
    public static String command(String program, List<String> arguments) {
        StringBuilder sb = new StringBuilder(program);
        for (String a : arguments) {
            sb.append(' ');
            if (!a.isEmpty() && a.matches("[A-Za-z0-9_@%+=:,./-]+")) {
                sb.append(a);
            } else {
                sb.append('\'').append(a.replace("'", "'\\''")).append('\'');
            }
        }
        return sb.toString();
    }
}
