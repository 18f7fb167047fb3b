package org.cardwright.data;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.regex.Pattern;

/**
 * Everything read from one measurement file: its points in file order, in SI units, and the notices the user
 * must see. An I-V file has points in {@code iv} and none in {@code cv}; a C-V file the other way round.
 *
 * @param file    the file as it was given to the reader
 * @param sha256  SHA-256 of the file's raw bytes, 64 lower-case hex digits, so a result can name its evidence
 * @param kind    which of the two lists holds the points
 * @param iv      I-V points in file order (reverse points included); empty for a C-V file
 * @param cv      C-V points in file order; empty for an I-V file
 * @param notices everything the reader did that the user must be told about, in file order
 * @param layout  how the file recorded its points: a point table, or a series-resistor log (I-V only)
 * @param conditions the conditions the file was read under, each with where its value came from (the file, a
 *                device file, the command line, a default): for a C-V file always its stray capacitance and test
 *                frequency; any other only when stated or given
 */
public record MeasurementFile(Path file, String sha256, DataKind kind, List<IvPoint> iv, List<CvPoint> cv,
                              List<Notice> notices, FileLayout layout, Map<Condition, ConditionValue> conditions) {

    private static final Pattern SHA256_HEX = Pattern.compile("[0-9a-f]{64}");

    /** Checks the digest's form and that exactly the list named by {@code kind} holds points; copies the lists. */
    public MeasurementFile {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(sha256, "sha256");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(layout, "layout");
        if (layout == FileLayout.SERIES_RESISTOR_LOG && kind != DataKind.IV) {
            throw new IllegalArgumentException("a series-resistor log gives I-V points, not " + kind);
        }
        Objects.requireNonNull(conditions, "conditions");
        java.util.EnumMap<Condition, ConditionValue> c = new java.util.EnumMap<>(Condition.class);
        c.putAll(conditions);
        conditions = java.util.Collections.unmodifiableMap(c);
        iv = List.copyOf(iv);
        cv = List.copyOf(cv);
        notices = List.copyOf(notices);
        if (!SHA256_HEX.matcher(sha256).matches()) {
            throw new IllegalArgumentException("sha256 must be 64 lower-case hex digits, got '" + sha256 + "'");
        }
        List<?> held = kind == DataKind.IV ? iv : cv;
        List<?> other = kind == DataKind.IV ? cv : iv;
        if (held.isEmpty()) {
            throw new IllegalArgumentException(kind + " file " + file + " must hold at least one point");
        }
        if (!other.isEmpty()) {
            throw new IllegalArgumentException(kind + " file " + file + " must not hold points of the other kind");
        }
    }

    /** A file read with no conditions recorded. */
    public MeasurementFile(Path file, String sha256, DataKind kind, List<IvPoint> iv, List<CvPoint> cv,
                           List<Notice> notices, FileLayout layout) {
        this(file, sha256, kind, iv, cv, notices, layout, Map.of());
    }

    /** The value a condition had for this file, if recorded. */
    public java.util.Optional<ConditionValue> condition(Condition c) {
        return java.util.Optional.ofNullable(conditions.get(c));
    }

    /** A point table: as the canonical constructor with layout {@link FileLayout#POINT_TABLE}. */
    public MeasurementFile(Path file, String sha256, DataKind kind, List<IvPoint> iv, List<CvPoint> cv,
                           List<Notice> notices) {
        this(file, sha256, kind, iv, cv, notices, FileLayout.POINT_TABLE);
    }

    /** How many points the file holds [1]. */
    public int size() {
        return kind == DataKind.IV ? iv.size() : cv.size();
    }
}
