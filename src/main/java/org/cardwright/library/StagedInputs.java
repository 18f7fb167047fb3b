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
import org.cardwright.data.DataFileException;
import org.cardwright.data.MeasurementReader;
import org.cardwright.data.ReadOptions;

/**
 * The readable data files of a part, laid out for the fit and verify jobs, which take one temperature for every
 * file without a T column. When a device file gives different temperatures to different files, each such file
 * that has no T column is copied to a private folder with a T column added (the rows are not otherwise touched),
 * and the copy is passed instead. {@link #displayName} maps every path back to the name in the device file.
 *
 * <p>Close it to delete the private folder.
 */
final class StagedInputs implements AutoCloseable {
    private final List<Path> paths;
    private final OptionalDouble temperature;
    private final Map<String, String> displayNames;
    private final Path folder;

    private StagedInputs(List<Path> paths, OptionalDouble temperature, Map<String, String> displayNames, Path folder) {
        this.paths = List.copyOf(paths);
        this.temperature = temperature;
        this.displayNames = displayNames;
        this.folder = folder;
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
        List<Path> paths = new ArrayList<>();
        if (oneTemperature) {
            OptionalDouble t = readable.isEmpty() ? OptionalDouble.empty() : readable.get(0).temperature();
            for (DataSource s : readable) {
                Path p = s.resolve(part.folder());
                paths.add(p);
                names.put(p.toString(), LibraryPaths.display(root, p));
            }
            return new StagedInputs(paths, t, names, null);
        }
        Path folder = Files.createTempDirectory("cardwright-staged-");
        int k = 0;
        for (DataSource s : readable) {
            Path p = s.resolve(part.folder());
            Path use = p;
            if (s.temperature().isPresent() && !hasTemperatureColumn(p)) {
                Path dir = Files.createDirectories(folder.resolve(Integer.toString(k++)));
                use = dir.resolve(p.getFileName().toString());
                Files.writeString(use, withTemperatureColumn(Files.readString(p, StandardCharsets.UTF_8),
                        DeviceFile.celsiusText(s.temperature().getAsDouble())), StandardCharsets.UTF_8);
            }
            paths.add(use);
            names.put(use.toString(), LibraryPaths.display(root, p));
        }
        return new StagedInputs(paths, OptionalDouble.empty(), names, folder);
    }

    /** True when the file reads without a default temperature, i.e. it has its own T column. */
    private static boolean hasTemperatureColumn(Path p) {
        try {
            new MeasurementReader(ReadOptions.defaults()).read(p);
            return true;
        } catch (DataFileException e) {
            return false;
        }
    }

    /** The text with a {@code T [degC]} cell added to the header row and {@code celsius} to every data row. */
    static String withTemperatureColumn(String text, String celsius) {
        String[] lines = text.split("\r\n|\r|\n", -1);
        StringBuilder sb = new StringBuilder();
        boolean header = true;
        for (int i = 0; i < lines.length; i++) {
            String line = lines[i];
            String stripped = line.strip();
            if (!stripped.isEmpty() && !stripped.startsWith("#")) {
                line = line.stripTrailing() + (header ? ",T [degC]" : "," + celsius);
                header = false;
            }
            sb.append(line);
            if (i < lines.length - 1) {
                sb.append('\n');
            }
        }
        return sb.toString();
    }

    /** The files to give the fit or verify job. */
    List<Path> paths() {
        return paths;
    }

    /** The temperature to give the job for files without a T column [K]. */
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

    @Override
    public void close() {
        if (folder == null) {
            return;
        }
        try (Stream<Path> walk = Files.walk(folder)) {
            for (Path p : walk.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        } catch (IOException e) {
            // a leftover temporary folder is harmless
        }
    }
}
