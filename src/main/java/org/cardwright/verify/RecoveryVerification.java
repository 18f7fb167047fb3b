package org.cardwright.verify;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.model.SweepTemperatures;

/**
 * Reverse-recovery records against the card's TT through the same charge-control relation the fit uses,
 * trr = TT ln(1 + IF/|IR|) (Kingston, Proc. IRE 42 (1954) 829-834; citation recalled). Residuals in ns; limits
 * relative to the measured time: 5 % RMS and 10 % at any record (a recovery time read from an oscilloscope
 * trace is seldom better; common practice, no source).
 *
 * @param perTemperature verdicts per temperature
 * @param records        every record with the card's recovery time, in the order given (for plots); may be empty
 */
public record RecoveryVerification(List<Verdict> perTemperature, List<Modelled> records) {
    /** RMS limit relative to the measured recovery time [1]. */
    public static final double RMS_FRACTION = 0.05;
    /** Single-record limit relative to the measured recovery time [1]. */
    public static final double MAX_FRACTION = 0.10;

    public RecoveryVerification {
        perTemperature = List.copyOf(perTemperature);
        records = List.copyOf(records);
    }

    /** Verdicts without the records. */
    public RecoveryVerification(List<Verdict> perTemperature) {
        this(perTemperature, List.of());
    }

    /**
     * One record with the card's recovery time for it.
     *
     * @param record   the measured record
     * @param modelled TT ln(1 + IF/|IR|) with the card's TT [s]
     */
    public record Modelled(Record record, double modelled) {
    }

    /**
     * One measured record.
     *
     * @param forwardCurrent forward current [A]
     * @param reverseCurrent reverse current, negative [A]
     * @param recoveryTime   measured recovery time [s]
     * @param temperature    device temperature [K]
     * @param where          "file:line"
     */
    public record Record(double forwardCurrent, double reverseCurrent, double recoveryTime, double temperature,
                         String where) {
    }

    /**
     * Summary at one temperature.
     *
     * @param temperature device temperature [K]
     * @param points      records
     * @param rmsNs       RMS of modelled minus measured time [ns]
     * @param maxNs       largest magnitude [ns]
     * @param worst       "file:line" of the largest
     * @param pass        within both relative limits
     */
    public record Verdict(double temperature, int points, double rmsNs, double maxNs, String worst, boolean pass) {
    }

    /** Compares the card's TT with every record. */
    public static RecoveryVerification of(DiodeParameters card, List<Record> records) {
        double tt = card.get(Param.TT);
        Map<Double, List<Record>> byT = SweepTemperatures.group(records, Record::temperature,
                SweepTemperatures.DEFAULT_GAP);
        List<Verdict> out = new ArrayList<>();
        List<Modelled> modelled = new ArrayList<>();
        records.forEach(r -> modelled.add(new Modelled(r, tt * Math.log1p(r.forwardCurrent() / -r.reverseCurrent()))));
        for (Map.Entry<Double, List<Record>> e : byT.entrySet()) {
            double sum = 0;
            double sumRel = 0;
            double max = -1;
            boolean maxOk = true;
            String worst = "";
            for (Record r : e.getValue()) {
                double model = tt * Math.log1p(r.forwardCurrent() / -r.reverseCurrent());
                double d = model - r.recoveryTime();
                sum += d * d;
                sumRel += (d / r.recoveryTime()) * (d / r.recoveryTime());
                maxOk &= Math.abs(d) <= MAX_FRACTION * r.recoveryTime();
                if (Math.abs(d) > max) {
                    max = Math.abs(d);
                    worst = r.where();
                }
            }
            int n = e.getValue().size();
            out.add(new Verdict(e.getKey(), n, Math.sqrt(sum / n) * 1e9, max * 1e9, worst,
                    maxOk && Math.sqrt(sumRel / n) <= RMS_FRACTION));
        }
        return new RecoveryVerification(out, modelled);
    }

    /** True when every temperature passes. */
    public boolean pass() {
        return !perTemperature.isEmpty() && perTemperature.stream().allMatch(Verdict::pass);
    }
}
