package org.cardwright.lot;

import org.cardwright.data.Sha256;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Function;
import org.cardwright.card.CardWriter;
import org.cardwright.card.Dialect;
import org.cardwright.card.ModelCard;
import org.cardwright.fit.FitResult;
import org.cardwright.fit.ParameterRule;
import org.cardwright.fit.TermDecision;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.workflow.Inputs;
import org.cardwright.workflow.OutputException;
import org.cardwright.workflow.OutputFiles;
import org.cardwright.workflow.ToolVersion;

/**
 * The lot job: find the parts, choose the lot's terms and datasheet conditions on a sample of parts, fit every part
 * on a bounded pool of threads (each result stored at once in the state folder, so a killed run resumes where it
 * stopped), then statistics, cards, tables and the JSON, all written at the end. The output depends only on the
 * input, never on the number of threads or on where a run was interrupted.
 */
public final class LotJob {
    /** Parts in the sample whose free fits choose the lot's optional terms (evenly spread over the sorted names) [1]. */
    static final int SAMPLE_PARTS = 9;
    /**
     * IF is placed three quarters of the way up the current range all sample parts cover, on a log scale: where a
     * datasheet states VF, above the recombination region and where RS already shows (common practice, no source).
     */
    static final double IF_POSITION = 0.75;
    private static final String PLAN_FILE = "plan.txt";

    /**
     * A lot ready to fit: its parts, its plan, and the results an earlier run left that are still valid.
     *
     * @param request  the request
     * @param parts    the parts, sorted by name
     * @param plan     the lot's term choice and datasheet conditions
     * @param results  stored results by part index (null where the part still has to be fitted)
     * @param todo     indices of the parts to fit
     * @param startNanos when preparation began ({@link System#nanoTime})
     */
    public record Prepared(LotRequest request, List<LotParts.Part> parts, LotPlan plan, PartResult[] results,
                           List<Integer> todo, long startNanos) {
        /** Parts whose stored result was taken. */
        public int reused() {
            return parts.size() - todo.size();
        }
    }

    /** Runs the lot; {@code json} renders the JSON from the outcome. */
    public LotOutcome run(LotRequest request, Function<LotOutcome, String> json, LotProgress progress)
            throws IOException, OutputException {
        return run(request, json, null, progress);
    }

    /** Runs the lot; {@code json} renders the JSON, {@code html} (if not null) the page NAME.lot.html. */
    public LotOutcome run(LotRequest request, Function<LotOutcome, String> json, Function<LotOutcome, String> html,
                          LotProgress progress) throws IOException, OutputException {
        ExecutorService pool = Executors.newFixedThreadPool(request.jobs(), r -> {
            Thread t = new Thread(r, "cardwright-lot");
            t.setDaemon(true);
            return t;
        });
        try {
            Prepared prepared = prepare(request, pool, progress);
            PartResult[] results = prepared.results();
            LotFitter fitter = new LotFitter(request.settings());
            Path state = request.stateDir();
            AtomicInteger done = new AtomicInteger(prepared.reused());
            AtomicInteger failed = new AtomicInteger((int) Arrays.stream(results).filter(r -> r != null && !r.ok()).count());
            progress.update("fit", done.get(), prepared.parts().size(), failed.get());
            List<Future<PartResult>> futures = new ArrayList<>();
            for (int i : prepared.todo()) {
                LotParts.Part part = prepared.parts().get(i);
                futures.add(pool.submit(() -> {
                    PartResult r = fitAndStore(fitter, part, prepared.plan(), state);
                    progress.update("fit", done.incrementAndGet(), prepared.parts().size(), r.ok() ? failed.get() : failed.incrementAndGet());
                    return r;
                }));
            }
            for (int k = 0; k < prepared.todo().size(); k++) {
                results[prepared.todo().get(k)] = get(futures.get(k));
            }
            return finish(prepared, json, html);
        } finally {
            pool.shutdownNow();
        }
    }

