package org.cardwright.compare;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.cardwright.card.ParsedCard;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.sim.Bias;
import org.cardwright.sim.CapacitanceEngine;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.OperatingPoint;
import org.cardwright.sim.SimulationEngine;
import org.cardwright.sim.process.SimulationException;

/**
 * Compares two cards: both are simulated by the same engines at the same conditions, and each difference is held
 * to the plan's limits. The cards are handed to the engines as ngspice-dialect text written from their parameters,
 * so that cards read in any dialect are simulated alike.
 */
public final class CardComparer {
    /** Reverse voltages for leakage stay below this fraction of the lower BV, out of the breakdown knee [1]. */
    static final double LEAKAGE_FRACTION_OF_BV = 0.8;
    /** Breakdown reference current when neither card has IBV [A]: IBV's ngspice default. */
    private static final double DEFAULT_BREAKDOWN_CURRENT = Param.IBV.defaultValue();

    private final SimulationEngine dc;
    private final CapacitanceEngine capacitance;
    private final SimulationEngine dcB;
    private final CapacitanceEngine capacitanceB;

    /** Both cards simulated by the same engines. */
    public CardComparer(SimulationEngine dc, CapacitanceEngine capacitance) {
        this(dc, capacitance, dc, capacitance);
    }

    /**
     * Card A by the first pair of engines, card B by the second: each card evaluated with the equations of the
     * simulator it was written for, when the two dialects differ.
     */
    public CardComparer(SimulationEngine dc, CapacitanceEngine capacitance, SimulationEngine dcB,
                        CapacitanceEngine capacitanceB) {
        this.dc = dc;
        this.capacitance = capacitance;
        this.dcB = dcB;
        this.capacitanceB = capacitanceB;
    }

    /** Compares {@code a} with {@code b} (differences are B minus A). */
    public CardComparison compare(ParsedCard a, String sourceA, ParsedCard b, String sourceB, ComparisonPlan plan)
            throws SimulationException {
        return compare(a, Double.POSITIVE_INFINITY, sourceA, b, Double.POSITIVE_INFINITY, sourceB, plan);
    }

