package org.cardwright.bench.jmh;

import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import org.cardwright.card.CardWriter;
import org.cardwright.card.Dialect;
import org.cardwright.card.ModelCard;
import org.cardwright.model.DiodeParameters;
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
 * Rendering a card from the bundled templates: with a new writer each time (template engine set up and the
 * template parsed, as one fit command does it) and with one writer kept (only the rendering). The card is the
 * invented KS-1 generating card of fixtures/demo/.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class CardRendering {
    private ModelCard card;
    private CardWriter kept;

    @Setup
    public void card() {
        Map<org.cardwright.model.Param, Double> m = new EnumMap<>(org.cardwright.model.Param.class);
        m.put(org.cardwright.model.Param.IS, 1.5e-14);
        m.put(org.cardwright.model.Param.N, 1.02);
        m.put(org.cardwright.model.Param.RS, 0.85);
        m.put(org.cardwright.model.Param.ISR, 6e-11);
        m.put(org.cardwright.model.Param.NR, 1.95);
        m.put(org.cardwright.model.Param.IKF, 0.045);
        m.put(org.cardwright.model.Param.EG, 1.11);
        m.put(org.cardwright.model.Param.XTI, 3.0);
        card = new ModelCard("KS1", DiodeParameters.of(m), List.of("invented card for the benchmark"));
        kept = new CardWriter(Optional.empty());
    }

    @Benchmark
    public String newWriterNgspice() {
        return new CardWriter(Optional.empty()).render(card, Dialect.NGSPICE, 7).text();
    }

    @Benchmark
    public String keptWriterNgspice() {
        return kept.render(card, Dialect.NGSPICE, 7).text();
    }

    @Benchmark
    public String keptWriterSpice3() {
        return kept.render(card, Dialect.SPICE3, 7).text();
    }
}
