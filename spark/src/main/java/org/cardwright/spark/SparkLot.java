package org.cardwright.spark;

import java.io.PrintStream;
import java.io.Serializable;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import org.apache.spark.SparkConf;
import org.apache.spark.api.java.JavaSparkContext;
import org.cardwright.card.Dialect;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.data.ReadOptions;
import org.cardwright.fit.CapacitanceOptions;
import org.cardwright.fit.DeviceKind;
import org.cardwright.fit.ParameterRule;
import org.cardwright.lot.Datasheet;
import org.cardwright.lot.LotFitter;
import org.cardwright.lot.LotJob;
import org.cardwright.lot.LotOutcome;
import org.cardwright.lot.LotParts;
import org.cardwright.lot.LotPlan;
import org.cardwright.lot.LotProgress;
import org.cardwright.lot.LotRequest;
import org.cardwright.lot.LotSettings;
import org.cardwright.lot.PartResult;
import org.cardwright.model.Ngspice39;
import org.cardwright.report.LotHtml;
import org.cardwright.report.LotJson;
import org.cardwright.report.LotText;

/**
 * The lot job as an Apache Spark application. The driver does what the plain path does before and after the fits
 * ({@link LotJob#prepare}: parts, the sample that chooses the terms, stored results; {@link LotJob#finish}:
 * statistics, cards, tables, JSON); the per-part fits are a Spark map over the parts still to fit, each task
 * running {@link LotJob#fitAndStore}, the very code of the plain path, and storing its result in the lot's state
 * folder. Results travel as their state-file text, so the outputs are byte-identical to the plain path's.
 *
 * <p>Embedded {@code local[*]} when no master is configured; {@code spark-submit --master URL} on a cluster (the
 * input, the lot folder and its state folder must then be on storage every executor sees).
 *
 * <pre>
 * SparkLot INPUT... --name NAME --out DIR [--master M] [--partitions N] [--set RULE]... [--kind KIND]
 *          [--temp DEGC] [--corner-sigma K] [--at-if A] [--at-vr V] [--at-iz A] [--at-temp DEGC] [--force]
 * </pre>
 */
public final class SparkLot {

    /**
     * The command line, kept as text so that executors rebuild the same settings from it.
     *
     * @param inputs     lot inputs
     * @param name       lot name
     * @param out        lot folder
     * @param master     Spark master; empty: spark.master if set, else local[*]
     * @param partitions Spark partitions of the part list; 0: Spark's default parallelism
     * @param rules      parameter rules
     * @param kind       device kind option
     * @param temp       device temperature option [degC]; empty when not given
     * @param options    the other options by name (corner-sigma, at-if, at-vr, at-iz, at-temp)
     * @param force      run a finished lot again
     */
    public record Options(List<String> inputs, String name, String out, String master, int partitions, List<String> rules,
                          String kind, String temp, Map<String, String> options, boolean force) implements Serializable {
        private static final long serialVersionUID = 1L;

        /** Parses the command line. */
        public static Options parse(String... args) {
            List<String> inputs = new ArrayList<>();
            List<String> rules = new ArrayList<>();
            Map<String, String> options = new java.util.TreeMap<>();
            String name = null;
            String out = null;
            String master = "";
            int partitions = 0;
            String kind = "silicon-pn";
            String temp = "";
            boolean force = false;
            for (int i = 0; i < args.length; i++) {
                String a = args[i];
                switch (a) {
                    case "--name" -> name = value(args, ++i, a);
                    case "--out" -> out = value(args, ++i, a);
                    case "--master" -> master = value(args, ++i, a);
                    case "--partitions" -> partitions = Integer.parseInt(value(args, ++i, a));
                    case "--set" -> rules.add(value(args, ++i, a));
                    case "--kind" -> kind = value(args, ++i, a);
                    case "--temp" -> temp = value(args, ++i, a);
                    case "--corner-sigma", "--at-if", "--at-vr", "--at-iz", "--at-temp" -> options.put(a.substring(2), value(args, ++i, a));
                    case "--force" -> force = true;
                    default -> {
                        if (a.startsWith("--")) {
                            throw new IllegalArgumentException("unknown option " + a);
                        }
                        inputs.add(a);
                    }
                }
            }
            if (name == null || out == null || inputs.isEmpty()) {
                throw new IllegalArgumentException("usage: SparkLot INPUT... --name NAME --out DIR [options]");
            }
            return new Options(List.copyOf(inputs), name, out, master, partitions, List.copyOf(rules), kind, temp,
                    Map.copyOf(options), force);
        }

        private static String value(String[] args, int i, String option) {
            if (i >= args.length) {
                throw new IllegalArgumentException(option + " needs a value");
            }
            return args[i];
        }

        /** The read and fit settings, the same on the driver and on every executor. */
        public LotSettings settings() {
            ReadOptions read = ReadOptions.defaults();
            if (!temp.isEmpty()) {
                read = read.withDefaultTemperature(Double.parseDouble(temp) + Ngspice39.CELSIUS_TO_KELVIN);
            }
            List<ParameterRule> parsed = new ArrayList<>();
            for (String r : rules) {
                parsed.add(ParameterRule.parse(r, SpiceNumbers::parse));
            }
            return new LotSettings(read, DeviceKind.byOptionName(kind), parsed, CapacitanceOptions.DEFAULT);
        }

        /** The lot request (one thread for the driver's sample fits is not used: the driver gets its own pool). */
        public LotRequest request() {
            Map<Datasheet.Quantity, Double> conditions = new EnumMap<>(Datasheet.Quantity.class);
            if (options.containsKey("at-if")) {
                conditions.put(Datasheet.Quantity.VF, SpiceNumbers.parse(options.get("at-if")));
            }
            if (options.containsKey("at-vr")) {
                conditions.put(Datasheet.Quantity.IR, SpiceNumbers.parse(options.get("at-vr")));
                conditions.put(Datasheet.Quantity.C, SpiceNumbers.parse(options.get("at-vr")));
            }
            if (options.containsKey("at-iz")) {
                conditions.put(Datasheet.Quantity.VZ, SpiceNumbers.parse(options.get("at-iz")));
            }
            OptionalDouble atTemp = options.containsKey("at-temp")
                    ? OptionalDouble.of(Double.parseDouble(options.get("at-temp")) + Ngspice39.CELSIUS_TO_KELVIN) : OptionalDouble.empty();
            return new LotRequest(inputs.stream().map(Path::of).toList(), name, Path.of(out), List.of(Dialect.NGSPICE),
                    Runtime.getRuntime().availableProcessors(), settings(),
                    Double.parseDouble(options.getOrDefault("corner-sigma", "3")), conditions, atTemp, 7, force, Optional.empty());
        }
    }

