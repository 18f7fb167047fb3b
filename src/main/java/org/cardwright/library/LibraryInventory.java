package org.cardwright.library;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.cardwright.card.Dialect;
import org.cardwright.workflow.OutputPlan;

/**
 * What a whole library reads and writes, gathered before a build or check touches anything: every device file that
 * reads cleanly, the files it names, the model it claims and the cards it makes. From it come the two checks that
 * need every part at once: no two device files claim one model name (SPICE compares names without regard to case),
 * and no part writes over a file another part reads. A device file that does not read is left to the part's own
 * report.
 */
public final class LibraryInventory {
    private final Path root;
    private final Map<Path, DeviceFile> parts = new LinkedHashMap<>();
    private final Map<String, List<Path>> byModel = new LinkedHashMap<>();
    /** Every part's inputs, located once and shared by every part's plan. */
    private OutputPlan inputsPlan;

    private LibraryInventory(Path root) {
        this.root = root;
    }

    /** Reads every device file under {@code root}. */
    public static LibraryInventory of(Path root, boolean allowOutsideRoot) throws IOException {
        return of(root, LibraryPaths.deviceFiles(root), allowOutsideRoot);
    }

    /** Reads the given device files of the library under {@code root}. */
    static LibraryInventory of(Path root, List<Path> devices, boolean allowOutsideRoot) {
        LibraryInventory inv = new LibraryInventory(root);
        DeviceFileReader reader = new DeviceFileReader(root, allowOutsideRoot);
        for (Path d : devices) {
            try {
                DeviceFile part = reader.read(d);
                inv.parts.put(d, part);
                inv.byModel.computeIfAbsent(part.model().toUpperCase(Locale.ROOT), k -> new ArrayList<>()).add(d);
            } catch (DeviceFileException e) {
                // reported by the part itself
            }
        }
        return inv;
    }

    /** The part read from {@code device} when it read cleanly; empty otherwise (its own read then reports why). */
    Optional<DeviceFile> part(Path device) {
        return Optional.ofNullable(parts.get(device));
    }

    /**
     * The one-line error when another device file claims the same model name as {@code device}, naming both files
     * and the line of each one's model key; empty when the name is its own.
     */
    Optional<DeviceFileException> clash(Path device) {
        DeviceFile part = parts.get(device);
        if (part == null) {
            return Optional.empty();
        }
        List<Path> claimants = byModel.getOrDefault(part.model().toUpperCase(Locale.ROOT), List.of());
        if (claimants.size() < 2) {
            return Optional.empty();
        }
        List<String> others = new ArrayList<>();
        for (Path other : claimants) {
            if (!other.equals(device)) {
                others.add(LibraryPaths.display(root, other) + ":" + modelLine(other));
            }
        }
        return Optional.of(new DeviceFileException(device, modelLine(device), "model " + part.model()
                + " is also claimed by " + String.join(", ", others)
                + "; each model name belongs to one device file, or their cards would overwrite each other"));
    }

    private static int modelLine(Path device) {
        try {
            return DeviceFileReader.keyLine(Files.readString(device, StandardCharsets.UTF_8), "model");
        } catch (IOException | RuntimeException e) {
            return 0;
        }
    }

    /** Every file the library's parts read: device files, data files and their own templates. */
    public List<Path> inputs() {
        List<Path> out = new ArrayList<>();
        for (Map.Entry<Path, DeviceFile> e : parts.entrySet()) {
            out.add(e.getKey());
            for (DataSource s : e.getValue().data()) {
                out.add(s.resolve(e.getValue().folder()));
            }
            out.addAll(templates(e.getValue()));
        }
        return out;
    }

    /** Every card and build record the library's parts make. */
    public List<Path> outputs() {
        List<Path> out = new ArrayList<>();
        for (DeviceFile p : parts.values()) {
            out.addAll(outputs(p));
        }
        return out;
    }

    /**
     * The output plan of one part's build: its cards and build record against every file any part of the library
     * reads.
     */
    OutputPlan plan(DeviceFile part) {
        OutputPlan plan = allInputs().copy();
        plan.input("device file", part.path());
        for (DataSource s : part.data()) {
            plan.input("a data file of this part", s.resolve(part.folder()));
        }
        for (Path t : templates(part)) {
            plan.input("a template of this part", t);
        }
        for (Dialect d : part.dialects()) {
            plan.output("the " + d.shortName() + " card", part.cardPath(d));
        }
        plan.output("the state file", part.statePath());
        return plan;
    }

    private synchronized OutputPlan allInputs() {
        if (inputsPlan == null) {
            OutputPlan all = new OutputPlan();
            for (Map.Entry<Path, DeviceFile> e : parts.entrySet()) {
                String of = LibraryPaths.display(root, e.getKey());
                all.input("device file", e.getKey());
                for (DataSource s : e.getValue().data()) {
                    all.input("a data file of " + of, s.resolve(e.getValue().folder()));
                }
                for (Path t : templates(e.getValue())) {
                    all.input("a template of " + of, t);
                }
            }
            inputsPlan = all;
        }
        return inputsPlan;
    }

    /** The cards and the build record of {@code part}. */
    static List<Path> outputs(DeviceFile part) {
        List<Path> out = new ArrayList<>();
        for (Dialect d : part.dialects()) {
            out.add(part.cardPath(d));
        }
        out.add(part.statePath());
        return out;
    }

    /** The part's own template files that exist, one per dialect. */
    static List<Path> templates(DeviceFile part) {
        List<Path> out = new ArrayList<>();
        if (part.templates().isPresent()) {
            Path folder = part.folder().resolve(part.templates().get());
            for (Dialect d : part.dialects()) {
                Path t = folder.resolve(d.templateFileName());
                if (Files.exists(t)) {
                    out.add(t);
                }
            }
        }
        return out;
    }
}
