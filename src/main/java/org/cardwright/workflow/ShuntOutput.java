package org.cardwright.workflow;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.cardwright.card.Dialect;
import org.cardwright.card.ShuntedCard;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.fit.ExtractionData;
import org.cardwright.fit.FitPoint;
import org.cardwright.fit.FitResult;
import org.cardwright.fit.ReverseAnalysis;
import org.cardwright.fit.ReversePoint;
import org.cardwright.fit.ShuntResistance;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.ShuntedJunction;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * What {@code fit} writes when the data show a resistor between the diode's terminals: the subcircuit file beside
 * the plain card ({@link ShuntedCard}), and the plain card's header line that says the card is the junction alone
 * and what leaving the resistor out costs on the forward and the reverse data.
 */
final class ShuntOutput {
    private ShuntOutput() {
    }

    /** Where the subcircuit file of dialect {@code d} goes: beside the plain card. */
    static Path path(FitRequest request, Dialect d) {
        return request.outDir().resolve(ShuntedCard.fileName(request.name(), d));
    }

    /**
     * The plain card's line: "junction alone: the data show NNN ohm between the terminals, carried by FILE;
     * leaving it out costs forward worst RMS a mV (b mV with it), reverse leakage RMS c decades (d with it)".
     */
    static String costLine(FitRequest request, Dialect d, FitResult fit, ExtractionData data) {
        ShuntResistance r = fit.shunt().orElseThrow();
        SimulatorOptions o = d.flavour().options();
        StringBuilder sb = new StringBuilder(String.format(Locale.ROOT,
                "junction alone: the data show %s ohm between the terminals, carried by %s; leaving it out costs forward worst RMS %.3f mV (%.3f mV with it)",
                SpiceNumbers.format(r.resistance(), 6), ShuntedCard.fileName(request.name(), d),
                worstForwardRms(fit.parameters(), 0, data.forward(), o) * 1e3,
                worstForwardRms(fit.parameters(), r.conductance(), data.forward(), o) * 1e3));
        List<ReversePoint> leakage = ReverseAnalysis.split(data.reverse()).leakage();
        if (!leakage.isEmpty()) {
            sb.append(String.format(Locale.ROOT, ", reverse leakage RMS %.3f decades of current (%.3f with it)",
                    leakageRms(fit.parameters(), 0, leakage, o), leakageRms(fit.parameters(), r.conductance(), leakage, o)));
        }
        return sb.toString();
    }

    /**
     * The subcircuit file's text: its own title and use lines, the resistor, then the plain card's provenance
     * (without its title and verify lines), and a verify line naming this file.
     */
    static String render(FitRequest request, Dialect d, FitResult fit, String plainCard, List<String> plainProvenance) {
        ShuntResistance r = fit.shunt().orElseThrow();
        String sub = ShuntedCard.subcircuitName(request.name());
        String file = ShuntedCard.fileName(request.name(), d);
        List<String> header = new ArrayList<>();
        header.add("model " + request.name() + " with a resistor between its terminals: subcircuit " + sub + " for "
                + d.simulator() + ", written by cardwright " + ToolVersion.get());
        header.add("ports: " + ShuntedCard.ANODE + " anode, " + ShuntedCard.CATHODE + " cathode; use it as X1 anode cathode " + sub);
        header.add("resistor: " + SpiceNumbers.format(r.resistance(), 6) + " ohm"
                + (Double.isFinite(r.standardError()) ? " +/- " + SpiceNumbers.format(r.standardError(), 2) + " ohm" : "")
                + ", fitted together with the junction");
        for (String line : plainProvenance.subList(1, plainProvenance.size())) {
            if (line.startsWith("verify, from this card's folder: ")) {
                int at = line.indexOf(' ', "verify, from this card's folder: cardwright verify ".length());
                header.add("verify, from this file's folder: cardwright verify " + file + (at < 0 ? "" : line.substring(at)));
            } else if (!line.startsWith("junction alone: ")) {
                header.add(line);
            }
        }
        return ShuntedCard.render(request.name(), plainCard, r.resistance(), header, request.digits());
    }

    private static double worstForwardRms(DiodeParameters p, double g, List<FitPoint> points, SimulatorOptions o) {
        Map<Double, double[]> sums = new HashMap<>();
        Map<Double, DiodeAtTemperature> at = new HashMap<>();
        for (FitPoint pt : points) {
            DiodeAtTemperature d = at.computeIfAbsent(pt.temperature(), t -> TemperatureLaws.at(p, t, o));
            double r = ShuntedJunction.voltageAtCurrent(d, pt.current(), g) - pt.voltage();
            double[] s = sums.computeIfAbsent(pt.temperature(), t -> new double[2]);
            s[0] += r * r;
            s[1]++;
        }
        double worst = 0;
        for (double[] s : sums.values()) {
            worst = Math.max(worst, Math.sqrt(s[0] / s[1]));
        }
        return worst;
    }

    /** RMS of log10(model current / measured current) at the measured voltages [decades]. */
    private static double leakageRms(DiodeParameters p, double g, List<ReversePoint> points, SimulatorOptions o) {
        double sum = 0;
        Map<Double, DiodeAtTemperature> at = new HashMap<>();
        for (ReversePoint pt : points) {
            DiodeAtTemperature d = at.computeIfAbsent(pt.temperature(), t -> TemperatureLaws.at(p, t, o));
            double model = ShuntedJunction.currentAtVoltage(d, pt.voltage(), g);
            double e = model < 0 ? Math.log10(model / pt.current()) : Double.POSITIVE_INFINITY;
            sum += e * e;
        }
        return Math.sqrt(sum / points.size());
    }
}
