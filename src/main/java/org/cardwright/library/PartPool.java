package org.cardwright.library;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.ThreadFactory;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.IntFunction;

/**
 * Runs the parts of a library on a bounded pool of threads and hands the results back in the parts' order, so
 * that what a build or check prints and writes does not depend on how many threads ran it. Each part only reads
 * its own device file and data and writes its own cards and build record, so parts do not share state.
 *
 * <p>With one job every part runs on the calling thread, one after the other, exactly as a sequential loop.
 */
final class PartPool {

    /** Receives results. */
    interface Listener<T> {
        /** Called in part order, on the calling thread, as soon as this part and all before it are done. */
        void inOrder(int index, T result);

        /** Called once per part as it finishes (in any order; calls never overlap). */
        default void finished(int index, T result) {
        }
    }

    private PartPool() {
    }

    /** The number of jobs when none is asked for: one per available processor. */
    static int defaultJobs() {
        return Math.max(1, Runtime.getRuntime().availableProcessors());
    }

    /**
     * Runs {@code work} for the parts {@code 0 .. count-1} on at most {@code jobs} threads.
     *
     * @return the results in part order
     * @throws RuntimeException whatever a part threw unexpectedly (the other parts are cancelled)
     */
    static <T> List<T> run(int count, int jobs, IntFunction<T> work, Listener<T> listener) {
        if (jobs < 1) {
            throw new IllegalArgumentException("--jobs must be at least 1, not " + jobs);
        }
        List<T> out = new ArrayList<>(count);
        if (jobs == 1 || count <= 1) {
            for (int i = 0; i < count; i++) {
                T r = work.apply(i);
                listener.finished(i, r);
                listener.inOrder(i, r);
                out.add(r);
            }
            return out;
        }
        Object lock = new Object();
        ExecutorService pool = Executors.newFixedThreadPool(Math.min(jobs, count), daemons());
        try {
            List<Future<T>> futures = new ArrayList<>(count);
            for (int i = 0; i < count; i++) {
                int index = i;
                futures.add(pool.submit(() -> {
                    T r = work.apply(index);
                    synchronized (lock) {
                        listener.finished(index, r);
                    }
                    return r;
                }));
            }
            for (int i = 0; i < count; i++) {
                T r = await(futures.get(i));
                synchronized (lock) {
                    listener.inOrder(i, r);
                }
                out.add(r);
            }
            return out;
        } finally {
            pool.shutdownNow();
        }
    }

    private static <T> T await(Future<T> f) {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while waiting for a part", e);
        } catch (ExecutionException e) {
            Throwable c = e.getCause();
            if (c instanceof RuntimeException r) {
                throw r;
            }
            if (c instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException(c);
        }
    }

    private static ThreadFactory daemons() {
        AtomicInteger n = new AtomicInteger();
        return r -> {
            Thread t = new Thread(r, "cardwright-part-" + n.incrementAndGet());
            t.setDaemon(true);
            return t;
        };
    }
}
