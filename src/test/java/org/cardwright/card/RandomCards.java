package org.cardwright.card;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * Seeded random diode cards for tests, every parameter given, in ranges chosen so that ngspice 39 loads them
 * without a warning: M at most 0.9 (ngspice clamps above, with a warning), FC times VJ well below 1, knee
 * currents far above the 1e-28 floor.
 */
final class RandomCards {
    private RandomCards() {
    }

    static List<ModelCard> generate(int count, long seed) {
        Random r = new Random(seed);
        List<ModelCard> cards = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            Map<Param, Double> v = new EnumMap<>(Param.class);
            v.put(Param.IS, logUniform(r, 1e-18, 1e-6));
            v.put(Param.N, 1 + r.nextDouble());
            v.put(Param.RS, logUniform(r, 1e-3, 1e3));
            v.put(Param.ISR, logUniform(r, 1e-16, 1e-8));
            v.put(Param.NR, 1.5 + r.nextDouble());
            v.put(Param.IKF, logUniform(r, 1e-4, 10));
            v.put(Param.IKR, logUniform(r, 1e-4, 10));
            v.put(Param.EG, 0.6 + 0.6 * r.nextDouble());
            v.put(Param.XTI, 1 + 3 * r.nextDouble());
            v.put(Param.TRS1, (r.nextDouble() - 0.5) * 1e-2);
            v.put(Param.TRS2, (r.nextDouble() - 0.5) * 1e-5);
            v.put(Param.CJO, logUniform(r, 1e-13, 1e-9));
            v.put(Param.VJ, 0.3 + 0.7 * r.nextDouble());
            v.put(Param.M, 0.2 + 0.6 * r.nextDouble());
            v.put(Param.FC, 0.3 + 0.3 * r.nextDouble());
            v.put(Param.TT, logUniform(r, 1e-12, 1e-5));
            v.put(Param.BV, 5 + 1000 * r.nextDouble());
            v.put(Param.IBV, logUniform(r, 1e-9, 1e-3));
            v.put(Param.NBV, 1 + 2 * r.nextDouble());
            v.put(Param.TCV, (r.nextDouble() - 0.5) * 0.2);
            v.put(Param.TLEV, (double) r.nextInt(2));
            v.put(Param.RTH0, logUniform(r, 1, 1000));
            v.put(Param.TNOM, 233.15 + 150 * r.nextDouble());
            cards.add(new ModelCard("drnd" + i, DiodeParameters.of(v),
                    List.of("Invented random card " + i + " (seed " + seed + "), not data of any real part")));
        }
        return cards;
    }

    private static double logUniform(Random r, double low, double high) {
        return Math.exp(Math.log(low) + (Math.log(high) - Math.log(low)) * r.nextDouble());
    }
}
