package org.cardwright.compare;

import java.util.Locale;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.model.Ngspice39;

/** The comparison as terminal tables; flagged rows end with {@code <- beyond limit}. */
public final class ComparisonText {
    private static final String FLAG = "  <- beyond limit";

    private ComparisonText() {
    }

    public static String render(CardComparison c, ComparisonPlan plan) {
        StringBuilder sb = new StringBuilder();
        sb.append("A: ").append(c.nameA()).append('\n');
        sb.append("B: ").append(c.nameB()).append('\n');
        sb.append("Simulated by ").append(c.engine()).append("; differences are B minus A\n");

        sb.append("\nParameters\n");
        sb.append(String.format(Locale.ROOT, "  %-6s %16s %16s%n", "param", "A", "B"));
        for (CardComparison.ParameterRow r : c.parameters()) {
            sb.append(String.format(Locale.ROOT, "  %-6s %16s %16s%s%n", r.keyword(), dash(r.a()), dash(r.b()),
                    bare(r.a()).equals(bare(r.b())) ? "" : "  *"));
        }

        sb.append(String.format(Locale.ROOT, "%nForward voltage at each decade of current; limit %.3f mV%n",
                plan.limits().forwardVoltage() * 1e3));
        sb.append(String.format(Locale.ROOT, "  %8s %10s %12s %12s %12s%n", "T [degC]", "I [A]", "A [V]", "B [V]", "B-A [mV]"));
        for (CardComparison.ForwardRow r : c.forward()) {
            sb.append(String.format(Locale.ROOT, "  %8s %10s %12.7f %12.7f %12.4f%s%n", celsius(r.temperature()),
                    current(r.current()), r.a(), r.b(), r.difference() * 1e3, r.flagged() ? FLAG : ""));
        }

        if (!c.leakage().isEmpty()) {
            sb.append(String.format(Locale.ROOT, "%nLeakage: reverse current at each reverse voltage VR; B/A is B's current "
                            + "divided by A's; limit: either a factor of %s above the other%n",
                    trim(plan.limits().leakageFactor())));
            sb.append(String.format(Locale.ROOT, "  %8s %8s %12s %12s %10s%n", "T [degC]", "VR [V]", "A [A]", "B [A]", "B/A"));
            for (CardComparison.LeakageRow r : c.leakage()) {
                sb.append(String.format(Locale.ROOT, "  %8s %8s %12.4e %12.4e %10.4g%s%n", celsius(r.temperature()),
                        trim(r.voltage()), r.a(), r.b(), r.ratio(), r.flagged() ? FLAG : ""));
            }
        }

        if (!c.capacitance().isEmpty()) {
            sb.append(String.format(Locale.ROOT, "%nCapacitance at each reverse voltage VR, at %s Hz (parallel, RS included); limit %s %%%n",
                    current(plan.frequency()), trim(plan.limits().capacitanceRelative() * 100)));
            sb.append(String.format(Locale.ROOT, "  %8s %8s %12s %12s %9s%n", "T [degC]", "VR [V]", "A [pF]", "B [pF]", "B-A [%]"));
            for (CardComparison.CapacitanceRow r : c.capacitance()) {
                sb.append(String.format(Locale.ROOT, "  %8s %8s %12.5f %12.5f %9.3f%s%n", celsius(r.temperature()),
                        trim(r.reverseVoltage()), r.a() * 1e12, r.b() * 1e12, r.relative() * 100, r.flagged() ? FLAG : ""));
            }
        }

        if (!c.breakdown().isEmpty()) {
            sb.append(String.format(Locale.ROOT, "%nBreakdown: reverse voltage where each card's reverse current exceeds its own "
                            + "leakage below the knee by %s A; limit %s %%%n",
                    SpiceNumbers.format(c.breakdown().get(0).current(), 4), trim(plan.limits().breakdownRelative() * 100)));
            sb.append(String.format(Locale.ROOT, "  %8s %12s %12s %9s%n", "T [degC]", "A [V]", "B [V]", "B-A [%]"));
            for (CardComparison.BreakdownRow r : c.breakdown()) {
                sb.append(String.format(Locale.ROOT, "  %8s %12s %12s %9s%s%n", celsius(r.temperature()), volts(r.a()),
                        volts(r.b()), Double.isNaN(r.a()) || Double.isNaN(r.b()) ? "-"
                                : String.format(Locale.ROOT, "%.3f", (r.b() - r.a()) / r.a() * 100),
                        r.flagged() ? FLAG : ""));
            }
        }
        if (!c.notes().isEmpty()) {
            sb.append('\n');
            c.notes().forEach(n -> sb.append("note: ").append(n).append('\n'));
        }
        long flagged = c.flaggedCount();
        sb.append('\n').append(flagged == 0 ? "no difference beyond the limits" : flagged + " differences beyond the limits")
                .append('\n');
        return sb.toString();
    }

    private static String dash(String s) {
        return s.isEmpty() ? "-" : s;
    }

    private static String celsius(double kelvin) {
        return org.cardwright.model.Celsius.oneDecimal(kelvin);
    }

    private static String current(double a) {
        return String.format(Locale.ROOT, "%.0e", a);
    }

    private static String volts(double v) {
        return Double.isNaN(v) ? "none" : String.format(Locale.ROOT, "%.4f", v);
    }

    private static String trim(double x) {
        return new java.math.BigDecimal(Double.toString(x)).stripTrailingZeros().toPlainString();
    }

    /** A parameter cell without the parentheses that mark a default. */
    private static String bare(String cell) {
        return cell.startsWith("(") && cell.endsWith(")") ? cell.substring(1, cell.length() - 1) : cell;
    }
}
