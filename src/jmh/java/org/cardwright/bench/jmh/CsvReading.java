package org.cardwright.bench.jmh;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import org.cardwright.data.MeasurementFile;
import org.cardwright.data.MeasurementReader;
import org.cardwright.data.ReadOptions;
import org.cardwright.workflow.Inputs;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Reading measurement files: the five KS-1 demo files through {@link Inputs} (as the fit command reads them), and
 * one forward file of {@code rows} rows (invented: a smooth exponential sweep written in the benchmark's
 * set-up) through {@link MeasurementReader}. Scores are per read.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class CsvReading {
    private List<Path> demo;

    /** The invented sweep of {@code rows} rows, written once per trial. */
    @State(Scope.Benchmark)
    public static class Sweep {
        @Param({"6000", "60000"})
        public int rows;

        Path file;

        @Setup(Level.Trial)
        public void write() throws IOException {
            file = Files.createTempFile("cardwright-jmh-", ".csv");
            StringBuilder sb = new StringBuilder("# Invented benchmark sweep, not a measurement.\nV [V],I [A],T [degC]\n");
            for (int i = 0; i < rows; i++) {
                double current = 1e-9 * Math.pow(10, 8.0 * i / rows);
                double volts = 1.02 * 0.025693 * Math.log(current / 1.5e-14) + 0.85 * current;
                sb.append(String.format(Locale.ROOT, "%.7f,%.6e,25.0%n", volts, current));
            }
            Files.writeString(file, sb.toString(), StandardCharsets.UTF_8);
        }

        @TearDown(Level.Trial)
        public void delete() throws IOException {
            Files.deleteIfExists(file);
        }
    }

    @Setup
    public void find() throws IOException {
        demo = DemoData.files("ks1-");
    }

    @Benchmark
    public Inputs demoFilesKs1() throws Exception {
        return Inputs.read(demo, ReadOptions.defaults());
    }

    @Benchmark
    public MeasurementFile sweep(Sweep s) throws Exception {
        return new MeasurementReader(ReadOptions.defaults()).read(s.file);
    }
}
