package org.cardwright.workflow;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.cardwright.data.IvPoint;
import org.cardwright.testsupport.FloorSweeps;
import org.cardwright.testsupport.FloorSweeps.FloorKind;
import org.cardwright.testsupport.FloorSweeps.Member;
import org.cardwright.testsupport.FloorSweeps.Row;
import org.cardwright.testsupport.FloorSweeps.Sweep;
import org.junit.jupiter.api.Test;

/**
 * The instrument-floor rule ({@link Inputs#setAsideBelowFloor}) on the whole family of {@link FloorSweeps}: four
 * invented junctions (ngspice 39 equations, GMIN included) x five densities (20 to 10^5 points) x three noise
 * levels x six meters (no floor; offsets of 1 pA, 100 pA, 10 nA; resolutions of 1 pA and 10 nA) x voltage or
 * current steps. What a meter's floor does to a reading, and that a real junction's current rises with its
 * voltage everywhere in forward bias, is common practice, no source.
 */
class FloorFamilyTest {
    /**
     * Without a floor, at most this share of a sweep may be set aside: readings whose voltage lies within the
     * noise of 0 V can show no rise, and nothing else may go [1].
     */
    static final double NO_FLOOR_SHARE = 0.01;
    /** A point counts as deep in the floor when its junction current is below the floor current / this: the floor then carries more than 90 % of its reading [1]. */
    static final double DEEP_RATIO = 10;
    /** At least this share of the deep-floor points that reach the rule must be set aside [1]. */
    static final double DEEP_SHARE = 0.9;
    /** The deep-floor share is asked of members with at least this many deep-floor points [points]. */
    static final int MIN_DEEP_POINTS = 5;
    /**
     * Of the deep-floor points, this many may stay whatever the share: the meter's 20 % wander can lift the one or
     * two deep readings next to the floor's edge above every reading over them, and then nothing in the data
     * puts them in the floor (it matters only in sparse sweeps) [points].
     */
    static final int EDGE_MISSES = 2;
    /**
     * The deep-floor share is asked only where the sweep reaches a junction current this many times below the
     * deep-floor level (e^2, the junction rise across which the rule compares readings): a floor shallower than
     * that (a sweep starting 1 to 1.5 decades below the floor, within about kT/q of 0 V) shows its readings rising
     * with the junction's share by more than their scatter, as the slowest real rise (current carried by GMIN) does,
     * and is kept rather than risk real data [1].
     */
    static final double FLOOR_DEPTH = Math.exp(2);
    /**
     * No point whose junction current is more than this many times the floor current may be set aside: there the
     * floor is at most a fifth of the reading. In the densest noisy members the floor's own highest readings (two
     * counts of a quantum; twice an offset) are matched by readings of a junction at up to about 4.2 times the floor
     * (5 sigma of 3 % + 1 mV + 0.3 counts) [1].
     */
    static final double ABOVE_FLOOR_LIMIT = 5;

    /**
     * What the rule did to one member: its forward points, how many it set aside, the deep-floor points and how
     * many of them it set aside, the highest junction current it set aside and the lowest of the sweep (both
     * over the floor current; 0 and 1 without a floor).
     */
    record Outcome(Member member, int forward, int aside, int deep, int deepAside, double highest, double lowest) {
    }

    /** Generates the member's sweep from its truth and runs the rule on it. */
    static Outcome outcome(Member m, double[][] truth) {
        Sweep s = FloorSweeps.sweep(m, truth);
        List<Row> forward = s.forward();
        Set<Integer> aside = setAside(forward, s.kelvin());
        if (m.floor().kind() == FloorKind.NONE) {
            return new Outcome(m, forward.size(), aside.size(), 0, 0, 0, 1);
        }
        double floor = m.floor().current();
        int deep = 0;
        int deepAside = 0;
        double highest = 0;
        double lowest = Double.POSITIVE_INFINITY;
        for (Row r : forward) {
            lowest = Math.min(lowest, r.trueCurrent() / floor);
            if (r.trueCurrent() < floor / DEEP_RATIO) {
                deep++;
                deepAside += aside.contains(r.line()) ? 1 : 0;
            }
            if (aside.contains(r.line())) {
                highest = Math.max(highest, r.trueCurrent() / floor);
            }
        }
        return new Outcome(m, forward.size(), aside.size(), deep, deepAside, highest, lowest);
    }

