package org.cardwright.library;

import org.cardwright.data.Sha256;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.function.Consumer;
import org.cardwright.card.Dialect;
import org.cardwright.fit.FitInputException;
import org.cardwright.workflow.OutputException;
import org.cardwright.workflow.OutputFiles;

/**
 * Builds a model library: every device file under a root, in the order of their library-relative names, one
 * after the other or on a pool of threads ({@link PartPool}) with the same result.
 *
 * <p>A part is fitted only when its recipe ({@link Recipe}: settings, data hashes, templates, tool version) differs
 * from its build record, or a card is missing. A card whose text comes out as it already is on disk is not
 * written at all. A card whose text on disk is not one cardwright wrote (by the record's hashes) was edited by
 * hand: the part is refused, unless the build was told to replace edited cards. Every file is written to a
 * temporary file beside it and renamed into place.
 */
public final class LibraryBuilder {

    /** Writes one file whole or not at all. */
    @FunctionalInterface
    interface FileWriting {
        void write(Path target, String text) throws OutputException;
    }

    private final boolean replaceEdited;
    private final FileWriting files;
    private boolean allowOutsideRoot;
    /** The whole library, read before the first part is built: model names and inputs across parts. */
    private LibraryInventory inventory;

    /** @param replaceEdited replace cards edited by hand (the build refuses them otherwise) */
    public LibraryBuilder(boolean replaceEdited) {
        this(replaceEdited, OutputFiles::writeAtomically);
    }

    /**
     * @param replaceEdited    replace cards edited by hand (the build refuses them otherwise)
     * @param allowOutsideRoot let device files name data, card and template folders outside the library root
     */
    public LibraryBuilder(boolean replaceEdited, boolean allowOutsideRoot) {
        this(replaceEdited, OutputFiles::writeAtomically);
        this.allowOutsideRoot = allowOutsideRoot;
    }

    LibraryBuilder(boolean replaceEdited, FileWriting files) {
        this.replaceEdited = replaceEdited;
        this.files = files;
    }

    /**
     * Builds every part under {@code root}, one after the other.
     *
     * @param progress receives one line per part as it finishes, e.g. {@code [ 3/20] diodes/RX10 built in 1.2 s ...}
     */
    public List<PartOutcome> build(Path root, Consumer<String> progress) throws IOException {
        return build(root, progress, 1, (done, total, o) -> { });
    }

    /**
     * Builds every part under {@code root} on up to {@code jobs} threads. The parts' cards and records, and the
     * lines {@code progress} receives, are the same as those of a build with one job: the lines come in the
     * parts' order (a part's line waits for the parts before it).
     *
     * @param progress receives one line per part, in the parts' order
     * @param finished is told of each part as it finishes, in the order they finish: how many are done, of how many
     */
    public List<PartOutcome> build(Path root, Consumer<String> progress, int jobs, PartsDone<PartOutcome> finished)
            throws IOException {
        List<Path> devices = LibraryPaths.deviceFiles(root);
        inventory = LibraryInventory.of(root, devices, allowOutsideRoot);
        int width = Integer.toString(devices.size()).length();
        int[] done = {0};
        return PartPool.run(devices.size(), jobs, i -> buildPart(root, devices.get(i)), new PartPool.Listener<>() {
            @Override
            public void inOrder(int i, PartOutcome o) {
                progress.accept(String.format(Locale.ROOT, "[%" + width + "d/%d] %s", i + 1, devices.size(), line(o)));
            }

            @Override
            public void finished(int i, PartOutcome o) {
                finished.done(++done[0], devices.size(), o);
            }
        });
    }

    /** Is told of each part of a library as it finishes. */
    @FunctionalInterface
    public interface PartsDone<T> {
        /**
         * @param done   how many parts are done, this one included
         * @param total  how many parts there are
         * @param result this part's outcome
         */
        void done(int done, int total, T result);
    }

    /** The progress line of a part. */
    public static String line(PartOutcome o) {
        String status = switch (o.status()) {
            case UP_TO_DATE -> "up to date";
            case BUILT -> String.format(Locale.ROOT, "built in %.1f s", o.seconds());
            case REFUSED_EDITED -> "REFUSED";
            case BAD_INPUT -> "BAD INPUT";
            case FIT_FAILED -> "FIT FAILED";
            case WRITE_FAILED -> "WRITE FAILED";
        };
        return o.device() + " (" + o.model() + "): " + status + (o.message().isEmpty() ? "" : ": " + o.message());
    }

