package org.cardwright.workflow;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.cardwright.data.IvPoint;
import org.junit.jupiter.api.Test;

/** Points held at an instrument's current limit, or lost in its floor, are set aside and named, never fitted. */
class ComplianceTest {
    @Test
    void aCurrentHeldWhileTheVoltageMovesIsSetAside() {
        List<Inputs.Located> pts = new ArrayList<>();
        double[][] rows = {{0.60, 1e-4}, {0.66, 1e-3}, {0.72, 1e-2}, {0.80, 0.1}, {0.85, 0.1}, {0.90, 0.1}};
        for (int i = 0; i < rows.length; i++) {
            pts.add(new Inputs.Located(new IvPoint(rows[i][0], rows[i][1], 298.15, i + 10), "smu.csv"));
        }
        // a sweep that repeats a current at (almost) the same voltage is not a limit
        pts.add(new Inputs.Located(new IvPoint(0.6601, 1e-3, 298.15, 20), "smu.csv"));
        List<String> notes = new ArrayList<>();
        Inputs.setAsideCompliance(pts, notes);
        assertEquals(4, pts.size(), "the three points at 0.1 A are gone, the other four stay");
        assertEquals(1, notes.size());
        assertTrue(notes.get(0).startsWith("smu.csv: lines 13, 14, 15 hold the current at 0.1000 A"), notes.get(0));
    }

    @Test
    void pointsBelowTheInstrumentsFloorAreSetAside() {
        List<Inputs.Located> pts = new ArrayList<>();
        // a voltage-forced sweep: the bottom reads the meter's floor (about 2 pA, wandering), then the diode
        double[][] rows = {{0.05, 2.1e-12}, {0.10, 1.6e-12}, {0.15, 2.4e-12}, {0.20, 2.0e-12}, {0.25, 9e-12},
            {0.30, 6e-11}, {0.35, 4e-10}, {0.40, 3e-9}, {0.45, 2e-8}, {0.50, 1.4e-7}, {0.55, 1e-6}, {0.60, 7e-6}};
        for (int i = 0; i < rows.length; i++) {
            pts.add(new Inputs.Located(new IvPoint(rows[i][0], rows[i][1], 298.15, i + 5), "smu.csv"));
        }
        List<String> notes = new ArrayList<>();
        Inputs.setAsideBelowFloor(pts, notes);
        assertEquals(8, pts.size(), "0.25 V and up stay");
        assertEquals(1, notes.size());
        assertTrue(notes.get(0).startsWith("smu.csv: 4 forward points at and below 0.2000 V set aside"), notes.get(0));
        List<String> none = new ArrayList<>();
        Inputs.setAsideBelowFloor(pts, none);
        assertTrue(none.isEmpty(), "a clean exponential sweep keeps every point");
    }
}
