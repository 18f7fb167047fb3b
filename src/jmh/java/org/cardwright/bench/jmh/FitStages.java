package org.cardwright.bench.jmh;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.cardwright.data.ReadOptions;
import org.cardwright.fit.CapacitanceOptions;
import org.cardwright.fit.DeviceKind;
import org.cardwright.fit.ExtractionData;
import org.cardwright.fit.FitResult;
import org.cardwright.fit.FitSettings;
import org.cardwright.fit.ForwardExtraction;
import org.cardwright.fit.JunctionExtraction;
import org.cardwright.fit.ParameterRule;
import org.cardwright.model.Flavour;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.workflow.FitWorkflow;
import org.cardwright.workflow.Inputs;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * The fit stages on the demo data, in process and warmed up: the forward stage alone (KS-1, 260 points at four
 * temperatures), the joint fit of everything (KS-1; KS-Z6 with breakdown, C-V and recovery records), and the
 * refit of the KS-1 card for SPICE3f5 (its equations, without ISR, NR, IKF), as the fit command does for a
 * second dialect.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class FitStages {
    private ExtractionData ks1;
    private ExtractionData ksz6;
    private FitSettings silicon;
    private FitSettings zener;
    private FitSettings spice3;

    @Setup
    public void read() throws Exception {
        ks1 = FitWorkflow.extractionData(Inputs.read(DemoData.files("ks1-"), ReadOptions.defaults()));
        ksz6 = FitWorkflow.extractionData(Inputs.read(DemoData.files("ksz6-"), ReadOptions.defaults()));
        silicon = FitSettings.defaults();
        zener = FitSettings.defaults().withKind(DeviceKind.ZENER);
        List<ParameterRule> off = new ArrayList<>();
        for (Param p : List.of(Param.ISR, Param.NR, Param.IKF)) {
            off.add(new ParameterRule(p, ParameterRule.Kind.OFF, Double.NaN, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY));
        }
        SimulatorOptions o = silicon.options();
        spice3 = silicon.withRules(off).withOptions(new SimulatorOptions(o.gmin(), o.reltol(), Flavour.SPICE3F5));
    }

    @Benchmark
    public FitResult forwardStageKs1() throws Exception {
        return new ForwardExtraction(silicon).fit(ks1.forward());
    }

    @Benchmark
    public FitResult jointFitKs1() throws Exception {
        return new JunctionExtraction(silicon, CapacitanceOptions.DEFAULT).fit(ks1);
    }

    @Benchmark
    public FitResult jointFitKsz6() throws Exception {
        return new JunctionExtraction(zener, CapacitanceOptions.DEFAULT).fit(ksz6);
    }

    @Benchmark
    public FitResult spice3RefitKs1() throws Exception {
        return new JunctionExtraction(spice3, CapacitanceOptions.DEFAULT).fit(ks1);
    }
}
