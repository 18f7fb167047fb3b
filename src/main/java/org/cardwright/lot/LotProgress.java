package org.cardwright.lot;

/** Told as the parts of a lot are fitted (from worker threads: implementations must be thread-safe). */
public interface LotProgress {
    /** No reporting. */
    LotProgress NONE = (stage, done, total, failed) -> { };

    /**
     * One more part done.
     *
     * @param stage  "sample" (the parts that choose the lot's terms) or "fit"
     * @param done   parts done so far in this stage (results kept from an earlier run included)
     * @param total  parts in this stage
     * @param failed parts failed so far in this stage
     */
    void update(String stage, int done, int total, int failed);
}
