package org.cardwright.lot;

import java.util.List;
import org.cardwright.data.ReadOptions;
import org.cardwright.fit.CapacitanceOptions;
import org.cardwright.fit.DeviceKind;
import org.cardwright.fit.FitSettings;
import org.cardwright.fit.ParameterRule;

/**
 * How every part of a lot is read and fitted: the same for each part.
 *
 * @param read        how the files are read
 * @param kind        device kind
 * @param rules       the user's parameter rules (they win over the lot's term choice)
 * @param capacitance how C-V readings were taken
 */
public record LotSettings(ReadOptions read, DeviceKind kind, List<ParameterRule> rules, CapacitanceOptions capacitance) {
    public LotSettings {
        rules = List.copyOf(rules);
    }

    /** Fit settings with the lot's term rules first and the user's rules after them. */
    FitSettings fitSettings(List<ParameterRule> lotRules) {
        return FitSettings.defaults().withKind(kind).withRules(lotRules).withRules(rules);
    }

    /** Everything that changes a part's fit, as text (for fingerprints). */
    String text() {
        StringBuilder sb = new StringBuilder();
        sb.append("read ").append(read).append('\n');
        sb.append("kind ").append(kind.name()).append('\n');
        for (ParameterRule r : rules) {
            sb.append("rule ").append(r.text()).append('\n');
        }
        sb.append("cv ").append(capacitance.strayCapacitance()).append(' ').append(capacitance.frequency()).append('\n');
        return sb.toString();
    }
}
