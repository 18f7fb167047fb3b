package org.cardwright.lot;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.cardwright.fit.ParameterRule;
import org.cardwright.model.Param;

/**
 * What the lot decides once, for every part: which optional terms each part's fit carries (so that the parameters
 * of all parts mean the same thing), the datasheet conditions, and the temperature they are read at.
 *
 * @param rules       term rules ({@code ISR=free} to carry a term, {@code IKF=off} to leave it out)
 * @param reasons     one line per term rule: how many of the sample parts took the term
 * @param conditions  datasheet conditions (IF, VR, IZ) [A or V]
 * @param temperature device temperature of the datasheet quantities [K]
 * @param sample      the parts whose free fits decided the terms
 */
public record LotPlan(List<ParameterRule> rules, List<String> reasons, Map<Datasheet.Quantity, Double> conditions,
                      double temperature, List<String> sample) {
    public LotPlan {
        rules = List.copyOf(rules);
        reasons = List.copyOf(reasons);
        conditions = conditions.isEmpty() ? Map.of() : new EnumMap<>(conditions);
        sample = List.copyOf(sample);
    }

    /** The plan as text, for the state folder, fingerprints and other engines. */
    public String toText() {
        StringBuilder sb = new StringBuilder();
        for (ParameterRule r : rules) {
            // the lot's rules are FREE or OFF without values; written as kind and parameter, since the rule parser
            // (for users) refuses OFF for terms such as TRS1 that have no "not given" state
            sb.append("rule\t").append(r.kind().name()).append('\t').append(r.param().name()).append('\n');
        }
        for (String r : reasons) {
            sb.append("reason\t").append(r).append('\n');
        }
        for (Map.Entry<Datasheet.Quantity, Double> e : conditions.entrySet()) {
            sb.append("condition\t").append(e.getKey().name()).append('\t').append(Double.toString(e.getValue())).append('\n');
        }
        sb.append("temperature\t").append(Double.toString(temperature)).append('\n');
        for (String s : sample) {
            sb.append("sample\t").append(s).append('\n');
        }
        sb.append("end\n");
        return sb.toString();
    }

    /** Reads {@link #toText}; null when incomplete. */
    public static LotPlan fromText(String text) {
        List<ParameterRule> rules = new ArrayList<>();
        List<String> reasons = new ArrayList<>();
        Map<Datasheet.Quantity, Double> conditions = new EnumMap<>(Datasheet.Quantity.class);
        List<String> sample = new ArrayList<>();
        double t = Double.NaN;
        boolean end = false;
        try {
            for (String line : text.split("\n")) {
                String[] f = line.split("\t", 3);
                switch (f[0]) {
                    case "rule" -> rules.add(new ParameterRule(Param.valueOf(f[2]), ParameterRule.Kind.valueOf(f[1]), Double.NaN,
                            Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY));
                    case "reason" -> reasons.add(f[1]);
                    case "condition" -> conditions.put(Datasheet.Quantity.valueOf(f[1]), Double.parseDouble(f[2]));
                    case "temperature" -> t = Double.parseDouble(f[1]);
                    case "sample" -> sample.add(f[1]);
                    case "end" -> end = true;
                    default -> {
                        return null;
                    }
                }
            }
        } catch (IllegalArgumentException | IndexOutOfBoundsException e) {
            // a malformed line (an unknown name, a bad number, a missing field): the saved text is not used
            return null;
        }
        return end && Double.isFinite(t) ? new LotPlan(rules, reasons, conditions, t, sample) : null;
    }

    /** A rule for {@code p} in this plan, if any. */
    boolean rules(Param p) {
        return rules.stream().anyMatch(r -> r.param() == p);
    }

    /** "IF = 0.001 A" style text of a condition. */
    static String conditionText(Datasheet.Quantity q, double value) {
        return String.format(Locale.ROOT, "%s at %s = %.4g %s", q.label(), q.conditionLabel(), value, q.conditionUnit());
    }
}
