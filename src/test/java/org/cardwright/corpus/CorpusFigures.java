package org.cardwright.corpus;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Properties;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.cardwright.card.CardReader;
import org.cardwright.card.Dialect;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.data.ReadOptions;
import org.cardwright.fit.CapacitanceOptions;
import org.cardwright.fit.DeviceKind;
import org.cardwright.fit.FittedParameter;
import org.cardwright.fit.ShuntResistance;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.JunctionCapacitance;
import org.cardwright.model.Param;
import org.cardwright.model.ShuntedJunction;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.cardwright.verify.JunctionVerification;
import org.cardwright.verify.Tolerance;
import org.cardwright.verify.VerdictBasis;
import org.cardwright.workflow.FitOutcome;
import org.cardwright.workflow.FitRequest;
import org.cardwright.workflow.FitWorkflow;
import org.cardwright.workflow.Inputs;
import org.cardwright.workflow.VerifyRequest;
import org.cardwright.workflow.VerifyWorkflow;

/**
 * The figures of one invented corpus part (fixtures/corpus, made by verify/tools/MakeCorpus.java in ngspice 39):
 * fit its data as a user would, then compare the fitted card with the generating card, both evaluated with the
 * built-in engine (which computes ngspice 39's equations; the generating data came from ngspice itself), at the
 * measured points and each row's own temperature.
 */
final class CorpusFigures {
    /** C-V test frequency of the corpus [Hz] (MakeCorpus.CV_FREQUENCY). */
    static final double CV_FREQUENCY = 1e6;
    /** Relative match of a noisy breakdown current to a forced one: the read-back noise is 0.02 % [1]. */
    private static final double FORCED_MATCH = 2e-3;

    /** One corpus part's truth. */
    record Part(String name, Path dir, String kind, DiodeParameters generating, double shunt, double stray,
                boolean showsTt, boolean breakdown) {
    }

    /**
     * The figures of one part and variant. NaN where the data do not show the quantity.
     *
     * @param refused       the fit's one-line refusal, or null
     * @param forwardMv     worst |V_fit - V_true| over the measured forward points, each side with its own shunt
     *                      resistor where it has one (what was written against what generated the data) [mV]
     * @param breakdownPct  worst |V_fit - V_true| / |V_true| over the measured breakdown points [%]
     * @param capacitancePct worst |C_fit - C_true| / C_true over the measured biases [%]
     * @param ttPct         |TT_fit - TT| / TT [%] where the C-V data show TT
     * @param shuntPct      |R_fit - R| / R [%] of the parallel resistor written beside the card, where there is one
     * @param card          the fitted ngspice file a user simulates (the subcircuit of card and resistor when the fit
     *                      carries a shunt, else the card), or null when refused
     * @param outcome       the fit, or null when refused
     */
    record Figures(String refused, double forwardMv, double breakdownPct, double capacitancePct, double ttPct,
                   double shuntPct, Path card, FitOutcome outcome) {
    }

    private CorpusFigures() {
    }

    static Path corpus(Path project) {
        return project.resolve("fixtures/corpus");
    }

    static List<Part> parts(Path project) throws IOException {
        List<Part> out = new ArrayList<>();
        try (Stream<Path> dirs = Files.list(corpus(project))) {
            for (Path d : dirs.filter(Files::isDirectory).sorted().toList()) {
                Properties p = new Properties();
                try (Reader r = Files.newBufferedReader(d.resolve("part.properties"), StandardCharsets.UTF_8)) {
                    p.load(r);
                }
                DiodeParameters card = new CardReader().parse(Files.readString(d.resolve("generating-card.lib")),
                        d.getFileName() + "/generating-card.lib", Dialect.NGSPICE).parameters();
                out.add(new Part(d.getFileName().toString(), d, p.getProperty("kind"), card,
                        Double.parseDouble(p.getProperty("shunt.ohm")), Double.parseDouble(p.getProperty("stray.farad")),
                        Boolean.parseBoolean(p.getProperty("cv.shows.tt")), Boolean.parseBoolean(p.getProperty("breakdown"))));
            }
        }
        return out;
    }