    /**
     * Compares {@code a} with {@code b}, each with the resistor its subcircuit file puts between the terminals
     * (positive infinity for none) [ohm]; the engines add it themselves.
     */
    public CardComparison compare(ParsedCard a, double shuntA, String sourceA, ParsedCard b, double shuntB, String sourceB,
                                  ComparisonPlan plan) throws SimulationException {
        CardUnderTest ca = underTest(a, shuntA);
        CardUnderTest cb = underTest(b, shuntB);
        DiodeParameters pa = a.parameters();
        DiodeParameters pb = b.parameters();
        List<String> notes = new ArrayList<>();
        ComparisonLimits limits = plan.limits();

        List<CardComparison.ParameterRow> params = new ArrayList<>();
        for (Param p : Param.values()) {
            if (pa.isGiven(p) || pb.isGiven(p)) {
                params.add(new CardComparison.ParameterRow(p.keyword(), cardValue(pa, p), cardValue(pb, p)));
            }
        }
        if (Double.isFinite(shuntA) || Double.isFinite(shuntB)) {
            // not a .model parameter: the resistor of a subcircuit file, between the terminals
            params.add(new CardComparison.ParameterRow("R(shunt)", Double.isFinite(shuntA) ? SpiceNumbers.format(shuntA, 7) : "",
                    Double.isFinite(shuntB) ? SpiceNumbers.format(shuntB, 7) : ""));
        }

        List<Bias> fwd = new ArrayList<>();
        for (double t : plan.temperatures()) {
            for (double i : plan.decades()) {
                fwd.add(Bias.current(i, t));
            }
        }
        List<OperatingPoint> fa = dc.dc(ca, fwd);
        List<OperatingPoint> fb = dcB.dc(cb, fwd);
        List<CardComparison.ForwardRow> forward = new ArrayList<>();
        for (int k = 0; k < fwd.size(); k++) {
            double va = fa.get(k).voltage();
            double vb = fb.get(k).voltage();
            forward.add(new CardComparison.ForwardRow(fwd.get(k).temperature(), fwd.get(k).value(), va, vb,
                    Math.abs(vb - va) > limits.forwardVoltage()));
        }

        double lowestBv = Math.min(pa.isGiven(Param.BV) ? pa.get(Param.BV) : Double.POSITIVE_INFINITY,
                pb.isGiven(Param.BV) ? pb.get(Param.BV) : Double.POSITIVE_INFINITY);
        List<Bias> rev = new ArrayList<>();
        for (double t : plan.temperatures()) {
            for (double v : plan.leakageVoltages()) {
                if (v < LEAKAGE_FRACTION_OF_BV * lowestBv) {
                    rev.add(Bias.voltage(-v, t));
                }
            }
        }
        if (rev.size() < plan.temperatures().size() * plan.leakageVoltages().size()) {
            notes.add(String.format(Locale.ROOT, "leakage: voltages at or above %.0f %% of the lower BV (%s V) left out",
                    LEAKAGE_FRACTION_OF_BV * 100, SpiceNumbers.format(lowestBv, 4)));
        }
        List<CardComparison.LeakageRow> leakage = new ArrayList<>();
        if (!rev.isEmpty()) {
            List<OperatingPoint> la = dc.dc(ca, rev);
            List<OperatingPoint> lb = dcB.dc(cb, rev);
            for (int k = 0; k < rev.size(); k++) {
                double ia = -la.get(k).current();
                double ib = -lb.get(k).current();
                double ratio = Math.max(ia, ib) / Math.min(ia, ib);
                leakage.add(new CardComparison.LeakageRow(rev.get(k).temperature(), -rev.get(k).value(), ia, ib,
                        !(ratio <= limits.leakageFactor())));
            }
        }

        List<CardComparison.CapacitanceRow> caps = new ArrayList<>();
        boolean anyCharge = pa.get(Param.CJO) > 0 || pb.get(Param.CJO) > 0 || pa.get(Param.TT) > 0 || pb.get(Param.TT) > 0;
        if (!anyCharge) {
            notes.add("capacitance: neither card gives CJO or TT, so both have none");
        } else if (!plan.capacitanceBiases().isEmpty()) {
            List<Bias> biases = new ArrayList<>();
            for (double t : plan.temperatures()) {
                for (double v : plan.capacitanceBiases()) {
                    biases.add(Bias.voltage(v, t));
                }
            }
            List<Double> qa = capacitance.capacitance(ca, biases, plan.frequency());
            List<Double> qb = capacitanceB.capacitance(cb, biases, plan.frequency());
            for (int k = 0; k < biases.size(); k++) {
                double x = qa.get(k);
                double y = qb.get(k);
                // below a femtofarad no meter tells two capacitances apart (common practice, no source)
                double rel = Math.abs(y - x) / Math.max(Math.abs(x), CAPACITANCE_FLOOR);
                caps.add(new CardComparison.CapacitanceRow(biases.get(k).temperature(), biases.get(k).value(), x, y,
                        rel > limits.capacitanceRelative()));
            }
        }

        List<CardComparison.BreakdownRow> breakdown = new ArrayList<>();
        if (pa.isGiven(Param.BV) || pb.isGiven(Param.BV)) {
            double iref = pa.isGiven(Param.BV) ? pa.get(Param.IBV) : pb.isGiven(Param.BV) ? pb.get(Param.IBV)
                    : DEFAULT_BREAKDOWN_CURRENT;
            List<Bias> knee = new ArrayList<>();
            for (double t : plan.temperatures()) {
                knee.add(Bias.current(-iref, t));
            }
            List<OperatingPoint> ka = pa.isGiven(Param.BV) ? dc.dc(ca, knee) : null;
            List<OperatingPoint> kb = pb.isGiven(Param.BV) ? dcB.dc(cb, knee) : null;
            for (int k = 0; k < knee.size(); k++) {
                double va = ka == null ? Double.NaN : -ka.get(k).voltage();
                double vb = kb == null ? Double.NaN : -kb.get(k).voltage();
                boolean flagged = ka == null || kb == null || Math.abs(vb - va) / va > limits.breakdownRelative();
                breakdown.add(new CardComparison.BreakdownRow(knee.get(k).temperature(), iref, va, vb, flagged));
            }
        } else {
            notes.add("breakdown: neither card gives BV");
        }
        String engines = dc.describe().equals(dcB.describe()) ? dc.describe()
                : "A: " + dc.describe() + "; B: " + dcB.describe();
        return new CardComparison(a.name() + " (" + sourceA + ")", b.name() + " (" + sourceB + ")", engines,
                params, forward, leakage, caps, breakdown, notes);
    }

    /** The card in ngspice keywords and meaning, from its parsed parameters, for the engines. */
    static CardUnderTest underTest(ParsedCard card) {
        return underTest(card, Double.POSITIVE_INFINITY);
    }

    /** As {@link #underTest(ParsedCard)}, with a resistor between the terminals (infinity for none) [ohm]. */
    static CardUnderTest underTest(ParsedCard card, double shunt) {
        return CardUnderTest.ngspice(card.name(), card.parameters()).withShunt(shunt);
    }

    /** The value a card gives, or its default in parentheses (empty for terms that exist only when given). */
    /** Capacitances below this count as equal in a comparison [F]. */
    static final double CAPACITANCE_FLOOR = 1e-15;

    private static String cardValue(DiodeParameters p, Param q) {
        if (p.isGiven(q)) {
            return SpiceNumbers.format(q.toCardValue(p.get(q)), 7);
        }
        return q.activeOnlyWhenGiven() ? "" : "(" + SpiceNumbers.format(q.toCardValue(p.get(q)), 7) + ")";
    }
}