    private SparkLot() {
    }

    public static void main(String[] args) {
        PrintStream err = System.err;
        try {
            LotOutcome o = run(Options.parse(args));
            System.out.print(LotText.render(o));
            System.exit(o.failed().isEmpty() ? 0 : 1);
        } catch (IllegalArgumentException e) {
            err.println("cardwright-spark: " + e.getMessage());
            System.exit(2);
        } catch (Exception e) {
            err.println("cardwright-spark: " + e.getMessage());
            System.exit(e instanceof org.cardwright.workflow.OutputException ? 6 : e instanceof java.io.IOException ? 3 : 70);
        }
    }

    /** Runs the lot on Spark. */
    public static LotOutcome run(Options given) throws Exception {
        Options options = withParquetAsCsv(given);
        LotRequest request = options.request();
        SparkConf conf = new SparkConf().setAppName("cardwright lot " + options.name());
        if (!options.master().isEmpty()) {
            conf.setMaster(options.master());
        } else if (!conf.contains("spark.master")) {
            conf.setMaster("local[*]");
        }
        conf.set("spark.ui.enabled", "false");
        LotJob job = new LotJob();
        ExecutorService pool = Executors.newFixedThreadPool(Runtime.getRuntime().availableProcessors());
        LotJob.Prepared prepared;
        try {
            prepared = job.prepare(request, pool, LotProgress.NONE);
        } finally {
            pool.shutdownNow();
        }
        List<String> encoded = new ArrayList<>();
        for (int i : prepared.todo()) {
            encoded.add(prepared.parts().get(i).encode());
        }
        String planText = prepared.plan().toText();
        String state = request.stateDir().toAbsolutePath().toString();
        List<String> texts;
        try (JavaSparkContext sc = new JavaSparkContext(conf)) {
            sc.setLogLevel("WARN");
            int slices = options.partitions() > 0 ? options.partitions() : Math.max(1, sc.defaultParallelism());
            texts = encoded.isEmpty() ? List.of() : sc.parallelize(encoded, Math.min(slices, encoded.size()))
                    .map(part -> fitOne(options, planText, part, state)).collect();
        }
        for (int k = 0; k < prepared.todo().size(); k++) {
            PartResult r = PartResult.fromText(texts.get(k));
            if (r == null) {
                throw new IllegalStateException("a Spark task returned no result for part " + prepared.parts().get(prepared.todo().get(k)).name());
            }
            prepared.results()[prepared.todo().get(k)] = r;
        }
        return job.finish(prepared, LotJson::write, LotHtml::write);
    }

    /** The options with every *.parquet input replaced by its long CSV table in the lot's state folder ({@link ParquetTable}). */
    static Options withParquetAsCsv(Options o) throws java.io.IOException {
        if (o.inputs().stream().noneMatch(in -> ParquetTable.isParquet(Path.of(in)))) {
            return o;
        }
        Path dir = Path.of(o.out()).resolve(o.name() + ".lot-state").resolve("parquet");
        List<String> inputs = new ArrayList<>();
        for (String in : o.inputs()) {
            inputs.add(ParquetTable.isParquet(Path.of(in)) ? ParquetTable.toCsv(Path.of(in), dir).toString() : in);
        }
        return new Options(List.copyOf(inputs), o.name(), o.out(), o.master(), o.partitions(), o.rules(), o.kind(), o.temp(),
                o.options(), o.force());
    }

    /** The per-part task on an executor: the plain path's {@link LotJob#fitAndStore}, settings rebuilt from the options. */
    static String fitOne(Options options, String planText, String encodedPart, String stateDir) throws Exception {
        LotPlan plan = LotPlan.fromText(planText);
        if (plan == null) {
            throw new IllegalStateException("the lot's plan did not reach the executor whole");
        }
        return LotJob.fitAndStore(new LotFitter(options.settings()), LotParts.Part.decode(encodedPart), plan, Path.of(stateDir)).toText();
    }
}