    /** The data files of a part: the noisy ones, or their noise-free twins. */
    static List<Path> files(Part part, boolean noisy) throws IOException {
        Path dir = noisy ? part.dir() : part.dir().resolve("noisefree");
        List<Path> out = new ArrayList<>();
        for (String f : List.of("forward.csv", "reverse.csv", "cv.csv")) {
            if (Files.isRegularFile(dir.resolve(f))) {
                out.add(dir.resolve(f));
            }
        }
        return out;
    }

    /** Fits a part's data (ngspice dialect) and computes its figures. */
    static Figures of(Part part, boolean noisy, Path out) throws Exception {
        List<Path> files = files(part, noisy);
        FitRequest request = new FitRequest(files, part.name().toUpperCase(Locale.ROOT), List.of(Dialect.NGSPICE), out,
                Optional.empty(), OptionalDouble.empty(), DeviceKind.byOptionName(part.kind()), List.of(), 10, true,
                Optional.empty(), new CapacitanceOptions(part.stray(), CV_FREQUENCY), FitRequest.BenchOptions.DEFAULT);
        FitOutcome outcome;
        try {
            outcome = new FitWorkflow().run(request, o -> "");
        } catch (Exception e) {
            String m = String.valueOf(e.getMessage());
            return new Figures(m.lines().findFirst().orElse(m), Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                    Double.NaN, null, null);
        }
        DiodeParameters fit = outcome.fit().parameters();
        DiodeParameters truth = part.generating();
        SimulatorOptions opt = SimulatorOptions.NGSPICE_DEFAULTS;
        Inputs exact = Inputs.read(files(part, false), ReadOptions.defaults());

        double fittedShunt = outcome.fit().shunt().map(ShuntResistance::conductance).orElse(0.0);
        double fwd = Double.NaN;
        for (Inputs.Located l : exact.forward()) {
            double t = l.point().temperature();
            double i = l.point().current();
            double vTrue = truthVoltage(TemperatureLaws.at(truth, t, opt), i, part.shunt());
            // what was written: the card, with the resistor of the subcircuit beside it when the fit carries one
            double vFit = ShuntedJunction.voltageAtCurrent(TemperatureLaws.at(fit, t, opt), i, fittedShunt);
            fwd = max(fwd, Math.abs(vFit - vTrue) * 1e3);
        }
        double bd = Double.NaN;
        if (part.breakdown()) {
            List<Double> forced = forcedBreakdownCurrents(part);
            for (Inputs.Located l : exact.reverse()) {
                double i = l.point().current();
                if (forced.stream().noneMatch(f -> Math.abs(-i - f) <= FORCED_MATCH * f)) {
                    continue;
                }
                double t = l.point().temperature();
                double vTrue = DiodeSolver.voltageAtCurrent(TemperatureLaws.at(truth, t, opt), i);
                double vFit = DiodeSolver.voltageAtCurrent(TemperatureLaws.at(fit, t, opt), i);
                bd = max(bd, 100 * Math.abs(vFit - vTrue) / Math.abs(vTrue));
            }
        }
        double cap = Double.NaN;
        for (Inputs.LocatedCapacitance l : exact.capacitance()) {
            double t = l.point().temperature();
            double v = l.point().voltage();
            double cTrue = JunctionCapacitance.terminalParallel(TemperatureLaws.at(truth, t, opt), v, CV_FREQUENCY);
            double cFit = JunctionCapacitance.terminalParallel(TemperatureLaws.at(fit, t, opt), v, CV_FREQUENCY);
            cap = max(cap, 100 * Math.abs(cFit - cTrue) / cTrue);
        }
        double tt = part.showsTt() ? 100 * Math.abs(fit.get(Param.TT) - truth.get(Param.TT)) / truth.get(Param.TT)
                : Double.NaN;
        double shunt = Double.NaN;
        if (part.shunt() > 0) {
            double r = writtenShunt(out, request.cardPath(Dialect.NGSPICE));
            shunt = Double.isNaN(r) ? Double.POSITIVE_INFINITY : 100 * Math.abs(r - part.shunt()) / part.shunt();
        }
        // the file a user simulates: the subcircuit (card and resistor) when the fit carries a shunt
        Path simulated = outcome.cards().stream().filter(c -> c.dialect() == Dialect.NGSPICE).findFirst()
                .flatMap(FitOutcome.WrittenCard::shunted).map(FitOutcome.ShuntedFile::file)
                .orElse(request.cardPath(Dialect.NGSPICE));
        return new Figures(null, fwd, bd, cap, tt, shunt, simulated, outcome);
    }

