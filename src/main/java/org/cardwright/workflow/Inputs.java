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
            // one key string per sweep of the file (its points share it), not one concatenation per point
            java.util.Map<Double, String> sweepKey = new java.util.HashMap<>();
            for (int k = 0; k < t.length; k++) {
                keys[idx.get(k)] = sweepKey.computeIfAbsent(labels[k], label -> e.getKey() + "@" + label);
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
     * smaller current, however far up the floor reaches. Within a sweep (same file and temperature, by voltage),
     * in the bottom {@value #FLOOR_DECADES} decades of its currents, the floor is found by {@link #floorCut}; the
     * highest point it reaches and every point below it are set aside and named.
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
            double[] v = new double[byV.size()];
            double[] current = new double[byV.size()];
            for (int k = 0; k < v.length; k++) {
                v[k] = byV.get(k).point().voltage();
                current[k] = byV.get(k).point().current();
            }
            int cut = floorCut(v, current);
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
     * The index of the highest point of one sweep's floor, or -1 when it shows none. {@code v} ascending [V],
     * {@code current} positive [A], one entry per point.
     *
     * <p>A junction's current rises with its voltage everywhere in forward bias; noise only makes readings trade
     * places over a few noise widths. So a pair of points is compared only when the lower one lies in the
     * bottom {@value #FLOOR_DECADES} decades and the voltage between them would raise a junction's current at
     * least e^{@value #FLOOR_REACH} times: (e^{s V2} - 1)/(e^{s V1} - 1), with s the sweep's own slope of ln I
     * against V in the decade just above those bottom decades (least squares; the -1 keeps the comparison honest
     * within a few kT/q of 0 V) and V1 counted from at least {@value #FLOOR_NOISE_WIDTHS} times the sweep's
     * voltage scatter ({@link #voltageScatter}). When the upper point nonetheless reads no more current, and the
     * points between the lower one and the pair's middle voltage do not rise beyond their own scatter either
     * ({@link #notRising}), the current has stopped rising: the pair lies in the floor. The floor reaches up to
     * the highest upper point of such a pair. The lower point itself is left out of the test of the points
     * between, because choosing the pair chose it for reading high. Common practice, no source.
     *
     * <p>The upper point of a pair is the highest point of the sweep whose current is at most the lower one's
     * (a binary search over the running minimum from the top), so the whole sweep costs O(n log n).
     */
    static int floorCut(double[] v, double[] current) {
        int n = v.length;
        if (n < 2) {
            return -1;
        }
        double top = Double.NEGATIVE_INFINITY;
        double bottom = Double.POSITIVE_INFINITY;
        for (double c : current) {
            top = Math.max(top, c);
            bottom = Math.min(bottom, c);
        }
        double limit = Math.min(top * Math.pow(10, -FLOOR_DECADES), bottom * 1e3);
        double[] ln = new double[n];
        for (int k = 0; k < n; k++) {
            ln[k] = Math.log(current[k]);
        }
        double slope = referenceSlope(v, ln, current, limit);
        if (!(slope > 0)) {
            return -1;
        }
        double lowestCounted = FLOOR_NOISE_WIDTHS * voltageScatter(v, ln, current, limit);
        // running minimum from the top: lowest[k] = min(ln[k..n-1]), ascending in k
        double[] lowest = new double[n];
        lowest[n - 1] = ln[n - 1];
        for (int k = n - 2; k >= 0; k--) {
            lowest[k] = Math.min(ln[k], lowest[k + 1]);
        }
        // prefix sums about the sweep's first point, for the slope of any run of points in O(1)
        double v0 = v[0];
        double l0 = ln[0];
        double[] sx = new double[n + 1];
        double[] sy = new double[n + 1];
        double[] sxx = new double[n + 1];
        double[] sxy = new double[n + 1];
        double[] syy = new double[n + 1];
        for (int k = 0; k < n; k++) {
            double x = v[k] - v0;
            double y = ln[k] - l0;
            sx[k + 1] = sx[k] + x;
            sy[k + 1] = sy[k] + y;
            sxx[k + 1] = sxx[k] + x * x;
            sxy[k + 1] = sxy[k] + x * y;
            syy[k + 1] = syy[k] + y * y;
        }
        int cut = -1;
        for (int i = 0; i < n - 1; i++) {
            if (!(current[i] < limit) || !(v[i] > 0)) {
                continue;
            }
            int k = lastAtMost(lowest, ln[i]);
            double from = Math.max(v[i], lowestCounted);
            if (k <= i || k <= cut || !(v[k] > from) || junctionRise(slope, from, v[k]) < FLOOR_REACH) {
                continue;
            }
            int middle = lastAtMost(v, (v[i] + v[k]) / 2);
            if (notRising(i + 1, middle, sx, sy, sxx, sxy, syy)) {
                cut = k;
            }
        }
        return cut;
    }

    /** The largest index k with {@code ascending[k] <= x}, or -1 [1]. */
    private static int lastAtMost(double[] ascending, double x) {
        int lo = 0;
        int hi = ascending.length - 1;
        int found = -1;
        while (lo <= hi) {
            int mid = (lo + hi) >>> 1;
            if (ascending[mid] <= x) {
                found = mid;
                lo = mid + 1;
            } else {
                hi = mid - 1;
            }
        }
        return found;
    }

    /** ln of the factor by which a junction of slope s [1/V] raises its current from v1 to v2 (0 < v1 < v2) [1]. */
    private static double junctionRise(double s, double v1, double v2) {
        return lnExpm1(s * v2) - lnExpm1(s * v1);
    }

    /** ln(e^x - 1) for x > 0, without overflow [1]. */
    private static double lnExpm1(double x) {
        return x > 1 ? x + Math.log1p(-Math.exp(-x)) : Math.log(Math.expm1(x));
    }

    /**
     * Whether points {@code from..to} (inclusive) show no rise of ln I with V beyond their own scatter: fewer than 3
     * points, or a least-squares line whose rise across them is at most {@value #FLOOR_FLAT_RISE} times the
     * standard deviation of the points about it (plus 1e-9, rounding). Judged by size, not by significance: a
     * floor's reading still carries the junction's share, a few per cent, which many points would make
     * significant.
     */
    private static boolean notRising(int from, int to, double[] sx, double[] sy, double[] sxx, double[] sxy,
                                     double[] syy) {
        int m = to - from + 1;
        if (m < 3) {
            return true;
        }
        double x = sx[to + 1] - sx[from];
        double y = sy[to + 1] - sy[from];
        double xx = sxx[to + 1] - sxx[from] - x * x / m;
        double xy = sxy[to + 1] - sxy[from] - x * y / m;
        double yy = syy[to + 1] - syy[from] - y * y / m;
        if (!(xx > 0)) {
            return true;
        }
        double b = xy / xx;
        double scatter = Math.sqrt(Math.max(0, yy - b * xy) / (m - 2));
        double span = Math.sqrt(12 * xx / m);
        return b * span <= FLOOR_FLAT_RISE * scatter + 1e-9;
    }

    /**
     * The scatter of the sweep's voltages about its curve, one sigma [V]: points between {@code limit} and ten times
     * it (at least 5, else every point at or above {@code limit}), ordered by current; each voltage's departure from
     * the line through its two neighbours, by the median absolute departure (1.4826 MAD, divided by sqrt(1.5) for
     * the neighbours' own scatter). 0 with fewer than 3 usable points. It covers noise on the current too, seen
     * along the voltage.
     */
    static double voltageScatter(double[] v, double[] ln, double[] current, double limit) {
        double[] s = scatterWithin(v, ln, current, limit, 10 * limit);
        if (s == null) {
            s = scatterWithin(v, ln, current, limit, Double.POSITIVE_INFINITY);
        }
        if (s == null || s.length < 3) {
            return 0;
        }
        return 1.4826 * org.cardwright.fit.Medians.median(s) / Math.sqrt(1.5);
    }

    /** |departures| of the points with current in [lo, hi] (see {@link #voltageScatter}); null for fewer than 5 points. */
    private static double[] scatterWithin(double[] v, double[] ln, double[] current, double lo, double hi) {
        List<double[]> pts = new ArrayList<>();
        for (int k = 0; k < v.length; k++) {
            if (current[k] >= lo && current[k] <= hi) {
                pts.add(new double[] {ln[k], v[k]});
            }
        }
        if (pts.size() < 5) {
            return null;
        }
        pts.sort((a, b) -> Double.compare(a[0], b[0]));
        double[] out = new double[pts.size() - 2];
        int m = 0;
        for (int k = 1; k + 1 < pts.size(); k++) {
            double[] a = pts.get(k - 1);
            double[] here = pts.get(k);
            double[] b = pts.get(k + 1);
            if (b[0] > a[0]) {
                out[m++] = Math.abs(here[1] - (a[1] + (b[1] - a[1]) * (here[0] - a[0]) / (b[0] - a[0])));
            }
        }
        return java.util.Arrays.copyOf(out, m);
    }

    /**
     * The sweep's slope of ln I against V [1/V]: least squares over its points between {@code limit} and ten times
     * it (at least 3 points), else over every point at or above {@code limit}; NaN when there are too few.
     */
    private static double referenceSlope(double[] v, double[] ln, double[] current, double limit) {
        double s = slopeWithin(v, ln, current, limit, 10 * limit);
        return Double.isNaN(s) ? slopeWithin(v, ln, current, limit, Double.POSITIVE_INFINITY) : s;
    }

    private static double slopeWithin(double[] v, double[] ln, double[] current, double lo, double hi) {
        int m = 0;
        double x = 0;
        double y = 0;
        for (int k = 0; k < v.length; k++) {
            if (current[k] >= lo && current[k] <= hi) {
                m++;
                x += v[k];
                y += ln[k];
            }
        }
        if (m < 3) {
            return Double.NaN;
        }
        x /= m;
        y /= m;
        double xx = 0;
        double xy = 0;
        for (int k = 0; k < v.length; k++) {
            if (current[k] >= lo && current[k] <= hi) {
                xx += (v[k] - x) * (v[k] - x);
                xy += (v[k] - x) * (ln[k] - y);
            }
        }
        return xx > 0 ? xy / xx : Double.NaN;
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
    /**
     * Two points are compared only when a junction would raise its current e^2 (7.4) times between them [ln 1]:
     * noise lets neighbours trade places over a few noise widths (3 % on the current and 1 mV at 26 mV per
     * e-fold swap readings about 0.4 e-folds apart at 4.5 sigma), never this far (common practice, no source).
     */
    static final double FLOOR_REACH = 2;
    /**
     * The points inside a floor pair rise, along their least-squares line, by at most this many times their own
     * scatter about it [1]: a floor's reading moves by its wander, not by the junction's share of it (a few per
     * cent deep in the floor); the slowest forward rise of a junction, where GMIN or a shunt carries its current
     * (ln I rising as ln V), still rises 2.7 times its scatter over half a pair at 3 % noise.
     */
    static final double FLOOR_FLAT_RISE = 1.5;
    /**
     * Below this many times the sweep's voltage scatter a voltage reading says little about the junction: the
     * expected rise of a pair is counted from at least there [1].
     */
    static final double FLOOR_NOISE_WIDTHS = 3;

    /** Currents this close (relative) count as the same [1]. */
    static final double SAME_CURRENT = 1e-4;
    /** Voltages further apart than this at one current reveal a current limit [V]. */
    static final double PLATEAU_VOLTAGE = 5e-3;

    /** The path as the user wrote it, with forward slashes, so that provenance is the same on every machine. */
    public static String displayName(Path p) {
        return p.toString().replace('\\', '/');
    }
}