    /**
     * Everything before the per-part fits: the output check, the parts, the plan (from the state folder, or chosen
     * on a sample fitted on {@code pool}) and the stored results that still match.
     */
    public Prepared prepare(LotRequest request, ExecutorService pool, LotProgress progress) throws IOException, OutputException {
        long start = System.nanoTime();
        Path state = request.stateDir();
        if (!request.force() && Files.exists(request.json())) {
            throw new OutputException(request.json() + " already exists: this lot was finished; pass --force to run it again, or write somewhere else");
        }
        Files.createDirectories(state.resolve("parts"));
        List<LotParts.Part> parts = LotParts.find(request.inputs(), state.resolve("tables"));
        LotFitter fitter = new LotFitter(request.settings());
        LotPlan plan = plan(request, parts, fitter, pool, progress);
        PartResult[] results = new PartResult[parts.size()];
        List<Integer> todo = new ArrayList<>();
        for (int i = 0; i < parts.size(); i++) {
            PartResult stored = stored(state, parts.get(i));
            if (stored != null && stored.fingerprint().equals(fitter.fingerprint(parts.get(i), plan))) {
                results[i] = stored;
            } else {
                todo.add(i);
            }
        }
        return new Prepared(request, parts, plan, results, todo, start);
    }

    /** Fits one part and stores its result in the state folder at once (the per-part work of every path). */
    public static PartResult fitAndStore(LotFitter fitter, LotParts.Part part, LotPlan plan, Path state) throws OutputException {
        PartResult r = fitter.fit(part, plan);
        OutputFiles.writeAtomically(statePath(state, part.name()), r.toText());
        return r;
    }

    /** Statistics, cards, tables and JSON of a prepared lot whose results are all in. */
    public LotOutcome finish(Prepared prepared, Function<LotOutcome, String> json) throws OutputException {
        return finish(prepared, json, null);
    }

    /** As {@link #finish(Prepared, Function)}, and the page NAME.lot.html when {@code html} is not null. */
    public LotOutcome finish(Prepared prepared, Function<LotOutcome, String> json, Function<LotOutcome, String> html)
            throws OutputException {
        for (int i = 0; i < prepared.results().length; i++) {
            if (prepared.results()[i] == null) {
                throw new IllegalStateException("part " + prepared.parts().get(i).name() + " has no result");
            }
        }
        double seconds = (System.nanoTime() - prepared.startNanos()) * 1e-9;
        return finish(prepared.request(), prepared.parts(), List.of(prepared.results()), prepared.plan(), prepared.reused(), seconds, json, html);
    }

