package org.cardwright.library;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.Consumer;
import org.cardwright.card.CardFormatException;
import org.cardwright.card.Dialect;
import org.cardwright.data.DataFileException;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.verify.TemperatureVerdict;
import org.cardwright.verify.Verification;
import org.cardwright.workflow.OutputException;
import org.cardwright.workflow.VerifyRequest;
import org.cardwright.workflow.VerifyWorkflow;

/**
 * Checks a library for CI: every card of every part is re-simulated at its part's measured points
 * ({@link VerifyWorkflow}) and held to the part's forward tolerances. A card whose part's inputs no longer match
 * its state file is reported outdated: it was made from other inputs than those in the tree.
 */
public final class LibraryCheck {
    private final String engine;
    private final boolean allowStale;
    private boolean allowOutsideRoot;

    /**
     * @param engine     engine name for the re-simulation (builtin, ngspice)
     * @param allowStale let stale cards pass when they reproduce the data
     */
    public LibraryCheck(String engine, boolean allowStale) {
        this.engine = engine;
        this.allowStale = allowStale;
    }

    /**
     * @param engine           engine name for the re-simulation (builtin, ngspice)
     * @param allowStale       let stale cards pass when they reproduce the data
     * @param allowOutsideRoot let device files name data and card folders outside the library root
     */
    public LibraryCheck(String engine, boolean allowStale, boolean allowOutsideRoot) {
        this(engine, allowStale);
        this.allowOutsideRoot = allowOutsideRoot;
    }

    /** Checks every card under {@code root}, one part after the other; {@code progress} receives one line per card. */
    public List<CardCheck> check(Path root, Consumer<String> progress) throws IOException {
        return check(root, progress, 1, (done, total, cards) -> { });
    }

    /**
     * Checks every card under {@code root}, the parts on up to {@code jobs} threads; the result and the lines
     * {@code progress} receives (one per card, in the parts' order) are those of a check with one job.
     *
     * @param finished is told of each part as it finishes, with its cards' verdicts, in the order they finish
     */
    public List<CardCheck> check(Path root, Consumer<String> progress, int jobs,
                                 LibraryBuilder.PartsDone<List<CardCheck>> finished) throws IOException {
        List<Path> devices = LibraryPaths.deviceFiles(root);
        List<CardCheck> out = new ArrayList<>();
        LibraryInventory inventory = LibraryInventory.of(root, devices, allowOutsideRoot);
        int[] done = {0};
        PartPool.run(devices.size(), jobs, i -> checkPart(root, devices.get(i), inventory), new PartPool.Listener<>() {
            @Override
            public void inOrder(int i, List<CardCheck> cards) {
                for (CardCheck c : cards) {
                    out.add(c);
                    progress.accept(line(c));
                }
            }

            @Override
            public void finished(int i, List<CardCheck> cards) {
                finished.done(++done[0], devices.size(), cards);
            }
        });
        return out;
    }

    /** The one-line verdict of a card. */
    public static String line(CardCheck c) {
        return c.card() + ": " + c.status().name().toLowerCase(Locale.ROOT).replace('_', ' ')
                + (c.message().isEmpty() ? "" : ": " + c.message());
    }

