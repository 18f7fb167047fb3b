package org.cardwright.lot;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

/**
 * What a lot run produced.
 *
 * @param request    the request
 * @param parts      every part's result, in part order
 * @param plan       the lot's term choice and datasheet conditions
 * @param statistics the statistics (outliers left out)
 * @param corners    the typical and corner parameter sets
 * @param datasheet  the datasheet rows
 * @param cards      the card files written, in order
 * @param reused     parts whose stored result from an earlier run was taken
 * @param seconds    wall time of the fits [s]
 * @param curves     forward curves of a sample of parts and of the corner cards, for the page
 */
public record LotOutcome(LotRequest request, List<PartResult> parts, LotPlan plan, LotStatistics statistics,
                         List<LotCards.Corner> corners, List<DatasheetRow> datasheet, List<Path> cards, int reused,
                         double seconds, LotCurves.Curves curves) {

    /**
     * One datasheet quantity over the lot.
     *
     * @param quantity  the quantity
     * @param condition its condition (IF, VR, IZ) [A or V]
     * @param measured  measured values of the parts that are not outliers, in part order [SI]
     * @param cards     the same from each part's own card [SI]
     * @param corners   from the typical and corner cards, by corner suffix [SI]
     */
    public record DatasheetRow(Datasheet.Quantity quantity, double condition, double[] measured, double[] cards,
                               Map<String, Double> corners) {
    }

    /** The parts that could not be fitted. */
    public List<PartResult> failed() {
        return parts.stream().filter(p -> !p.ok()).toList();
    }
}
