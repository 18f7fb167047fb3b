package org.cardwright.workflow;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.cardwright.data.DataFileException;
import org.cardwright.data.CvPoint;
import org.cardwright.data.DataKind;
import org.cardwright.data.IvPoint;
import org.cardwright.data.MeasurementFile;
import org.cardwright.data.MeasurementReader;
import org.cardwright.data.ReadOptions;
import org.cardwright.data.RecoveryReader;
import org.cardwright.model.SweepTemperatures;

/**
 * The measurement files of one job, read and sorted by kind (with a note for anything set aside; nothing
 * disappears silently).
 *
 * @param files       every file read
 * @param forward     forward I-V points (positive current) with their origin
 * @param reverse     reverse I-V points (negative voltage and current) with their origin
 * @param capacitance C-V points with their origin
 * @param recovery    reverse-recovery record files
 * @param notes       what was set aside or changed, for the user
 */
public record Inputs(List<MeasurementFile> files, List<Located> forward, List<Located> reverse,
                     List<LocatedCapacitance> capacitance, List<RecoveryReader.Records> recovery, List<String> notes) {

    /**
     * A forward point and where it came from.
     *
     * @param point  the point [SI]
     * @param source the file name as the user gave it
     */
    public record Located(IvPoint point, String source) {
    }

    /**
     * A C-V point and where it came from.
     *
     * @param point  the point [SI]
     * @param source the file name as the user gave it
     */
    public record LocatedCapacitance(CvPoint point, String source) {
    }

    /**
     * These inputs with a note stating how sweeps were formed, when the logged temperatures of a kind of data
     * wander (more distinct temperatures than sweeps): the rule, and each kind's rows, distinct temperatures and
     * sweeps. Unchanged when every sweep has one temperature.
     *
     * @param gap the sweep gap [K]
     */
    public Inputs withSweepNote(double gap) {
        List<String> parts = new ArrayList<>();
        sweepCount("forward I-V", forward.stream().mapToDouble(l -> l.point().temperature()).toArray(), gap, parts);
        sweepCount("reverse I-V", reverse.stream().mapToDouble(l -> l.point().temperature()).toArray(), gap, parts);
        sweepCount("C-V", capacitance.stream().mapToDouble(l -> l.point().temperature()).toArray(), gap, parts);
        if (parts.isEmpty()) {
            return this;
        }
        List<String> all = new ArrayList<>(notes);
        all.add("sweeps: " + String.join("; ", parts) + " (" + SweepTemperatures.rule(gap) + "; --sweep-gap sets the gap)");
        return new Inputs(files, forward, reverse, capacitance, recovery, all);
    }

    private static void sweepCount(String kind, double[] t, double gap, List<String> out) {
        if (t.length == 0) {
            return;
        }
        long distinct = java.util.Arrays.stream(t).distinct().count();
        java.util.TreeSet<Double> sweeps = new java.util.TreeSet<>();
        for (double label : SweepTemperatures.labels(t, gap)) {
            sweeps.add(label);
        }
        if (distinct > sweeps.size()) {
            StringBuilder b = new StringBuilder();
            for (double k : sweeps) {
                b.append(b.length() == 0 ? "" : ", ").append(String.format(java.util.Locale.ROOT, "%.2f",
                        k - org.cardwright.model.Ngspice39.CELSIUS_TO_KELVIN));
            }
            out.add(String.format(java.util.Locale.ROOT, "%s: %d rows at %d logged temperatures form %d sweeps (%s degC)",
                    kind, t.length, distinct, sweeps.size(), b));
        }
    }

    /** Reads every file; points that are neither forward nor reverse (zero current, mixed signs) are set aside. */
    public static Inputs read(List<Path> paths, ReadOptions options) throws DataFileException {
        return read(paths, options, p -> org.cardwright.data.GivenConditions.NONE);
    }

    /**
     * Reads every file with the conditions given for it from outside (a device file, the command line); a file's
     * own statement of a condition wins (see {@link MeasurementReader#read(Path, org.cardwright.data.GivenConditions)}).
     */
    public static Inputs read(List<Path> paths, ReadOptions options,
                              java.util.function.Function<Path, org.cardwright.data.GivenConditions> given)
            throws DataFileException {
        MeasurementReader reader = new MeasurementReader(options);
        List<MeasurementFile> files = new ArrayList<>();
        List<Located> forward = new ArrayList<>();
        List<Located> reverse = new ArrayList<>();
        List<LocatedCapacitance> capacitance = new ArrayList<>();
        List<RecoveryReader.Records> recovery = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        for (Path p : paths) {
            org.cardwright.data.GivenConditions conditions = given.apply(p);
            if (RecoveryReader.looksLikeRecovery(p)) {
                java.util.OptionalDouble t = conditions.get(org.cardwright.data.Condition.TEMPERATURE)
                        .map(c -> java.util.OptionalDouble.of(c.value())).orElse(options.defaultTemperature());
                recovery.add(new RecoveryReader(t).read(p));
                continue;
            }
            MeasurementFile f = reader.read(p, conditions);
            files.add(f);
            String name = displayName(p);
            f.notices().forEach(n -> notes.add(n.toString()));
            if (f.kind() == DataKind.CV) {
                f.cv().forEach(c -> capacitance.add(new LocatedCapacitance(c, name)));
                continue;
            }
            refuseUnstatedMagnitudes(f);
            int aside = 0;
            int firstAside = 0;
            for (IvPoint pt : f.iv()) {
                if (pt.current() > 0) {
                    forward.add(new Located(pt, name));
                } else if (pt.current() < 0 && pt.voltage() < 0) {
                    reverse.add(new Located(pt, name));
                } else {
                    if (aside++ == 0) {
                        firstAside = pt.line();
                    }
                }
            }
            if (aside > 0) {
                notes.add(name + ":" + firstAside + ": " + aside
                        + " points with zero current, or with current and voltage of opposite signs, set aside");
            }
        }
        setAsideCompliance(forward, notes);
        setAsideCompliance(reverse, notes);
        setAsideBelowFloor(forward, notes);
        return new Inputs(List.copyOf(files), List.copyOf(forward), List.copyOf(reverse), List.copyOf(capacitance),
                List.copyOf(recovery), List.copyOf(notes));
    }

    /**
     * The one stray capacitance and test frequency of the C-V data, from the C-V files' conditions (each file's
     * own, else given, else the defaults); {@code fallback} when there are no C-V files. The fit and the
     * verification take one value of each for all C-V data, so files that disagree are refused, naming both.
     *
     * @throws DataFileException naming the second file, the line that states its value and both values
     */
    public org.cardwright.fit.CapacitanceOptions capacitanceOptions(org.cardwright.fit.CapacitanceOptions fallback)
            throws DataFileException {
        MeasurementFile first = null;
        for (MeasurementFile f : files) {
            if (f.kind() != DataKind.CV) {
                continue;
            }
            if (first == null) {
                first = f;
                continue;
            }
            for (org.cardwright.data.Condition c : List.of(org.cardwright.data.Condition.STRAY_CAPACITANCE,
                    org.cardwright.data.Condition.TEST_FREQUENCY)) {
                org.cardwright.data.ConditionValue a = first.condition(c).orElseThrow();
                org.cardwright.data.ConditionValue b = f.condition(c).orElseThrow();
                if (a.value() != b.value()) {
                    throw new DataFileException(f.file(), b.line(), "C-V files with different " + c.key() + ": "
                            + c.text(b.value()) + " here (" + b.source() + "), " + c.text(a.value()) + " in "
                            + displayName(first.file()) + " (" + a.source() + "); the fit and verify take one "
                            + c.key() + " for all C-V data: state the same value, or fit the files apart", null);
                }
            }
        }
        if (first == null) {
            return fallback;
        }
        return new org.cardwright.fit.CapacitanceOptions(
                first.condition(org.cardwright.data.Condition.STRAY_CAPACITANCE).orElseThrow().value(),
                first.condition(org.cardwright.data.Condition.TEST_FREQUENCY).orElseThrow().value());
    }

    /**
     * The conditions a command line gives for every file: the stray capacitance and test frequency when they are
     * not the defaults.
     */
    public static org.cardwright.data.GivenConditions commandLine(org.cardwright.fit.CapacitanceOptions capacitance) {
        org.cardwright.data.GivenConditions g = org.cardwright.data.GivenConditions.NONE;
        if (capacitance.strayCapacitance() != 0) {
            g = g.with(org.cardwright.data.Condition.STRAY_CAPACITANCE, capacitance.strayCapacitance(), "--stray-capacitance");
        }
        if (capacitance.frequency() != org.cardwright.fit.CapacitanceOptions.DEFAULT_FREQUENCY) {
            g = g.with(org.cardwright.data.Condition.TEST_FREQUENCY, capacitance.frequency(), "--cv-frequency");
        }
        return g;
    }

    /**
     * For each point, "file@T" where T is the label temperature of its sweep within its file
     * ({@link SweepTemperatures}, default gap): rows whose logged temperature wanders stay one sweep.
     */
    static String[] sweepKeys(List<Located> points) {
        String[] keys = new String[points.size()];
        java.util.Map<String, List<Integer>> bySource = new java.util.LinkedHashMap<>();
        for (int i = 0; i < points.size(); i++) {
            bySource.computeIfAbsent(points.get(i).source(), k -> new ArrayList<>()).add(i);
        }
        for (java.util.Map.Entry<String, List<Integer>> e : bySource.entrySet()) {
            List<Integer> idx = e.getValue();
            double[] t = new double[idx.size()];
            for (int k = 0; k < t.length; k++) {
                t[k] = points.get(idx.get(k)).point().temperature();
            }
            double[] labels = SweepTemperatures.labels(t, SweepTemperatures.DEFAULT_GAP);
            for (int k = 0; k < t.length; k++) {
                keys[idx.get(k)] = e.getKey() + "@" + labels[k];
            }
        }
        return keys;
    }

    /**
     * A source held at its current limit shows as several points of the same current at different voltages: the
     * diode did not set that current, the instrument did. Such points (same file and temperature, current equal
     * within {@value #SAME_CURRENT}, voltages more than {@value #PLATEAU_VOLTAGE} V apart) are set aside and named.
     */
    static void setAsideCompliance(List<Located> points, List<String> notes) {
        java.util.Map<String, List<Located>> groups = new java.util.LinkedHashMap<>();
        String[] keys = sweepKeys(points);
        for (int i = 0; i < points.size(); i++) {
            groups.computeIfAbsent(keys[i], k -> new ArrayList<>()).add(points.get(i));
        }
        java.util.Set<Located> plateau = new java.util.LinkedHashSet<>();
        for (List<Located> g : groups.values()) {
            List<Located> sorted = new ArrayList<>(g);
            sorted.sort(java.util.Comparator.comparingDouble(l -> Math.abs(l.point().current())));
            int i = 0;
            while (i < sorted.size()) {
                int j = i;
                double ref = Math.abs(sorted.get(i).point().current());
                while (j + 1 < sorted.size() && Math.abs(sorted.get(j + 1).point().current()) - ref <= SAME_CURRENT * ref) {
                    j++;
                }
                if (j > i) {
                    double vmin = Double.POSITIVE_INFINITY;
                    double vmax = Double.NEGATIVE_INFINITY;
                    for (int k = i; k <= j; k++) {
                        vmin = Math.min(vmin, sorted.get(k).point().voltage());
                        vmax = Math.max(vmax, sorted.get(k).point().voltage());
                    }
                    if (vmax - vmin > PLATEAU_VOLTAGE) {
                        for (int k = i; k <= j; k++) {
                            plateau.add(sorted.get(k));
                        }
                        String lines = lineList(sorted.subList(i, j + 1));
                        notes.add(String.format(java.util.Locale.ROOT,
                                "%s: lines %s hold the current at %.4g A while the voltage moves %.4g V: a compliance limit, not the diode; set aside (a status column marks such points explicitly)",
                                sorted.get(i).source(), lines, sorted.get(i).point().current(), vmax - vmin));
                    }
                }
                i = j + 1;
            }
        }
        points.removeAll(plateau);
    }

    /**
     * Below an instrument's current floor a forward sweep stops rising: a higher voltage reads the same or a
     * smaller current. Reading down from the top of each sweep (same file and temperature, by voltage), the first
     * point whose current is not smaller than the point above it, in the bottom {@value #FLOOR_DECADES} decades
     * of the sweep's currents, marks the floor; it and every point below it are set aside and named.
     */
    static void setAsideBelowFloor(List<Located> points, List<String> notes) {
        java.util.Map<String, List<Located>> groups = new java.util.LinkedHashMap<>();
        String[] keys = sweepKeys(points);
        for (int i = 0; i < points.size(); i++) {
            groups.computeIfAbsent(keys[i], k -> new ArrayList<>()).add(points.get(i));
        }
        java.util.Set<Located> floor = new java.util.LinkedHashSet<>();
        for (List<Located> g : groups.values()) {
            List<Located> byV = new ArrayList<>(g);
            byV.sort(java.util.Comparator.comparingDouble(l -> l.point().voltage()));
            double top = byV.stream().mapToDouble(l -> l.point().current()).max().orElse(0);
            double bottom = byV.stream().mapToDouble(l -> l.point().current()).min().orElse(0);
            double limit = Math.min(top * Math.pow(10, -FLOOR_DECADES), bottom * 1e3);
            int cut = -1;
            for (int i = byV.size() - 1; i > 0; i--) {
                Located here = byV.get(i);
                Located below = byV.get(i - 1);
                if (below.point().current() >= here.point().current() && here.point().current() < limit
                        && here.point().voltage() - below.point().voltage() > 1e-9) {
                    cut = i;
                    break;
                }
            }
            if (cut > 0) {
                List<Located> gone = byV.subList(0, cut + 1);
                floor.addAll(gone);
                notes.add(String.format(java.util.Locale.ROOT,
                        "%s: %d forward points at and below %.4g V set aside: the current stops rising there (lines %s), "
                                + "which is the instrument's floor, not the diode",
                        gone.get(0).source(), gone.size(), byV.get(cut).point().voltage(), lineList(gone)));
            }
        }
        points.removeAll(floor);
    }

    /**
     * No single junction conducts forward at more than {@value #FORWARD_VOLTAGE_LIMIT} V while carrying at most
     * {@value #FORWARD_LOW_CURRENT} A: the widest-gap LEDs reach 1 mA near 3.5 to 4 V, and below 1 mA the series
     * resistance adds little (common practice, no source) [V].
     */
    static final double FORWARD_VOLTAGE_LIMIT = 5;
    /** See {@link #FORWARD_VOLTAGE_LIMIT} [A]. */
    static final double FORWARD_LOW_CURRENT = 1e-3;

    /**
     * Reverse data written as positive magnitudes under V and I headers, without a stated convention, would be
     * fitted as forward conduction at breakdown voltages. A file whose positive points include one above
     * {@link #FORWARD_VOLTAGE_LIMIT} at a current of at most {@link #FORWARD_LOW_CURRENT} is refused, naming that
     * line; stating the convention either way ({@code reverse magnitudes = yes} or {@code no}) settles it.
     */
    private static void refuseUnstatedMagnitudes(MeasurementFile f) throws DataFileException {
        if (f.layout() != org.cardwright.data.FileLayout.POINT_TABLE
                || f.condition(org.cardwright.data.Condition.REVERSE_MAGNITUDES).isPresent()) {
            return;
        }
        for (IvPoint pt : f.iv()) {
            if (pt.voltage() > FORWARD_VOLTAGE_LIMIT && pt.current() > 0 && pt.current() <= FORWARD_LOW_CURRENT) {
                throw new DataFileException(f.file(), pt.line(), String.format(java.util.Locale.ROOT,
                        "%.6g V at %.4g A cannot be forward conduction of one junction (above %s V at %s A or less): "
                                + "reverse data written as positive magnitudes? State it: '# reverse magnitudes = yes' "
                                + "above the header row (in a device file 'reverse-magnitudes: yes' under the entry's "
                                + "options), or name the columns VR and IR; '# reverse magnitudes = no' reads the "
                                + "values as written", pt.voltage(), pt.current(), FORWARD_VOLTAGE_LIMIT, FORWARD_LOW_CURRENT),
                        null);
            }
        }
    }

    /** Lines named one by one in a note; the rest are counted, so a note stays readable for any file [lines]. */
    static final int LISTED_LINES = 50;

    /** The points' lines, the first {@value #LISTED_LINES} of them, and how many more. */
    private static String lineList(List<Located> points) {
        StringBuilder s = new StringBuilder();
        for (int k = 0; k < Math.min(points.size(), LISTED_LINES); k++) {
            s.append(k == 0 ? "" : ", ").append(points.get(k).point().line());
        }
        if (points.size() > LISTED_LINES) {
            s.append(" and ").append(points.size() - LISTED_LINES).append(" more");
        }
        return s.toString();
    }

    /** The floor is looked for only this many decades above the sweep's smallest current, at most [decades]. */
    static final double FLOOR_DECADES = 3;

    /** Currents this close (relative) count as the same [1]. */
    static final double SAME_CURRENT = 1e-4;
    /** Voltages further apart than this at one current reveal a current limit [V]. */
    static final double PLATEAU_VOLTAGE = 5e-3;

    /** The path as the user wrote it, with forward slashes, so that provenance is the same on every machine. */
    public static String displayName(Path p) {
        return p.toString().replace('\\', '/');
    }
}
