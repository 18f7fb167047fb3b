package org.cardwright.report;

import java.util.List;
import org.cardwright.workflow.CompareWorkflow;

/** The overlay page of a comparison. */
public final class ComparePage {
    private ComparePage() {
    }

    public static String render(CompareWorkflow.Outcome o, String command, List<PageFacts.DataFile> dataFiles) {
        return "";
    }
}