    private static PartResult get(Future<PartResult> f) throws IOException, OutputException {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException("interrupted", e);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof OutputException o) {
                throw o;
            }
            if (e.getCause() instanceof RuntimeException r) {
                throw r;
            }
            throw new IllegalStateException(e.getCause());
        }
    }

    static Path statePath(Path state, String part) {
        return state.resolve("parts").resolve(LotParts.safeFileName(part) + ".txt");
    }

    private static PartResult stored(Path state, LotParts.Part part) {
        Path p = statePath(state, part.name());
        if (!Files.isRegularFile(p)) {
            return null;
        }
        try {
            PartResult r = PartResult.fromText(Files.readString(p, StandardCharsets.UTF_8));
            return r != null && r.part().equals(part.name()) ? r : null;
        } catch (IOException e) {
            return null;
        }
    }

    /** The lot's plan: the stored one when the settings are the same, else chosen from a sample of free fits. */
    LotPlan plan(LotRequest request, List<LotParts.Part> parts, LotFitter fitter, ExecutorService pool, LotProgress progress)
            throws IOException, OutputException {
        String key = Sha256.hex(request.settings().text() + request.conditions() + request.datasheetTemperature());
        Path file = request.stateDir().resolve(PLAN_FILE);
        if (Files.isRegularFile(file)) {
            String text = Files.readString(file, StandardCharsets.UTF_8);
            if (text.startsWith("key\t" + key + "\n")) {
                LotPlan stored = LotPlan.fromText(text.substring(text.indexOf('\n') + 1));
                if (stored != null) {
                    return stored;
                }
            }
        }
        int m = Math.min(SAMPLE_PARTS, parts.size());
        List<LotParts.Part> sample = new ArrayList<>();
        for (int i = 0; i < m; i++) {
            int index = m == 1 ? 0 : (int) Math.round(i * (parts.size() - 1) / (double) (m - 1));
            sample.add(parts.get(index));
        }
        AtomicInteger done = new AtomicInteger();
        List<Future<LotFitter.Pilot>> futures = new ArrayList<>();
        for (LotParts.Part part : sample) {
            futures.add(pool.submit(() -> {
                try {
                    return fitter.read(part, List.of());
                } catch (LotFitter.Failure f) {
                    return null;
                } finally {
                    progress.update("sample", done.incrementAndGet(), sample.size(), 0);
                }
            }));
        }
        List<LotFitter.Pilot> pilots = new ArrayList<>();
        List<String> names = new ArrayList<>();
        for (int i = 0; i < futures.size(); i++) {
            LotFitter.Pilot p;
            try {
                p = futures.get(i).get();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IOException("interrupted", e);
            } catch (ExecutionException e) {
                throw new IllegalStateException(e.getCause());
            }
            if (p != null) {
                pilots.add(p);
                names.add(sample.get(i).name());
            }
        }
        LotPlan plan = choose(request, pilots, names);
        OutputFiles.writeAtomically(file, "key\t" + key + "\n" + plan.toText());
        return plan;
    }

    /** Terms by majority of the sample's free fits; datasheet conditions from the ranges all sample parts cover. */
    static LotPlan choose(LotRequest request, List<LotFitter.Pilot> pilots, List<String> names) {
        Map<String, TermDecision> terms = new LinkedHashMap<>();
        Map<String, Integer> taken = new TreeMap<>();
        for (LotFitter.Pilot p : pilots) {
            for (TermDecision d : p.fit().terms()) {
                if (d.term().equals("breakdown") || d.params().isEmpty()) {
                    continue;
                }
                terms.putIfAbsent(d.term(), d);
                taken.merge(d.term(), d.included() ? 1 : 0, Integer::sum);
            }
        }
        List<ParameterRule> rules = new ArrayList<>();
        List<String> reasons = new ArrayList<>();
        for (Map.Entry<String, TermDecision> e : terms.entrySet()) {
            Param key = e.getValue().params().get(0);
            boolean userRuled = request.settings().rules().stream().anyMatch(r -> e.getValue().params().contains(r.param()));
            if (userRuled) {
                continue;
            }
            int n = taken.getOrDefault(e.getKey(), 0);
            boolean on = 2 * n > pilots.size();
            rules.add(on ? ParameterRule.free(key)
                    : new ParameterRule(key, ParameterRule.Kind.OFF, Double.NaN, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY));
            reasons.add(String.format(Locale.ROOT, "%s (%s): %s for every part; the free fits of %d of %d sample parts took it",
                    e.getKey(), key.name(), on ? "on" : "off", n, pilots.size()));
        }
        double t = request.datasheetTemperature().orElse(Double.NaN);
        if (Double.isNaN(t)) {
            double best = Double.NaN;
            for (LotFitter.Pilot p : pilots) {
                for (Inputs.Located l : p.inputs().forward()) {
                    double tt = Math.round(l.point().temperature() * 100) / 100.0;
                    if (Double.isNaN(best) || Math.abs(tt - ROOM) < Math.abs(best - ROOM)) {
                        best = tt;
                    }
                }
                for (Inputs.LocatedCapacitance l : p.inputs().capacitance()) {
                    double tt = Math.round(l.point().temperature() * 100) / 100.0;
                    if (Double.isNaN(best) || Math.abs(tt - ROOM) < Math.abs(best - ROOM)) {
                        best = tt;
                    }
                }
            }
            t = Double.isNaN(best) ? ROOM : best;
        }
        Map<Datasheet.Quantity, Double> conditions = new EnumMap<>(Datasheet.Quantity.class);
        double temperature = t;
        // IF: the current range every sample part covers at the temperature
        double lo = 0;
        double hi = Double.POSITIVE_INFINITY;
        double vmax = Double.POSITIVE_INFINITY;
        double cmax = Double.POSITIVE_INFINITY;
        boolean anyForward = false;
        boolean anyReverse = false;
        boolean anyCv = false;
        List<Double> ibv = new ArrayList<>();
        for (LotFitter.Pilot p : pilots) {
            double[] f = p.inputs().forward().stream().filter(l -> near(l.point().temperature(), temperature))
                    .mapToDouble(l -> l.point().current()).toArray();
            if (f.length >= 2) {
                anyForward = true;
                lo = Math.max(lo, Arrays.stream(f).min().orElseThrow());
                hi = Math.min(hi, Arrays.stream(f).max().orElseThrow());
            }
            double[] r = p.inputs().reverse().stream().filter(l -> near(l.point().temperature(), temperature))
                    .mapToDouble(l -> Math.abs(l.point().voltage())).toArray();
            if (r.length >= 2) {
                anyReverse = true;
                vmax = Math.min(vmax, Arrays.stream(r).max().orElseThrow());
            }
            double[] c = p.inputs().capacitance().stream().filter(l -> near(l.point().temperature(), temperature)
                    && l.point().voltage() < 0).mapToDouble(l -> -l.point().voltage()).toArray();
            if (c.length >= 2) {
                anyCv = true;
                cmax = Math.min(cmax, Arrays.stream(c).max().orElseThrow());
            }
            if (p.fit().parameters().isGiven(Param.BV)) {
                ibv.add(p.fit().parameters().get(Param.IBV));
            }
        }
        if (anyForward && lo < hi) {
            double x = Math.exp(Math.log(lo) + IF_POSITION * (Math.log(hi) - Math.log(lo)));
            double nice = Datasheet.nice(x);
            conditions.put(Datasheet.Quantity.VF, nice >= lo && nice <= hi ? nice : x);
        }
        if (anyReverse && vmax > 0 && Double.isFinite(vmax)) {
            conditions.put(Datasheet.Quantity.IR, Datasheet.niceBelow(0.5 * vmax));
        }
        if (anyCv && cmax > 0 && Double.isFinite(cmax)) {
            conditions.put(Datasheet.Quantity.C, Datasheet.niceBelow(0.5 * cmax));
        }
        if (2 * ibv.size() > pilots.size()) {
            conditions.put(Datasheet.Quantity.VZ, Datasheet.nice(LotStatistics.median(ibv.stream().mapToDouble(Double::doubleValue).toArray())));
        }
        conditions.putAll(request.conditions());
        if (conditions.containsKey(Datasheet.Quantity.VZ)) {
            // the TC of VZ is stated at the same IZ (measured where the breakdown data span temperatures)
            conditions.put(Datasheet.Quantity.TCVZ, conditions.get(Datasheet.Quantity.VZ));
        }
        return new LotPlan(rules, reasons, conditions, temperature, names);
    }

    /** A part card's model name: NAME_PART, with the part's name made safe ({@link LotParts#safeFileName}). */
    static String partModelName(String lot, String part) {
        return lot + "_" + LotParts.safeFileName(part);
    }

    /** 25 degC, where a datasheet states its values [K]. */
    static final double ROOM = 298.15;

    private static boolean near(double a, double b) {
        return Math.abs(a - b) <= Datasheet.SAME_TEMPERATURE;
    }

    /** Statistics, cards, tables and JSON, written together. */
    private LotOutcome finish(LotRequest request, List<LotParts.Part> parts, List<PartResult> results, LotPlan plan, int reused, double seconds,
                              Function<LotOutcome, String> json, Function<LotOutcome, String> html) throws OutputException {
        List<PartResult> ok = results.stream().filter(PartResult::ok).toList();
        LotStatistics stats = LotStatistics.of(ok);
        Double iff = plan.conditions().get(Datasheet.Quantity.VF);
        java.util.function.ToDoubleFunction<DiodeParameters> vf = iff == null ? null
                : p -> Datasheet.ofCard(p, Map.of(Datasheet.Quantity.VF, iff), plan.temperature()).getOrDefault(Datasheet.Quantity.VF, Double.NaN);
        List<LotCards.Corner> corners = stats.inliers().size() >= LotStatistics.MIN_PARTS
                ? LotCards.corners(request.name(), stats, request.cornerSigma(), vf) : List.of();
        List<LotOutcome.DatasheetRow> rows = new ArrayList<>();
        for (Map.Entry<Datasheet.Quantity, Double> e : plan.conditions().entrySet()) {
            Datasheet.Quantity q = e.getKey();
            double[] measured = stats.inliers().stream().filter(r -> r.measured().containsKey(q)).mapToDouble(r -> r.measured().get(q)).toArray();
            double[] card = stats.inliers().stream().filter(r -> r.card().containsKey(q)).mapToDouble(r -> r.card().get(q)).toArray();
            Map<String, Double> byCorner = new LinkedHashMap<>();
            for (LotCards.Corner c : corners) {
                Double v = Datasheet.ofCard(c.parameters(), Map.of(q, e.getValue()), plan.temperature()).get(q);
                if (v != null) {
                    byCorner.put(c.suffix(), v);
                }
            }
            rows.add(new LotOutcome.DatasheetRow(q, e.getValue(), measured, card, byCorner));
        }

        Map<Path, String> files = new LinkedHashMap<>();
        List<Path> cards = new ArrayList<>();
        CardWriter writer = new CardWriter(request.templates());
        for (Dialect d : request.dialects()) {
            for (LotCards.Corner c : corners) {
                List<String> lines = new ArrayList<>();
                lines.add("model " + c.modelName() + ": lot card (" + c.suffix() + ") for " + d.simulator()
                        + ", written by cardwright " + ToolVersion.get() + " (lot)");
                lines.add(String.format(Locale.ROOT, "lot %s: %d parts, %d fitted, %d outliers left out, %d parts in the statistics",
                        request.name(), results.size(), ok.size(), stats.outliers().size(), stats.inliers().size()));
                lines.addAll(c.lines());
                lines.addAll(plan.rules().isEmpty() ? List.of() : List.of("terms for every part: "
                        + String.join(" ", plan.rules().stream().map(ParameterRule::text).toList())));
                if (d.flavour() != org.cardwright.model.Flavour.NGSPICE_39) {
                    lines.add("parameters fitted with the ngspice 39 equations; not refitted for " + d.simulator());
                }
                CardWriter.Rendered r = writer.render(new ModelCard(c.modelName(), c.parameters(), lines), d, request.digits());
                String text = r.text();
                if (!r.dropped().isEmpty()) {
                    text = "* " + d.shortName() + " cannot carry " + String.join(" ", r.dropped().stream().map(Param::name).toList())
                            + ": left out of this card\n" + text;
                }
                Path p = request.card(c.suffix(), d.shortName());
                files.put(p, text);
                cards.add(p);
            }
        }
        if (stats.common().size() > 0 && !corners.isEmpty()) {
            List<String> lines = new ArrayList<>();
            lines.add("model " + request.name() + ": lot Monte Carlo card for ngspice 39, written by cardwright " + ToolVersion.get() + " (lot)");
            lines.add(String.format(Locale.ROOT, "lot %s: %d parts in the statistics; %s drawn jointly through %d principal components",
                    request.name(), stats.inliers().size(), String.join(" ", stats.common().stream().map(Param::name).toList()),
                    stats.loadings()[0].length));
            lines.add("a part is drawn by alterparam of each z below and reset; set rndseed for a repeatable sequence");
            Path p = request.card("montecarlo", "ngspice");
            files.put(p, LotCards.monteCarloCard(request.name(), stats, lines, request.digits()));
            cards.add(p);
        }
        if (request.writesPartCards(results.size())) {
            for (Dialect d : request.dialects()) {
                for (PartResult r : ok) {
                    String outlier = stats.outliers().get(r.part());
                    List<String> lines = new ArrayList<>();
                    lines.add("model " + partModelName(request.name(), r.part()) + ": part " + r.part() + " of lot " + request.name()
                            + ", its own fit, for " + d.simulator() + ", written by cardwright " + ToolVersion.get() + " (lot)");
                    lines.add(outlier == null ? "in the lot's statistics" : "an outlier of the lot: " + outlier);
                    lines.add("fitted: " + String.join(" ", r.fitted().stream().map(Param::name).toList())
                            + (Double.isNaN(r.worstRms()) ? "" : String.format(Locale.ROOT, "; worst forward RMS residual %.4g mV", r.worstRms() * 1e3)));
                    lines.addAll(plan.rules().isEmpty() ? List.of() : List.of("terms for every part: "
                            + String.join(" ", plan.rules().stream().map(ParameterRule::text).toList())));
                    if (d.flavour() != org.cardwright.model.Flavour.NGSPICE_39) {
                        lines.add("parameters fitted with the ngspice 39 equations; not refitted for " + d.simulator());
                    }
                    CardWriter.Rendered rendered = writer.render(new ModelCard(partModelName(request.name(), r.part()),
                            DiodeParameters.of(r.values()), lines), d, request.digits());
                    String text = rendered.text();
                    if (!rendered.dropped().isEmpty()) {
                        text = "* " + d.shortName() + " cannot carry " + String.join(" ", rendered.dropped().stream().map(Param::name).toList())
                                + ": left out of this card\n" + text;
                    }
                    files.put(request.partCard(r.part(), d.shortName()), text);
                }
            }
        }
        LotCurves.Curves curves = html == null ? LotCurves.Curves.none() : LotCurves.of(parts, stats, corners, plan, request.settings());
        LotOutcome outcome = new LotOutcome(request, results, plan, stats, corners, rows, cards, reused, seconds, curves);
        files.put(request.partsCsv(), LotTables.parts(outcome));
        files.put(request.statisticsCsv(), LotTables.statistics(outcome));
        if (html != null) {
            files.put(request.html(), html.apply(outcome));
        }
        files.put(request.json(), json.apply(outcome));
        OutputFiles.writeAllAtomically(files);
        return outcome;
    }
}
