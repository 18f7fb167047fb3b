package org.cardwright.library;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.stream.Stream;
import org.cardwright.data.GivenConditions;

/**
 * The readable data files of a part, laid out for the fit and verify jobs, with the conditions the device file
 * gives each of them (its temperature and options), to be passed to the jobs as conditions given for single
 * files ({@link #conditions}): a file's own statement of a condition still wins (docs/device-files.md).
 * {@link #displayName} maps every path back to its library-relative name.
 *
 * <p>Nothing is copied: the per-file conditions replaced the copies with a T column added that earlier versions
 * staged.
 */
final class StagedInputs {
    private final List<Path> paths;
    private final OptionalDouble temperature;
    private final Map<String, String> displayNames;
    private final Map<Path, GivenConditions> conditions;

    private StagedInputs(List<Path> paths, OptionalDouble temperature, Map<String, String> displayNames,
                         Map<Path, GivenConditions> conditions) {
        this.paths = List.copyOf(paths);
        this.temperature = temperature;
        this.displayNames = displayNames;
        this.conditions = Map.copyOf(conditions);
    }

    /**
     * Lays out the readable files of {@code part}, relative names as {@code root}-relative paths.
     *
     * @param root the library root, for display names
     */
    static StagedInputs of(DeviceFile part, Path root) throws DeviceFileException, IOException {
        List<DataSource> readable = part.data().stream().filter(s -> s.kind().readable()).toList();
        Map<String, String> names = new LinkedHashMap<>();
        for (DataSource s : part.data()) {
            Path p = s.resolve(part.folder());
            if (!Files.isRegularFile(p)) {
                throw new DeviceFileException(part.path(), s.line(), "data file not found: '" + s.file() + "' (looked for "
                        + LibraryPaths.display(root, p) + ")");
            }
        }
        boolean oneTemperature = readable.stream().map(DataSource::temperature).distinct().count() <= 1;
        OptionalDouble t = oneTemperature && !readable.isEmpty() ? readable.get(0).temperature() : OptionalDouble.empty();
        String device = LibraryPaths.display(root, part.path());
        List<Path> paths = new ArrayList<>();
        Map<Path, GivenConditions> given = new LinkedHashMap<>();
        for (DataSource s : readable) {
            Path p = s.resolve(part.folder());
            paths.add(p);
            names.put(p.toString(), LibraryPaths.display(root, p));
            given.put(p, s.given(device));
        }
        return new StagedInputs(paths, t, names, given);
    }

    /**
     * The conditions the device file gives each file (temperature, options), by path; pass them to the fit and
     * verify requests ({@code withConditions}).
     */
    Map<Path, GivenConditions> conditions() {
        return conditions;
    }

    /** The files to give the fit or verify job. */
    List<Path> paths() {
        return paths;
    }

    /**
     * The one temperature the device file gives all files, when it gives one to all alike [K]; the per-file
     * temperatures are in {@link #conditions}.
     */
    OptionalDouble temperature() {
        return temperature;
    }

    /** Replaces every staged or absolute path in {@code message} by the library-relative name. */
    String displayName(String message) {
        String out = Objects.requireNonNull(message);
        List<Map.Entry<String, String>> longestFirst = new ArrayList<>(displayNames.entrySet());
        longestFirst.sort(Comparator.comparingInt((Map.Entry<String, String> e) -> e.getKey().length()).reversed());
        for (Map.Entry<String, String> e : longestFirst) {
            out = out.replace(e.getKey(), e.getValue());
        }
        return out;
    }
}
