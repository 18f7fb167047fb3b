package org.cardwright.sim.process;

import java.time.Duration;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;

/**
 * A simulator process and everything it started, as far as it has been seen. {@link #sample} adds the current
 * descendants; a process seen once stays on the list even after its parent exits or it calls {@code setsid}, so
 * {@link #killAll} reaches it. A {@link ProcessHandle} carries the process's start time, so a number reused by
 * the operating system for another process is never killed.
 */
final class ProcessTree {
    private final ProcessHandle root;
    private final Map<Long, ProcessHandle> seen = new LinkedHashMap<>();

    ProcessTree(ProcessHandle root) {
        this.root = root;
    }

    /** Remembers the root's descendants as they are now (children, grandchildren, ...). */
    void sample() {
        root.descendants().forEach(h -> seen.putIfAbsent(h.pid(), h));
    }

    /**
     * Takes a last sample, kills the root and every process ever seen, and waits up to {@code grace} for each of
     * them to end.
     */
    void killAll(Duration grace) {
        if (root.isAlive()) {
            sample();
        }
        List<ProcessHandle> all = new java.util.ArrayList<>();
        all.add(root);
        all.addAll(seen.values());
        // the descendants of a seen process that were started after the last sample
        for (ProcessHandle h : List.copyOf(seen.values())) {
            if (h.isAlive()) {
                h.descendants().forEach(all::add);
            }
        }
        all.forEach(ProcessHandle::destroyForcibly);
        long deadline = System.nanoTime() + grace.toNanos();
        for (ProcessHandle h : all) {
            long left = deadline - System.nanoTime();
            if (left <= 0) {
                break;
            }
            try {
                h.onExit().get(left, TimeUnit.NANOSECONDS);
            } catch (Exception stillDying) {
                // the operating system reaps it; the run is over either way
            }
        }
    }
}
