package org.cardwright.compare;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.cardwright.card.ParsedCard;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
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
    /**
     * A card's leakage below the knee above this share of the breakdown reference current gets a note: from there on
     * "the voltage at the reference current" and "the voltage where the current exceeds the leakage by it" differ by
     * more than NBV Vt ln(1.01), about 0.5 mV at room temperature [1].
     */
    static final double LEAKAGE_NOTE_FRACTION = 0.01;
    /**
     * Leakage below the knee beyond this many times the reference current leaves the knee undefined at that current:
     * between the leakage probe at {@link #LEAKAGE_FRACTION_OF_BV} of BV and the knee, the SPICE reverse law
     * IS (1 - (3 N Vt/(e |V|))^3) still rises by about IS (3 N Vt/(e BV))^3, some 1e-5 IS for a 3 V junction at
     * room temperature, which then reaches the reference current itself [1].
     */
    static final double UNDEFINED_KNEE_RATIO = 1e4;
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
                // flagged when either card's current is more than the factor above the other's
                double ratio = Math.max(ia / ib, ib / ia);
                leakage.add(new CardComparison.LeakageRow(rev.get(k).temperature(), -rev.get(k).value(), ia, ib,
                        !(ratio <= limits.leakageFactor())));
            }
        }

        List<CardComparison.CapacitanceRow> caps = new ArrayList<>();
        boolean anyCharge = pa.get(Param.CJO) > 0 || pb.get(Param.CJO) > 0 || pa.get(Param.TT) > 0 || pb.get(Param.TT) > 0;
        if (!anyCharge) {
            notes.add("capacitance: neither card gives CJO or TT, so both have none");
        } else if (!plan.capacitanceVoltages().isEmpty()) {
            List<Bias> biases = new ArrayList<>();
            for (double t : plan.temperatures()) {
                for (double v : plan.capacitanceVoltages()) {
                    // a reverse voltage given as a magnitude: the anode sits at -v; in the knee a meter reads the
                    // breakdown conductance, not a capacitance, so the same rule as for leakage applies
                    if (v < LEAKAGE_FRACTION_OF_BV * lowestBv) {
                        biases.add(Bias.voltage(v == 0 ? 0.0 : -v, t));
                    }
                }
            }
            if (biases.size() < plan.temperatures().size() * plan.capacitanceVoltages().size()) {
                notes.add(String.format(Locale.ROOT, "capacitance: reverse voltages at or above %.0f %% of the lower BV (%s V) left out",
                        LEAKAGE_FRACTION_OF_BV * 100, SpiceNumbers.format(lowestBv, 4)));
            }
            List<Double> qa = biases.isEmpty() ? List.of() : capacitance.capacitance(ca, biases, plan.frequency());
            List<Double> qb = biases.isEmpty() ? List.of() : capacitanceB.capacitance(cb, biases, plan.frequency());
            for (int k = 0; k < biases.size(); k++) {
                double x = qa.get(k);
                double y = qb.get(k);
                // below a femtofarad no meter tells two capacitances apart (common practice, no source)
                double rel = Math.abs(y - x) / Math.max(Math.abs(x), CAPACITANCE_FLOOR);
                caps.add(new CardComparison.CapacitanceRow(biases.get(k).temperature(), Math.abs(biases.get(k).value()), x, y,
                        rel > limits.capacitanceRelative()));
            }
        }

        List<CardComparison.BreakdownRow> breakdown = new ArrayList<>();
        if (pa.isGiven(Param.BV) || pb.isGiven(Param.BV)) {
            double iref = breakdownCurrent(plan, pa, pb);
            double[] va = pa.isGiven(Param.BV) ? breakdownVoltages(dc, ca, pa, iref, plan, "A", notes) : null;
            double[] vb = pb.isGiven(Param.BV) ? breakdownVoltages(dcB, cb, pb, iref, plan, "B", notes) : null;
            for (int k = 0; k < plan.temperatures().size(); k++) {
                double x = va == null ? Double.NaN : va[k];
                double y = vb == null ? Double.NaN : vb[k];
                boolean flagged = va == null || vb == null || !(Math.abs(y - x) / x <= limits.breakdownRelative());
                breakdown.add(new CardComparison.BreakdownRow(plan.temperatures().get(k), iref, x, y, flagged));
            }
        } else {
            notes.add("breakdown: neither card gives BV");
        }
        String engines = dc.describe().equals(dcB.describe()) ? dc.describe()
                : "A: " + dc.describe() + "; B: " + dcB.describe();
        return new CardComparison(a.name() + " (" + sourceA + ")", b.name() + " (" + sourceB + ")", engines,
                params, forward, leakage, caps, breakdown, notes);
    }

    /**
     * The breakdown reference current: the plan's, else IBV of card A when A has BV, else IBV of card B [A].
     */
    static double breakdownCurrent(ComparisonPlan plan, DiodeParameters pa, DiodeParameters pb) {
        if (!Double.isNaN(plan.breakdownCurrent())) {
            return plan.breakdownCurrent();
        }
        return pa.isGiven(Param.BV) ? pa.get(Param.IBV) : pb.isGiven(Param.BV) ? pb.get(Param.IBV) : DEFAULT_BREAKDOWN_CURRENT;
    }

    /**
     * A card's breakdown voltage at each temperature of the plan: the reverse voltage at which its reverse current
     * exceeds its own leakage below the knee by the reference current {@code iref} [V, positive].
     *
     * <p>The model's reverse current is solved for the stated current by the engine itself (a forced current), but the
     * current forced is iref plus the card's leakage I_L, simulated at {@link #LEAKAGE_FRACTION_OF_BV} of BV(T). With
     * the ngspice 39 equations this is |V| = BV_eff(T) + NBV Vt ln(1 + iref/IS(T)) (plus the series drop), the knee
     * whatever IS(T) is against iref. Forcing iref alone finds no breakdown at all when the leakage IS(T) is larger
     * than iref (a hot, leaky junction): the solution then lies a few millivolts from zero, which is where the
     * reverse current first reaches iref, not a breakdown. A note names every temperature where I_L is more than
     * {@link #LEAKAGE_NOTE_FRACTION} of iref, so the reader knows the two definitions part there.
     */
    private static double[] breakdownVoltages(SimulationEngine engine, CardUnderTest card, DiodeParameters p, double iref,
                                              ComparisonPlan plan, String which, List<String> notes)
            throws SimulationException {
        List<Double> temperatures = plan.temperatures();
        List<Bias> below = new ArrayList<>();
        for (double t : temperatures) {
            double bvT = TemperatureLaws.at(p, t, SimulatorOptions.NGSPICE_DEFAULTS).breakdownVoltage();
            double v = Double.isFinite(bvT) && bvT > 0 ? bvT : p.get(Param.BV);
            below.add(Bias.voltage(-LEAKAGE_FRACTION_OF_BV * v, t));
        }
        List<OperatingPoint> leak = engine.dc(card, below);
        double[] leakage = new double[temperatures.size()];
        List<Bias> knee = new ArrayList<>();
        for (int k = 0; k < temperatures.size(); k++) {
            double il = -leak.get(k).current();
            leakage[k] = Double.isFinite(il) && il > 0 ? il : 0;
            knee.add(Bias.current(-(iref + leakage[k]), temperatures.get(k)));
            if (leakage[k] > UNDEFINED_KNEE_RATIO * iref) {
                notes.add(String.format(Locale.ROOT, "breakdown: at %.1f degC card %s leaks %.3g times the reference current "
                                + "%s A below the knee; at that current no breakdown voltage is defined (give a larger "
                                + "--breakdown-at)", temperatures.get(k) - org.cardwright.model.Ngspice39.CELSIUS_TO_KELVIN,
                        which, leakage[k] / iref, SpiceNumbers.format(iref, 4)));
            } else if (leakage[k] > LEAKAGE_NOTE_FRACTION * iref) {
                notes.add(String.format(Locale.ROOT, "breakdown: at %.1f degC card %s's reverse current below the knee (%s A "
                                + "at %s V) is %.3g times the reference current %s A; its breakdown voltage is taken where the "
                                + "reverse current exceeds that leakage by the reference current",
                        temperatures.get(k) - org.cardwright.model.Ngspice39.CELSIUS_TO_KELVIN, which,
                        SpiceNumbers.format(leakage[k], 4), SpiceNumbers.format(-below.get(k).value(), 4), leakage[k] / iref,
                        SpiceNumbers.format(iref, 4)));
            }
        }
        List<OperatingPoint> at = engine.dc(card, knee);
        double[] out = new double[temperatures.size()];
        for (int k = 0; k < out.length; k++) {
            out[k] = -at.get(k).voltage();
        }
        return out;
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
