package org.cardwright.lot;

import java.nio.file.Path;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.cardwright.card.Dialect;

/**
 * Everything the lot job needs.
 *
 * @param inputs      folders of parts, long tables with a part column, or part files
 * @param name        the lot's model name (cards: NAME.typical.DIALECT.lib, ...)
 * @param out         the lot folder
 * @param dialects    dialects of the typical and corner cards (the Monte Carlo card is ngspice only)
 * @param jobs        parts fitted at once (threads)
 * @param settings    how each part is read and fitted
 * @param cornerSigma how many standard deviations out the corners lie [1]
 * @param conditions  datasheet conditions the user gave (IF, VR, IZ) [A or V]; the rest are chosen from the data
 * @param datasheetTemperature device temperature for the datasheet quantities [K]; chosen from the data when empty
 * @param digits      significant digits on the cards
 * @param force       replace the outputs of a finished run
 * @param templates   folder of user templates overriding the bundled ones
 * @param partCards   whether each fitted part's own card is written (see {@link PartCards})
 */
public record LotRequest(List<Path> inputs, String name, Path out, List<Dialect> dialects, int jobs, LotSettings settings,
                         double cornerSigma, Map<Datasheet.Quantity, Double> conditions, OptionalDouble datasheetTemperature,
                         int digits, boolean force, Optional<Path> templates, PartCards partCards) {

    /**
     * Whether the lot folder gets one card per fitted part, in {@code NAME.parts/}: always, never, or (the default)
     * when the lot has at most {@link #AUTO_PART_CARDS_LIMIT} parts.
     */
    public enum PartCards {
        AUTO, ON, OFF
    }

    /**
     * Largest lot that gets per-part cards by default: a thousand small files (about half a megabyte) are still
     * handy in one folder; a wafer's 10^5 would be a file system's burden for cards nobody opens one by one.
     */
    public static final int AUTO_PART_CARDS_LIMIT = 1000;

    /** As the canonical constructor, with per-part cards by the default rule ({@link PartCards#AUTO}). */
    public LotRequest(List<Path> inputs, String name, Path out, List<Dialect> dialects, int jobs, LotSettings settings,
                      double cornerSigma, Map<Datasheet.Quantity, Double> conditions, OptionalDouble datasheetTemperature,
                      int digits, boolean force, Optional<Path> templates) {
        this(inputs, name, out, dialects, jobs, settings, cornerSigma, conditions, datasheetTemperature, digits, force, templates,
                PartCards.AUTO);
    }

    public LotRequest {
        java.util.Objects.requireNonNull(partCards, "partCards");
        inputs = List.copyOf(inputs);
        dialects = List.copyOf(dialects);
        conditions = conditions.isEmpty() ? Map.of() : new EnumMap<>(conditions);
        if (inputs.isEmpty()) {
            throw new IllegalArgumentException("no lot input given");
        }
        if (dialects.isEmpty()) {
            throw new IllegalArgumentException("no dialect given");
        }
        if (jobs < 1) {
            throw new IllegalArgumentException("--jobs must be at least 1, got " + jobs);
        }
        if (!(cornerSigma > 0 && cornerSigma <= 10)) {
            throw new IllegalArgumentException("--corner-sigma must lie in (0, 10], got " + cornerSigma);
        }
        if (digits < 4 || digits > 15) {
            throw new IllegalArgumentException("--digits must lie in 4..15, got " + digits);
        }
        for (Map.Entry<Datasheet.Quantity, Double> e : conditions.entrySet()) {
            if (!(e.getValue() > 0)) {
                throw new IllegalArgumentException(e.getKey().conditionLabel() + " must be a positive number, got " + e.getValue());
            }
        }
    }

    /** The state folder that makes a run resumable: OUT/NAME.lot-state. */
    public Path stateDir() {
        return out.resolve(name + ".lot-state");
    }

    /** The lot JSON: OUT/NAME.lot.json. */
    public Path json() {
        return out.resolve(name + ".lot.json");
    }

    /** The page with the distributions: OUT/NAME.lot.html. */
    public Path html() {
        return out.resolve(name + ".lot.html");
    }

    /** The per-part table: OUT/NAME.parts.csv. */
    public Path partsCsv() {
        return out.resolve(name + ".parts.csv");
    }

    /** The statistics table: OUT/NAME.statistics.csv. */
    public Path statisticsCsv() {
        return out.resolve(name + ".statistics.csv");
    }

    /** True when a lot of {@code parts} parts gets per-part cards. */
    public boolean writesPartCards(int parts) {
        return switch (partCards) {
            case ON -> true;
            case OFF -> false;
            case AUTO -> parts <= AUTO_PART_CARDS_LIMIT;
        };
    }

    /** The folder of the per-part cards: OUT/NAME.parts. */
    public Path partCardDir() {
        return out.resolve(name + ".parts");
    }

    /** A part's own card: OUT/NAME.parts/PART.DIALECT.lib (the part's name made safe for a file name). */
    public Path partCard(String part, String dialect) {
        return partCardDir().resolve(LotParts.safeFileName(part) + "." + dialect + ".lib");
    }

    /** A lot card: OUT/NAME.SUFFIX.DIALECT.lib. */
    public Path card(String suffix, String dialect) {
        return out.resolve(name + "." + suffix + "." + dialect + ".lib");
    }
}