    private static double max(double a, double b) {
        return Double.isNaN(a) ? b : Math.max(a, b);
    }

    /** Terminal voltage of the generating junction with its parallel resistor across the terminals [V]. */
    static double truthVoltage(DiodeAtTemperature d, double current, double shunt) {
        if (!(shunt > 0)) {
            return DiodeSolver.voltageAtCurrent(d, current);
        }
        double lo = 0;
        double hi = DiodeSolver.voltageAtCurrent(d, current);
        for (int k = 0; k < 200; k++) {
            double mid = 0.5 * (lo + hi);
            if (DiodeSolver.currentAtVoltage(d, mid) + mid / shunt > current) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    /** The reverse currents the breakdown deck forced (positive) [A]. */
    static List<Double> forcedBreakdownCurrents(Part part) throws IOException {
        List<Double> out = new ArrayList<>();
        Path deck = part.dir().resolve("generating-netlist-breakdown.cir");
        if (Files.isRegularFile(deck)) {
            for (String line : Files.readAllLines(deck)) {
                if (line.startsWith("alter IB dc = ")) {
                    out.add(Double.parseDouble(line.substring("alter IB dc = ".length()).trim()));
                }
            }
        }
        return out;
    }

    private static final Pattern RESISTOR = Pattern.compile("(?i)^\\s*R\\S*\\s+\\S+\\s+\\S+\\s+(\\S+)");

    /** The first resistor element written in any file beside the card (a subcircuit carrying the shunt) [ohm]. */
    static double writtenShunt(Path out, Path card) throws IOException {
        try (Stream<Path> files = Files.list(out)) {
            for (Path f : files.sorted().toList()) {
                if (f.equals(card) || !Files.isRegularFile(f)) {
                    continue;
                }
                for (String line : Files.readAllLines(f, StandardCharsets.UTF_8)) {
                    Matcher m = RESISTOR.matcher(line);
                    if (m.find()) {
                        try {
                            return SpiceNumbers.parse(m.group(1));
                        } catch (RuntimeException e) {
                            // not a value: keep looking
                        }
                    }
                }
            }
        }
        return Double.NaN;
    }

    /** Verifies a card against a part's noisy data with an engine and the noise verdict. */
    static JunctionVerification verify(Part part, Path card, String engine) throws Exception {
        VerifyRequest request = new VerifyRequest(card, files(part, true), engine, Optional.empty(), Dialect.NGSPICE,
                OptionalDouble.empty(), Tolerance.DEFAULT, Optional.empty(), true,
                new CapacitanceOptions(part.stray(), CV_FREQUENCY), FitRequest.BenchOptions.DEFAULT, VerdictBasis.NOISE);
        return new VerifyWorkflow().runAll(request, v -> "");
    }

    /**
     * The fitted card with one parameter moved by 3 of its standard errors, written beside it; the parameter is
     * IS (always fitted from forward data), or the first fitted parameter when IS is not.
     */
    static Path movedCard(Figures f, Path dir) throws IOException {
        FittedParameter chosen = f.outcome().fit().parameter(Param.IS).filter(FittedParameter::fitted)
                .orElseGet(() -> f.outcome().fit().fitted().stream().filter(FittedParameter::fitted).findFirst().orElseThrow());
        String text = Files.readString(f.card());
        double moved = chosen.value() + 3 * chosen.standardError();
        Matcher m = Pattern.compile("(?i)(\\s" + chosen.param().name() + "=)(\\S+?)(?=[\\s)])").matcher(text);
        if (!m.find()) {
            throw new IllegalStateException("no " + chosen.param() + " on " + f.card());
        }
        String changed = text.substring(0, m.start(2)) + String.format(Locale.ROOT, "%.10g", moved) + text.substring(m.end(2));
        Path out = dir.resolve("moved-" + chosen.param().name() + ".lib");
        Files.writeString(out, changed);
        return out;
    }
}
