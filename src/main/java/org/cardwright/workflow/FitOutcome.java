package org.cardwright.workflow;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.cardwright.card.Dialect;
import org.cardwright.fit.FitResult;
import org.cardwright.model.Param;

/**
 * What the fit job produced.
 *
 * @param fit    the full fit (every term the data warrant)
 * @param cards  one card per dialect
 * @param inputs what was read
 */
public record FitOutcome(FitResult fit, List<WrittenCard> cards, Inputs inputs) {

    /**
     * One card written.
     *
     * @param dialect  its dialect
     * @param file     where it was written
     * @param text     its text
     * @param leftOut  fitted parameters this dialect cannot carry
     * @param refit    the refit without them, when any were left out
     * @param shunted  the subcircuit file beside the card, when the fit carries a shunt resistor
     */
    public record WrittenCard(Dialect dialect, Path file, String text, List<Param> leftOut, Optional<FitResult> refit,
                              Optional<ShuntedFile> shunted) {
        public WrittenCard {
            leftOut = List.copyOf(leftOut);
            java.util.Objects.requireNonNull(shunted, "shunted");
        }

        /** A card without a subcircuit file. */
        public WrittenCard(Dialect dialect, Path file, String text, List<Param> leftOut, Optional<FitResult> refit) {
            this(dialect, file, text, leftOut, refit, Optional.empty());
        }
    }

    /**
     * The subcircuit file of a card whose fit carries a shunt resistor (card/ShuntedCard).
     *
     * @param file where it is written
     * @param text its text
     */
    public record ShuntedFile(Path file, String text) {
    }
}
