package org.cardwright.cli;

/**
 * Prepares, on a second thread, what a command that reads measurement files is sure to need, while the main thread
 * builds and parses the command line: the static set-up of classes whose initialisers are slow in a fresh JVM
 * (java.math.BigDecimal's tables through the card's number writer, the regular expressions of the CSV reader, the
 * JDK's security providers behind SHA-256, and for a fit Commons Math's vector format) and nothing else. Initialising a class
 * has no effect a run can see, so outputs are the same with or without it; a class the main thread reaches first it
 * initialises itself (the JVM lets one thread do it, the other waits). Every class named here initialises only
 * JDK classes, constants and its own patterns, so two threads cannot wait on each other. Measured in
 * docs/performance.md section 11.
 */
final class Preload implements Runnable {
    /** Classes to initialise, in the order the main thread reaches them. */
    private static final String[] CLASSES = {
        "org.cardwright.card.SpiceNumbers",
        "org.cardwright.data.Preamble",
        "org.cardwright.data.FileSettings",
        "org.cardwright.data.HeaderLayout",
        "org.cardwright.data.CellNumber",
        "org.cardwright.data.MeasurementReader",
    };
    /** Classes only a fit needs (verify fits nothing). */
    private static final String[] FIT_CLASSES = {"org.apache.commons.math3.linear.ArrayRealVector"};

    private final boolean fit;

    private Preload(boolean fit) {
        this.fit = fit;
    }

    /** Starts the preparation for {@code command} (fit or verify; nothing for the others), as a daemon thread. */
    static void start(String command) {
        if (!"fit".equals(command) && !"verify".equals(command)) {
            return;
        }
        Thread t = new Thread(new Preload("fit".equals(command)), "cardwright-preload");
        t.setDaemon(true);
        t.start();
    }

    @Override
    public void run() {
        ClassLoader loader = Preload.class.getClassLoader();
        try {
            java.security.MessageDigest.getInstance("SHA-256");
        } catch (java.security.NoSuchAlgorithmException e) {
            // the reader reports it when it needs the digest
        }
        initialise(CLASSES, loader);
        if (fit) {
            initialise(FIT_CLASSES, loader);
        }
    }

    private static void initialise(String[] names, ClassLoader loader) {
        for (String name : names) {
            try {
                Class.forName(name, true, loader);
            } catch (ClassNotFoundException | LinkageError e) {
                // the main thread meets the same problem where it uses the class, and reports it there
            }
        }
    }
}
