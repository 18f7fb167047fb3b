package org.cardwright.library;

import org.cardwright.data.Sha256;
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
import org.cardwright.verify.JunctionVerification;
import org.cardwright.verify.VerdictBasis;
import org.cardwright.verify.Verification;
import org.cardwright.workflow.Engines;
import org.cardwright.workflow.OutputException;
import org.cardwright.workflow.VerifyRequest;
import org.cardwright.workflow.VerifyWorkflow;

/**
 * Checks a library for CI: every card of every part is re-simulated at every measured point of every data kind its
 * part has ({@link VerifyWorkflow#runAll}: forward I-V against the part's forward tolerances, breakdown, C-V,
 * recovery and leakage against verify's limits), each kind judged as verify judges it: against the data's own
 * uncertainty ({@link VerdictBasis#NOISE}), except for a part whose device file sets its own limits (has a
 * {@code tolerance} block), which is judged by those fixed limits; {@link #verdict} sets one basis for every
 * part. A card fails when any kind fails. A card whose dialect the engine does not
 * speak ({@link Engines#speaks}) is not run and reported not checkable. A card whose part's inputs no longer match
 * its state file is reported outdated: it was made from other inputs than those in the tree.
 */
public final class LibraryCheck {
    private final String engine;
    private final boolean allowStale;
    private boolean allowOutsideRoot;
    private Optional<VerdictBasis> verdict = Optional.empty();

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

    /**
     * Judges every part's kinds by {@code basis} from now on (empty: each part by its own rule, see the class comment);
     * returns this check.
     */
    public LibraryCheck verdict(Optional<VerdictBasis> basis) {
        this.verdict = java.util.Objects.requireNonNull(basis, "basis");
        return this;
    }

    /** The basis a part is judged by: the one asked for, else its device file's limits when it sets any, else the noise. */
    static VerdictBasis basis(DeviceFile part, Optional<VerdictBasis> asked) {
        // DeviceFileReader gives a part without a tolerance block the DEFAULT instance itself: a block, even one that
        // repeats the defaults, is the team's choice of fixed engineering limits
        return asked.orElse(part.tolerances() == PartTolerances.DEFAULT ? VerdictBasis.NOISE : VerdictBasis.FIXED);
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
        try {
            StagedInputs inputs = StagedInputs.of(part, root);
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
                if (!Engines.speaks(engine, d)) {
                    out.add(new CardCheck(name, part.model(), cardName, CardCheck.Status.NOT_CHECKABLE,
                            "with " + engine + ": " + engine + " does not read " + d.shortName()
                                    + " cards as " + d.simulator() + " does; check it with --engine builtin"
                                    + (d == Dialect.GNUCAP ? " or --engine gnucap" : ""),
                            Optional.empty(), seconds(t0)));
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

    /** A version as a card header may state it: plain characters, bounded (a card is data, its text is not trusted). */
    private static final java.util.regex.Pattern BUILT_BY =
            java.util.regex.Pattern.compile("^\\* model \\S+: .*, written by cardwright ([0-9A-Za-z.+_-]{1,40}) \\(");

    /**
     * Why an outdated card's inputs digest differs: when its header says another cardwright version wrote it, that
     * (the version is part of the digest, docs/library.md); otherwise any of the inputs.
     */
    static String outdatedBecause(Path card) {
        String other = null;
        try (java.io.BufferedReader in = Files.newBufferedReader(card, java.nio.charset.StandardCharsets.UTF_8)) {
            String first = in.readLine();
            java.util.regex.Matcher m = first == null ? null : BUILT_BY.matcher(first);
            if (m != null && m.find() && !m.group(1).equals(org.cardwright.workflow.ToolVersion.get())) {
                other = m.group(1);
            }
        } catch (IOException e) {
            other = null;  // the generic reason below; the card itself was read by the check just made
        }
        return other != null
                ? "it was built by cardwright " + other + " and this is cardwright " + org.cardwright.workflow.ToolVersion.get()
                : "the device file, data, templates or cardwright's version changed since it was built";
    }

    private CardCheck checkCard(DeviceFile part, Dialect d, Path card, String cardName, String name,
                                StagedInputs inputs, boolean stale, Optional<BuildState> state, long t0) throws IOException {
        JunctionVerification all;
        try {
            VerifyRequest request = new VerifyRequest(card, inputs.paths(), engine, Optional.of(part.model()), d,
                    inputs.temperature(), part.tolerances().forward(), Optional.empty(), false,
                    org.cardwright.fit.CapacitanceOptions.DEFAULT, org.cardwright.workflow.FitRequest.BenchOptions.DEFAULT,
                    basis(part, verdict))
                    .withConditions(inputs.conditions());
            all = new VerifyWorkflow().runAll(request, x -> "");
        } catch (DataFileException | SimulationException | OutputException | CardFormatException | IOException
                 | IllegalArgumentException e) {
            return new CardCheck(name, part.model(), cardName, CardCheck.Status.ERROR,
                    inputs.displayName(String.valueOf(e.getMessage())), Optional.empty(), seconds(t0));
        }
        boolean edited = state.isPresent() && !state.get().wrote(card.getFileName().toString(), Sha256.hex(card));
        Optional<Verification> v = all.forward();
        String worst = KindVerdicts.summary(all) + (basis(part, verdict) == VerdictBasis.NOISE
                ? "; judged against the data's own uncertainty" : "; judged by the fixed limits");
        if (!all.pass()) {
            return new CardCheck(name, part.model(), cardName, CardCheck.Status.FAIL,
                    "does not reproduce its " + KindVerdicts.failing(all) + " data: " + worst
                            + (edited ? " (the card was edited by hand)" : ""),
                    v, seconds(t0), Optional.of(all));
        }
        if (stale && !allowStale) {
            return new CardCheck(name, part.model(), cardName, CardCheck.Status.OUTDATED,
                    "reproduces its data (" + worst + ") but " + (state.isEmpty() ? "has no state file"
                            : outdatedBecause(card)) + "; run cardwright build",
                    v, seconds(t0), Optional.of(all));
        }
        return new CardCheck(name, part.model(), cardName, CardCheck.Status.PASS,
                worst + (edited ? "; edited by hand since it was built" : "") + (stale ? "; outdated (allowed)" : ""),
                v, seconds(t0), Optional.of(all));
    }

    private static double seconds(long start) {
        return (System.nanoTime() - start) / 1e9;
    }
}
