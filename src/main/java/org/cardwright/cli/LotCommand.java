package org.cardwright.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import org.cardwright.card.Dialect;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.fit.DeviceKind;
import org.cardwright.fit.ParameterRule;
import org.cardwright.lot.Datasheet;
import org.cardwright.lot.LotJob;
import org.cardwright.lot.LotOutcome;
import org.cardwright.lot.LotProgress;
import org.cardwright.lot.LotRequest;
import org.cardwright.lot.LotSettings;
import org.cardwright.model.Ngspice39;
import org.cardwright.report.LotHtml;
import org.cardwright.report.LotJson;
import org.cardwright.report.LotText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code cardwright lot}: many parts of one type in, lot statistics and lot cards out. */
@Command(name = "lot", mixinStandardHelpOptions = true, sortOptions = false,
        header = "Fits every part of a lot and writes its statistics and cards.",
        description = {
            "Fits every part of a lot with the same terms, on all cores, and writes the lot's statistics (log10 for "
                    + "IS-like parameters, linear for N, RS, ...), its outliers, datasheet min/typ/max, a typical card, "
                    + "corner cards and an ngspice Monte Carlo card into OUT: NAME.lot.json, NAME.lot.html, "
                    + "NAME.parts.csv, NAME.statistics.csv, NAME.typical.DIALECT.lib, "
                    + "NAME.vf-low/vf-high/pcK-low/pcK-high.DIALECT.lib, NAME.montecarlo.ngspice.lib, "
                    + "and each part's own card in NAME.parts/ (lots of at most 1000 parts, or --part-cards on). "
                    + "A killed run started again continues where it stopped (state in OUT/NAME.lot-state)."},
        footerHeading = "%nExamples%n",
        footer = {
            "  cardwright lot parts/ --name LOT7 --out lot7",
            "  cardwright lot lot7-forward.csv --name LOT7 --out lot7 --jobs 2 --at-if 10m",
            "",
            "INPUT: a folder with one file or one sub-folder per part (the part is named by the file's stem or the "
                    + "folder), or a CSV table with a 'part' column (part, V, I, T or part, V, C). Exit 0 when every "
                    + "part was fitted, 1 when some were not (listed in 'failed'), other codes as for fit."})
final class LotCommand implements Callable<Integer> {

    @Parameters(arity = "1..*", paramLabel = "INPUT", description = "Folders of parts, or tables with a part column.")
    List<Path> inputs;