    /** Builds the one part described by {@code device}. */
    PartOutcome buildPart(Path root, Path device) {
        long start = System.nanoTime();
        String name = LibraryPaths.display(root, device);
        DeviceFile part = inventory == null ? null : inventory.part(device).orElse(null);
        try {
            if (part == null) {
                // not in the inventory (a build of one part), or it did not read there: read it here, for its message
                part = new DeviceFileReader(root, allowOutsideRoot).read(device);
            }
        } catch (DeviceFileException e) {
            return failed(name, device.getFileName().toString(), PartOutcome.Status.BAD_INPUT, e.getMessage(), start);
        }
        try {
            if (inventory != null) {
                Optional<DeviceFileException> clash = inventory.clash(device);
                if (clash.isPresent()) {
                    return failed(name, part.model(), PartOutcome.Status.BAD_INPUT, clash.get().getMessage(), start);
                }
                inventory.plan(part).check();
            }
            Recipe recipe = Recipe.of(part);
            Optional<BuildState> state;
            try {
                state = BuildState.read(part.statePath());
            } catch (IOException e) {
                return failed(name, part.model(), PartOutcome.Status.BAD_INPUT, e.getMessage(), start);
            }
            List<String> edited = new ArrayList<>();
            boolean missing = false;
            Map<Dialect, String> onDisk = new java.util.EnumMap<>(Dialect.class);
            for (Dialect d : part.dialects()) {
                Path card = part.cardPath(d);
                if (!Files.exists(card)) {
                    missing = true;
                    continue;
                }
                String hash = Sha256.hex(card);
                onDisk.put(d, hash);
                if (state.isEmpty() || !state.get().wrote(card.getFileName().toString(), hash)) {
                    edited.add(LibraryPaths.display(root, card));
                }
            }
            if (!edited.isEmpty() && !replaceEdited) {
                String why = state.isEmpty() ? "exists but has no state file (" + LibraryPaths.display(root, part.statePath())
                        + "), so it was not written by cardwright build" : "was changed since cardwright wrote it";
                return failed(name, part.model(), PartOutcome.Status.REFUSED_EDITED, String.join(", ", edited) + " " + why
                        + "; to keep the change, put it in the device file (e.g. a rule such as RS=0.5) and build again;"
                        + " to overwrite it, build with --replace-edited", start);
            }
            if (edited.isEmpty() && !missing && state.isPresent() && state.get().recipe().equals(recipe.sha256())
                    && settled(part, state.get(), onDisk)) {
                return new PartOutcome(name, part.model(), PartOutcome.Status.UP_TO_DATE, "", List.of(), List.of(),
                        seconds(start), List.of());
            }
            PartFitter.Fitted fitted = new Tweaker().cards(part, root, recipe);
            return write(root, name, part, recipe, state, fitted, edited, start);
        } catch (DeviceFileException | LibraryInputException e) {
            return failed(name, part.model(), PartOutcome.Status.BAD_INPUT, e.getMessage(), start);
        } catch (FitInputException | IllegalStateException e) {
            return failed(name, part.model(), PartOutcome.Status.FIT_FAILED, e.getMessage(), start);
        } catch (OutputException e) {
            return failed(name, part.model(), PartOutcome.Status.WRITE_FAILED, e.getMessage(), start);
        } catch (IOException e) {
            return failed(name, part.model(), PartOutcome.Status.BAD_INPUT, e.getMessage(), start);
        }
    }

