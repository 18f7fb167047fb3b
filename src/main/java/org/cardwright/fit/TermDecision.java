package org.cardwright.fit;

import java.util.List;
import org.cardwright.model.Param;

/**
 * Whether an optional model term went into the card, and why.
 *
 * @param term      plain name of the term
 * @param params    its parameters
 * @param included  true when the card carries it
 * @param deltaBic  change of the Bayesian information criterion on adding the term (negative favours it);
 *                  NaN when it was not tried
 * @param reason    one sentence for the user
 */
public record TermDecision(String term, List<Param> params, boolean included, double deltaBic, String reason) {
    public TermDecision {
        params = List.copyOf(params);
    }
}