    private List<CardCheck> checkPart(Path root, Path device, LibraryInventory inventory) {
        String name = LibraryPaths.display(root, device);
        long start = System.nanoTime();
        DeviceFile part;
        Recipe recipe;
        Optional<BuildState> state;
        try {
            part = new DeviceFileReader(root, allowOutsideRoot).read(device);
            Optional<DeviceFileException> clash = inventory.clash(device);
            if (clash.isPresent()) {
                throw clash.get();
            }
            recipe = Recipe.of(part);
            state = BuildState.read(part.statePath());
        } catch (IOException e) {
            return List.of(new CardCheck(name, device.getFileName().toString(), name, CardCheck.Status.ERROR,
                    e.getMessage(), Optional.empty(), seconds(start)));
        }
        boolean stale = state.isEmpty() || !state.get().recipe().equals(recipe.sha256());
        List<CardCheck> out = new ArrayList<>();
        try (StagedInputs inputs = StagedInputs.of(part, root)) {
            for (Dialect d : part.dialects()) {
                long t0 = System.nanoTime();
                Path card = part.cardPath(d);
                // a part with a resistor between its terminals: the subcircuit file is what reproduces its data
                Path shunted = part.cardFolder().resolve(org.cardwright.card.ShuntedCard.fileName(part.model(), d));
                if (Files.exists(card) && Files.exists(shunted)) {
                    card = shunted;
                }
                String cardName = LibraryPaths.display(root, card);
                if (!Files.exists(card)) {
                    out.add(new CardCheck(name, part.model(), cardName, CardCheck.Status.MISSING,
                            "no card; run cardwright build", Optional.empty(), seconds(t0)));
                    continue;
                }
                out.add(checkCard(part, d, card, cardName, name, inputs, stale, state, t0));
            }
        } catch (IOException e) {
            return List.of(new CardCheck(name, part.model(), name, CardCheck.Status.ERROR, e.getMessage(),
                    Optional.empty(), seconds(start)));
        }
        return out;
    }

    private CardCheck checkCard(DeviceFile part, Dialect d, Path card, String cardName, String name,
                                StagedInputs inputs, boolean stale, Optional<BuildState> state, long t0) throws IOException {
        Verification v;
        try {
            VerifyRequest request = new VerifyRequest(card, inputs.paths(), engine, Optional.of(part.model()), d,
                    inputs.temperature(), part.tolerances().forward(), Optional.empty(), false);
            v = new VerifyWorkflow().run(request, x -> "");
        } catch (DataFileException | SimulationException | OutputException | CardFormatException | IOException
                 | IllegalArgumentException e) {
            return new CardCheck(name, part.model(), cardName, CardCheck.Status.ERROR,
                    inputs.displayName(String.valueOf(e.getMessage())), Optional.empty(), seconds(t0));
        }
        boolean edited = state.isPresent() && !state.get().wrote(card.getFileName().toString(), Hashes.sha256(card));
        String worst = worst(v);
        if (!v.pass()) {
            return new CardCheck(name, part.model(), cardName, CardCheck.Status.FAIL,
                    "does not reproduce its data: " + worst + (edited ? " (the card was edited by hand)" : ""),
                    Optional.of(v), seconds(t0));
        }
        if (stale && !allowStale) {
            return new CardCheck(name, part.model(), cardName, CardCheck.Status.OUTDATED,
                    "reproduces its data (" + worst + ") but " + (state.isEmpty() ? "has no state file"
                            : "the device file, data or templates changed since it was built") + "; run cardwright build",
                    Optional.of(v), seconds(t0));
        }
        return new CardCheck(name, part.model(), cardName, CardCheck.Status.PASS,
                worst + (edited ? "; edited by hand since it was built" : "") + (stale ? "; outdated (allowed)" : ""),
                Optional.of(v), seconds(t0));
    }

    /** The worst temperature of a verification, in words. */
    static String worst(Verification v) {
        TemperatureVerdict w = null;
        for (TemperatureVerdict t : v.perTemperature()) {
            if (w == null || (!t.pass() && w.pass()) || (t.pass() == w.pass() && t.rms() > w.rms())) {
                w = t;
            }
        }
        if (w == null) {
            return "no points";
        }
        return String.format(Locale.ROOT, "worst at %s degC: RMS %s mV, max %s mV (limits %s, %s mV)",
                DeviceFile.celsiusText(w.temperature()), PartFitter.mv(w.rms()), PartFitter.mv(w.max()),
                PartFitter.mv(v.tolerance().rms()), PartFitter.mv(v.tolerance().max()));
    }

    private static double seconds(long start) {
        return (System.nanoTime() - start) / 1e9;
    }
}