    private PartOutcome write(Path root, String name, DeviceFile part, Recipe recipe, Optional<BuildState> old,
                              PartFitter.Fitted fitted, List<String> edited, long start) throws OutputException, IOException {
        Map<String, Set<String>> finalCards = new LinkedHashMap<>();
        Map<String, Set<String>> pendingCards = new LinkedHashMap<>();
        Map<String, List<BuildState.Residual>> residuals = new LinkedHashMap<>();
        List<PartFitter.Card> changed = new ArrayList<>();
        List<String> unchanged = new ArrayList<>();
        for (PartFitter.Card c : fitted.cards()) {
            String file = c.file().getFileName().toString();
            String hash = Sha256.hex(c.text());
            finalCards.put(file, Set.of(hash));
            Set<String> pending = new LinkedHashSet<>();
            pending.add(hash);
            if (Files.exists(c.file())) {
                String onDisk = Sha256.hex(c.file());
                if (onDisk.equals(hash)) {
                    unchanged.add(LibraryPaths.display(root, c.file()));
                } else {
                    pending.add(onDisk);
                    changed.add(c);
                }
            } else {
                changed.add(c);
            }
            pendingCards.put(file, pending);
            List<BuildState.Residual> r = new ArrayList<>();
            for (PartFitter.Residual s : c.residuals()) {
                r.add(new BuildState.Residual(DeviceFile.celsiusText(s.temperature()), PartFitter.mv(s.rms()),
                        PartFitter.mv(s.max())));
            }
            residuals.put(file, r);
        }
        Path statePath = part.statePath();
        if (!changed.isEmpty()) {
            // first record both texts of every card about to change, so an interrupted build is never taken for a hand edit
            files.write(statePath, new BuildState(recipe.sha256(), pendingCards, residuals).text(part.model()));
        }
        List<String> written = new ArrayList<>();
        for (PartFitter.Card c : changed) {
            files.write(c.file(), c.text());
            written.add(LibraryPaths.display(root, c.file()));
        }
        String finalText = new BuildState(recipe.sha256(), finalCards, residuals).text(part.model());
        if (!Files.exists(statePath) || !Files.readString(statePath, StandardCharsets.UTF_8).equals(finalText)) {
            files.write(statePath, finalText);
        }
        StringBuilder msg = new StringBuilder();
        msg.append(written.isEmpty() ? "cards unchanged" : "wrote " + String.join(" ", written));
        if (!unchanged.isEmpty() && !written.isEmpty()) {
            msg.append("; unchanged ").append(String.join(" ", unchanged));
        }
        PartFitter.Card first = fitted.cards().get(0);
        String before = old.map(s -> worst(s.residuals().get(first.file().getFileName().toString()))).orElse("");
        msg.append("; worst RMS ");
        if (!before.isEmpty()) {
            msg.append(before).append(" -> ");
        }
        msg.append(PartFitter.mv(PartFitter.Residual.worstRms(first.residuals()))).append(" mV (").append(first.dialect().shortName()).append(')');
        if (!edited.isEmpty()) {
            msg.append("; replaced hand-edited ").append(String.join(" ", edited));
        }
        // every card, every data kind: what it reproduces and what not (the rule check uses)
        for (PartFitter.Card c : fitted.cards()) {
            c.checked().ifPresent(v -> {
                String failing = KindVerdicts.failing(v);
                msg.append("; ").append(c.dialect().shortName()).append(": ")
                        .append(failing.isEmpty() ? "every kind passes (worst RMS: " : "FAILS " + failing + " (worst RMS: ")
                        .append(KindVerdicts.of(v).stream().map(k -> k.kind() + " " + KindVerdicts.number(k.rms()) + " " + k.unit())
                                .collect(java.util.stream.Collectors.joining(", ")))
                        .append(')');
            });
        }
        return new PartOutcome(name, part.model(), PartOutcome.Status.BUILT, msg.toString(), written, unchanged,
                seconds(start), fitted.notes(), fitted.warnings());
    }

    /**
     * True when every card has exactly one recorded hash (no build was interrupted) and it is the card's.
     *
     * @param onDisk every card's SHA-256 as just read
     */
    private static boolean settled(DeviceFile part, BuildState state, Map<Dialect, String> onDisk) {
        for (Dialect d : part.dialects()) {
            Path card = part.cardPath(d);
            Set<String> hashes = state.cards().getOrDefault(card.getFileName().toString(), Set.of());
            if (hashes.size() != 1 || !hashes.contains(onDisk.get(d))) {
                return false;
            }
        }
        return true;
    }

    private static String worst(List<BuildState.Residual> rs) {
        if (rs == null || rs.isEmpty()) {
            return "";
        }
        double w = 0;
        String text = "";
        for (BuildState.Residual r : rs) {
            double v = Double.parseDouble(r.rmsMillivolts());
            if (v >= w) {
                w = v;
                text = r.rmsMillivolts();
            }
        }
        return text;
    }

    private static PartOutcome failed(String name, String model, PartOutcome.Status status, String message, long start) {
        return new PartOutcome(name, model, status, message, List.of(), List.of(), seconds(start), List.of());
    }

    private static double seconds(long start) {
        return (System.nanoTime() - start) / 1e9;
    }
}
