package org.cardwright.report;

import java.util.Locale;
import org.cardwright.fit.FitResult;
import org.cardwright.fit.FittedParameter;
import org.cardwright.fit.KindResiduals;
import org.cardwright.fit.SweepResiduals;
import org.cardwright.fit.TermDecision;
import org.cardwright.model.Param;
import org.cardwright.workflow.FitOutcome;

/** The fit summary for a terminal. */
public final class FitText {
    private FitText() {
    }

    /** Renders the whole summary. */
    public static String render(String name, FitOutcome outcome) {
        FitResult r = outcome.fit();
        StringBuilder sb = new StringBuilder();
        for (String note : outcome.inputs().notes()) {
            sb.append("note: ").append(note).append('\n');
        }
        sb.append(String.format(Locale.ROOT, "Model %s: %d points fitted (%d forward I-V at %d temperature(s))%n%n", name,
                r.points(), outcome.inputs().forward().size(), r.residuals().size()));
        sb.append(parameterTable(r));
        r.shunt().ifPresent(sh -> sb.append(String.format(Locale.ROOT,
                "  shunt resistor between the terminals (not a .model parameter; carried by the subcircuit file): %s%s%n",
                Units.engineering(sh.resistance(), "ohm"),
                Double.isFinite(sh.standardError()) ? String.format(Locale.ROOT, " +/- %.3g %%", 100 * sh.standardError() / sh.resistance()) : "")));
        sb.append("\nOptional terms\n");
        int termWidth = 28;
        for (TermDecision d : r.terms()) {
            termWidth = Math.max(termWidth, termLabel(d).length());
        }
        for (TermDecision d : r.terms()) {
            sb.append(String.format(Locale.ROOT, "  %-" + termWidth + "s %-4s %s%n", termLabel(d),
                    d.included() ? "yes" : "no", d.reason()));
        }
        sb.append("\nResiduals, model minus measured terminal voltage\n");
        sb.append(String.format(Locale.ROOT, "  %8s %6s %-22s %9s %9s  %s%n", "T [degC]", "points", "current range",
                "RMS [mV]", "max [mV]", "largest at"));
        for (SweepResiduals s : r.residuals()) {
            sb.append(String.format(Locale.ROOT, "  %8s %6d %-22s %9s %9s  %s%n", Units.celsius(s.temperature()),
                    s.points(), Units.engineering(s.lowCurrent(), "A") + " .. " + Units.engineering(s.highCurrent(), "A"),
                    Units.millivolts(s.rms(), 3), Units.millivolts(s.max(), 3), Units.engineering(s.worstCurrent(), "A")));
        }
        if (!r.otherResiduals().isEmpty()) {
            sb.append("\nResiduals of the other data, model minus measured\n");
            sb.append(String.format(Locale.ROOT, "  %-18s %8s %6s %10s %10s  %s%n", "data", "T [degC]", "points", "RMS", "max", "largest at"));
            for (KindResiduals k : r.otherResiduals()) {
                sb.append(String.format(Locale.ROOT, "  %-18s %8s %6d %10s %10s  %s%n", k.kind(), Units.celsius(k.temperature()),
                        k.points(), String.format(Locale.ROOT, "%.3f %s", k.rms(), k.unit()),
                        String.format(Locale.ROOT, "%.3f %s", k.max(), k.unit()), k.worst()));
            }
        }
        sb.append(String.format(Locale.ROOT, "%nOptimiser: %s; %d evaluations; chi-square %.4g, reduced %.4g (%d degrees of freedom)%n",
                r.stopReason(), r.evaluations(), r.chiSquare(), r.reducedChiSquare(), r.degreesOfFreedom()));
        if (!r.warnings().isEmpty()) {
            sb.append("\nWarnings\n");
            for (String w : r.warnings()) {
                sb.append("  - ").append(w).append('\n');
            }
        }
        sb.append('\n');
        for (FitOutcome.WrittenCard c : outcome.cards()) {
            sb.append("wrote ").append(c.file().toString().replace('\\', '/')).append(" (").append(c.dialect().simulator());
            if (!c.leftOut().isEmpty()) {
                sb.append("; refitted without ").append(String.join(" ", c.leftOut().stream().map(Param::keyword).toList()))
                        .append(", worst RMS ").append(c.refit().orElseThrow().costAgainst(r));
            } else if (c.refit().isPresent()) {
                sb.append("; fitted with ").append(c.dialect().flavour().label()).append("'s own equations, worst RMS ")
                        .append(c.refit().get().costAgainst(r));
            }
            sb.append(")\n");
        }
        return sb.toString();
    }

    /** The term's name, with its keywords in brackets. */
    private static String termLabel(TermDecision d) {
        String brackets = " (" + keywords(d) + ")";
        return d.params().isEmpty() || d.term().endsWith(brackets) ? d.term() : d.term() + brackets;
    }

    private static String keywords(TermDecision d) {
        return String.join(", ", d.params().stream().map(Param::keyword).toList());
    }

    /** The parameter table: value, standard error, where the value came from. */
    public static String parameterTable(FitResult r) {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "  %-5s %14s %-6s %12s  %s%n", "param", "value", "unit", "std. error", "origin"));
        for (FittedParameter p : r.fitted()) {
            String unit = p.param() == Param.TNOM ? "degC" : p.param().unit();
            String err;
            if (!p.fitted()) {
                err = "";
            } else if (!Double.isFinite(p.standardError())) {
                err = "unknown";
            } else if (p.value() != 0) {
                err = String.format(Locale.ROOT, "%.3g %%", 100 * Math.abs(p.standardError() / p.value()));
            } else {
                err = String.format(Locale.ROOT, "%.3g", p.standardError());
            }
            String origin = switch (p.origin()) {
                case FITTED -> "fitted";
                case FIXED_BY_USER -> "held (your rule)";
                case PRESET -> "held (preset)";
                case CHOSEN -> "held (chosen in the data)";
            };
            sb.append(String.format(Locale.ROOT, "  %-5s %14.6g %-6s %12s  %s%n", p.param().keyword(),
                    p.param().toCardValue(p.value()), unit, err, origin));
        }
        return sb.toString();
    }
}