    @Test
    void everyMemberOfTheFamilyIsSortedIntoFloorAndJunction() {
        List<Member> family = FloorSweeps.family();
        // the members are independent: run them on every core, then judge them in order
        Map<String, double[][]> truths = new java.util.concurrent.ConcurrentHashMap<>();
        family.parallelStream().map(FloorFamilyTest::truthKey).distinct().forEach(k -> {
            Member m = family.stream().filter(x -> truthKey(x).equals(k)).findFirst().orElseThrow();
            truths.put(k, FloorSweeps.truth(m.part(), m.points(), m.mode()));
        });
        List<Outcome> outcomes = family.parallelStream().map(m -> outcome(m, truths.get(truthKey(m)))).toList();
        List<String> failures = new ArrayList<>();
        int failedMembers = 0;
        double worstNoFloorShare = 0;
        String worstNoFloor = "";
        double worstDeepShare = 1;
        String worstDeep = "";
        double highestAside = 0;
        String highestAsideMember = "";
        long checkedDeep = 0;
        int[] byKind = new int[3];
        for (Outcome o : outcomes) {
            Member m = o.member();
            List<String> mine = new ArrayList<>();
            if (m.floor().kind() == FloorKind.NONE) {
                double share = o.aside() / (double) o.forward();
                if (share > worstNoFloorShare) {
                    worstNoFloorShare = share;
                    worstNoFloor = m.toString();
                }
                if (share > NO_FLOOR_SHARE) {
                    byKind[0]++;
                    mine.add(String.format(Locale.ROOT, "%s: %d of %d points set aside (%.1f %%) without a floor",
                            m, o.aside(), o.forward(), 100 * share));
                }
            } else {
                if (o.highest() > highestAside) {
                    highestAside = o.highest();
                    highestAsideMember = m.toString();
                }
                if (o.highest() > ABOVE_FLOOR_LIMIT) {
                    byKind[1]++;
                    mine.add(String.format(Locale.ROOT, "%s: a point at %.3g times the floor current set aside",
                            m, o.highest()));
                }
                if (o.deep() >= MIN_DEEP_POINTS && o.lowest() <= 1 / DEEP_RATIO / FLOOR_DEPTH) {
                    checkedDeep++;
                    double share = o.deepAside() / (double) o.deep();
                    if (share < worstDeepShare) {
                        worstDeepShare = share;
                        worstDeep = m.toString();
                    }
                    if (share < DEEP_SHARE && o.deepAside() < o.deep() - EDGE_MISSES) {
                        byKind[2]++;
                        mine.add(String.format(Locale.ROOT, "%s: %d of %d points deep in the floor set aside (%.1f %%)",
                                m, o.deepAside(), o.deep(), 100 * share));
                    }
                }
            }
            if (!mine.isEmpty()) {
                failedMembers++;
                failures.addAll(mine);
            }
        }
        System.out.printf(Locale.ROOT, "floor family: %d members, %d fail (%d too much set aside without a floor, %d set "
                + "aside far above the floor, %d too little of the deep floor)%n", family.size(), failedMembers, byKind[0],
                byKind[1], byKind[2]);
        System.out.printf(Locale.ROOT, "floor family: without a floor the largest share set "
                        + "aside %.4f %% (%s); deep-floor share checked in %d members, lowest %.1f %% (%s); highest junction "
                        + "current set aside %.3g x the floor (%s)%n", 100 * worstNoFloorShare,
                worstNoFloor, checkedDeep, 100 * worstDeepShare, worstDeep, highestAside, highestAsideMember);
        failures.stream().limit(40).forEach(f -> System.out.println("  " + f));
        assertEquals(720, family.size(), "4 parts x 5 densities x 3 noises x 6 meters x 2 modes");
        assertTrue(failures.isEmpty(), failedMembers + " of " + family.size() + " members fail, e.g. "
                + failures.subList(0, Math.min(5, failures.size())));
    }

    private static String truthKey(Member m) {
        return m.part().name() + "/" + m.points() + "/" + m.mode();
    }

    /** Runs the rule on the forward rows as one sweep of one file; returns the lines it set aside. */
    static Set<Integer> setAside(List<Row> forward, double kelvin) {
        List<Inputs.Located> pts = new ArrayList<>(forward.size());
        for (Row r : forward) {
            pts.add(new Inputs.Located(new IvPoint(r.voltage(), r.current(), kelvin, r.line()), "family.csv"));
        }
        Inputs.setAsideBelowFloor(pts, new ArrayList<>());
        Set<Integer> kept = new HashSet<>();
        pts.forEach(l -> kept.add(l.point().line()));
        Set<Integer> aside = new HashSet<>();
        forward.forEach(r -> {
            if (!kept.contains(r.line())) {
                aside.add(r.line());
            }
        });
        return aside;
    }
}
