package org.cardwright.workflow;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.cardwright.data.IvPoint;
import org.junit.jupiter.api.Test;

/** Points held at an instrument's current limit are set aside and named, never fitted. */
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
}