    @Option(names = "--name", required = true, paramLabel = "NAME", description = "Model name of the lot cards.")
    String name;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "The lot folder.")
    Path out;

    @Option(names = "--dialect", split = ",", paramLabel = "D",
            description = "Dialect(s) of the typical and corner cards (default: ngspice). The Monte Carlo card is ngspice only.")
    List<String> dialects;

    @Option(names = "--jobs", paramLabel = "N", description = "Parts fitted at once (default: the number of cores).")
    Integer jobs;

    @Option(names = "--set", paramLabel = "RULE", description = "A parameter rule for every part, e.g. VJ=0.7, IKF=off. Repeatable.")
    List<String> rules = new ArrayList<>();

    @Option(names = "--kind", paramLabel = "KIND", defaultValue = "silicon-pn",
            description = "Device kind for presets: silicon-pn, schottky, germanium, led, zener, base-emitter (default: ${DEFAULT-VALUE}).")
    String kind;

    @Option(names = "--corner-sigma", paramLabel = "K", defaultValue = "3",
            description = "Corners lie K standard deviations out (default: ${DEFAULT-VALUE}).")
    double cornerSigma;

    @Option(names = "--at-if", paramLabel = "A", description = "Forward current for VF (default: chosen from the data, e.g. 1m).")
    String atIf;

    @Option(names = "--at-vr", paramLabel = "V", description = "Reverse voltage for IR and C (default: chosen from the data).")
    String atVr;

    @Option(names = "--at-iz", paramLabel = "A", description = "Reverse current for VZ (default: the lot's median IBV).")
    String atIz;

    @Option(names = "--at-temp", paramLabel = "DEGC", description = "Temperature of the datasheet quantities (default: the measured one nearest 25 degC).")
    Double atTemp;

    @Option(names = "--digits", paramLabel = "N", defaultValue = "7", description = "Significant digits on the cards (default: ${DEFAULT-VALUE}).")
    int digits;

    @Option(names = "--templates", paramLabel = "DIR", description = "Folder of card templates overriding the bundled ones.")
    Path templates;

    @Option(names = "--part-cards", paramLabel = "WHEN", defaultValue = "auto",
            description = "Each fitted part's own card into OUT/NAME.parts/: auto (when the lot has at most 1000 parts), on, off (default: ${DEFAULT-VALUE}).")
    String partCards;

    @Option(names = "--no-progress", description = "No progress line on stderr.")
    boolean noProgress;

    @Option(names = "--force", description = "Run a finished lot again and replace its outputs.")
    boolean force;

    @picocli.CommandLine.Mixin
    DataOptions reading = new DataOptions();

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    /** The request the options describe; a wrong value is a wrong command line. */
    private LotRequest request() {
        List<Dialect> ds = new ArrayList<>();
        for (String d : dialects == null ? List.of("ngspice") : dialects) {
            Dialect dialect = Dialect.byName(d.trim());
            if (!ds.contains(dialect)) {
                ds.add(dialect);
            }
        }
        List<ParameterRule> parsed = new ArrayList<>();
        for (String r : rules) {
            parsed.add(ParameterRule.parse(r, SpiceNumbers::parse));
        }
        Map<Datasheet.Quantity, Double> conditions = new EnumMap<>(Datasheet.Quantity.class);
        if (atIf != null) {
            conditions.put(Datasheet.Quantity.VF, SpiceNumbers.parse(atIf));
        }
        if (atVr != null) {
            conditions.put(Datasheet.Quantity.IR, SpiceNumbers.parse(atVr));
            conditions.put(Datasheet.Quantity.C, SpiceNumbers.parse(atVr));
        }
        if (atIz != null) {
            conditions.put(Datasheet.Quantity.VZ, SpiceNumbers.parse(atIz));
        }
        if (!reading.temperatureFor.isEmpty()) {
            throw new org.cardwright.failure.UsageException("--temp-for is for fit and verify; a lot's files give their "
                    + "temperature in a T column, a '# temperature = ...' line, or --temp");
        }
        LotSettings settings = new LotSettings(reading.bench(true).readOptions(reading.temperatureKelvin()),
                DeviceKind.byOptionName(kind), parsed, reading.capacitance());
        return new LotRequest(inputs, name, out, ds,
                jobs == null ? Runtime.getRuntime().availableProcessors() : jobs, settings, cornerSigma, conditions,
                atTemp == null ? OptionalDouble.empty() : OptionalDouble.of(atTemp + Ngspice39.CELSIUS_TO_KELVIN),
                digits, force, Optional.ofNullable(templates), partCards(partCards));
    }

    private static LotRequest.PartCards partCards(String when) {
        return switch (when.trim().toLowerCase(Locale.ROOT)) {
            case "auto" -> LotRequest.PartCards.AUTO;
            case "on" -> LotRequest.PartCards.ON;
            case "off" -> LotRequest.PartCards.OFF;
            default -> throw new IllegalArgumentException("--part-cards must be auto, on or off, got '" + when + "'");
        };
    }

    @Override
    public Integer call() throws Exception {
        LotRequest request = Main.option(this::request);
        Progress progress = new Progress(spec.commandLine().getErr(), !noProgress);
        LotOutcome outcome = new LotJob().run(request, LotJson::write, LotHtml::write, progress);
        progress.end();
        Terminal.print(spec, LotText.render(outcome));
        return outcome.failed().isEmpty() ? ExitCodes.OK : ExitCodes.NOT_REPRODUCED;
    }

    /**
     * A progress line on stderr, at most twice a second and only once the run has taken more than
     * {@value #QUIET_SECONDS} s: redrawn in place on a terminal, a new line otherwise (logs).
     */
    static final class Progress implements LotProgress {
        static final double QUIET_SECONDS = 1.5;
        private final PrintWriter err;
        private final boolean on;
        private final boolean terminal = System.console() != null;
        private final long start = System.nanoTime();
        private long last;
        private boolean drawn;

        Progress(PrintWriter err, boolean on) {
            this.err = err;
            this.on = on;
        }

        @Override
        public synchronized void update(String stage, int done, int total, int failed) {
            if (!on) {
                return;
            }
            long now = System.nanoTime();
            double elapsed = (now - start) * 1e-9;
            if (elapsed < QUIET_SECONDS || (now - last < 500_000_000L && done < total)) {
                return;
            }
            last = now;
            int width = 30;
            int filled = total == 0 ? width : (int) ((long) width * done / total);
            String bar = "#".repeat(filled) + ".".repeat(width - filled);
            String text = String.format(Locale.ROOT, "lot %s [%s] %d/%d parts%s, %.0f s",
                    stage.equals("sample") ? "sample fits (choosing the terms)" : "fits", bar, done, total,
                    failed > 0 ? ", " + failed + " failed" : "", elapsed);
            if (terminal) {
                err.print("\r" + text);
            } else {
                err.println(text);
            }
            err.flush();
            drawn = true;
        }

        synchronized void end() {
            if (drawn && terminal) {
                err.println();
                err.flush();
            }
        }
    }
}
