package org.cardwright.lot;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.cardwright.model.Param;

/**
 * What the lot job keeps of one part: its fitted card's parameters (which of them the fit adjusted), the worst
 * forward RMS residual, and the datasheet quantities measured and computed from its card; or why it failed.
 * It is written to the lot's state folder as plain text, with every number in Java's shortest round-trip form,
 * so that a resumed run gives the same bytes as an uninterrupted one.
 *
 * @param part        the part's name
 * @param fingerprint hash of the part's files and of the lot's plan; a stored result with another one is stale
 * @param reason      why the part failed; null when it was fitted
 * @param values      the card's parameters [SI]
 * @param fitted      the parameters the fit adjusted
 * @param worstRms    worst forward RMS residual [V]; NaN without forward data
 * @param measured    datasheet quantities measured [SI]
 * @param card        the same quantities computed from the part's card [SI]
 */
public record PartResult(String part, String fingerprint, String reason, Map<Param, Double> values, Set<Param> fitted,
                         double worstRms, Map<Datasheet.Quantity, Double> measured, Map<Datasheet.Quantity, Double> card) {
    public PartResult {
        values = values.isEmpty() ? Map.of() : new EnumMap<>(values);
        fitted = fitted.isEmpty() ? Set.of() : EnumSet.copyOf(fitted);
        measured = measured.isEmpty() ? Map.of() : new EnumMap<>(measured);
        card = card.isEmpty() ? Map.of() : new EnumMap<>(card);
        if (part.indexOf('\n') >= 0 || (reason != null && reason.indexOf('\n') >= 0)) {
            throw new IllegalArgumentException("part name and reason are one line each");
        }
    }

    /** A part that could not be fitted. */
    static PartResult failed(String part, String fingerprint, String reason) {
        return new PartResult(part, fingerprint, reason.replace('\n', ' ').replace('\r', ' '), Map.of(), Set.of(),
                Double.NaN, Map.of(), Map.of());
    }

    /** True when the part was fitted. */
    public boolean ok() {
        return reason == null;
    }

    /** The state-file text (also how other engines carry a result back). */
    public String toText() {
        StringBuilder sb = new StringBuilder();
        sb.append("part\t").append(part).append('\n');
        sb.append("fingerprint\t").append(fingerprint).append('\n');
        if (reason != null) {
            sb.append("failed\t").append(reason).append('\n');
        }
        for (Map.Entry<Param, Double> e : values.entrySet()) {
            sb.append(fitted.contains(e.getKey()) ? "fitted\t" : "held\t").append(e.getKey().name()).append('\t')
                    .append(Double.toString(e.getValue())).append('\n');
        }
        if (!Double.isNaN(worstRms)) {
            sb.append("rms\t").append(Double.toString(worstRms)).append('\n');
        }
        for (Map.Entry<Datasheet.Quantity, Double> e : measured.entrySet()) {
            sb.append("measured\t").append(e.getKey().name()).append('\t').append(Double.toString(e.getValue())).append('\n');
        }
        for (Map.Entry<Datasheet.Quantity, Double> e : card.entrySet()) {
            sb.append("card\t").append(e.getKey().name()).append('\t').append(Double.toString(e.getValue())).append('\n');
        }
        sb.append("end\n");
        return sb.toString();
    }

    /** Reads {@link #toText}; null when the text is incomplete or malformed (the part is then fitted again). */
    public static PartResult fromText(String text) {
        String part = null;
        String fingerprint = null;
        String reason = null;
        Map<Param, Double> values = new EnumMap<>(Param.class);
        Set<Param> fitted = EnumSet.noneOf(Param.class);
        Map<Datasheet.Quantity, Double> measured = new EnumMap<>(Datasheet.Quantity.class);
        Map<Datasheet.Quantity, Double> card = new EnumMap<>(Datasheet.Quantity.class);
        double rms = Double.NaN;
        boolean end = false;
        try {
            for (String line : text.split("\n", -1)) {
                if (line.isEmpty()) {
                    continue;
                }
                String[] f = line.split("\t", 3);
                switch (f[0]) {
                    case "part" -> part = f[1];
                    case "fingerprint" -> fingerprint = f[1];
                    case "failed" -> reason = f[1];
                    case "fitted", "held" -> {
                        Param p = Param.valueOf(f[1]);
                        values.put(p, Double.parseDouble(f[2]));
                        if (f[0].equals("fitted")) {
                            fitted.add(p);
                        }
                    }
                    case "rms" -> rms = Double.parseDouble(f[1]);
                    case "measured" -> measured.put(Datasheet.Quantity.valueOf(f[1]), Double.parseDouble(f[2]));
                    case "card" -> card.put(Datasheet.Quantity.valueOf(f[1]), Double.parseDouble(f[2]));
                    case "end" -> end = true;
                    default -> {
                        return null;
                    }
                }
            }
        } catch (IllegalArgumentException | IndexOutOfBoundsException e) {
            // a malformed line (an unknown name, a bad number, a missing field): the saved text is not used
            return null;
        }
        if (!end || part == null || fingerprint == null) {
            return null;
        }
        return new PartResult(part, fingerprint, reason, values, fitted, rms, measured, card);
    }

    /** The parameters of this part in the order of {@link Param}. */
    List<Param> parameters() {
        return new ArrayList<>(values.keySet());
    }
}
