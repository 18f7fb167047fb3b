package org.cardwright.library;

import java.nio.file.Path;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.TreeMap;

/**
 * One data file of a part and the conditions it was measured under.
 *
 * @param file        the file, relative to the device file's folder, with forward slashes, as written
 * @param kind        what it holds
 * @param temperature device temperature for files without a T column [K]; empty when the file has a T column
 * @param options     further conditions for readers of the kind (sorted by key), as written
 * @param line        the line of the device file where this entry starts [1]
 */
public record DataSource(String file, DataKindName kind, OptionalDouble temperature, Map<String, String> options,
                         int line) {
    public DataSource {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(temperature, "temperature");
        options = java.util.Collections.unmodifiableMap(new TreeMap<>(options));
        if (file.isBlank()) {
            throw new IllegalArgumentException("a data file needs a name");
        }
        if (temperature.isPresent() && !(temperature.getAsDouble() > 0)) {
            throw new IllegalArgumentException("temperature must lie above absolute zero");
        }
    }

    /**
     * The conditions this entry gives its file (its temperature and options), each naming the device file and
     * this entry's line as its source.
     *
     * @param deviceFile the device file as it is shown to the user
     */
    public org.cardwright.data.GivenConditions given(String deviceFile) {
        String source = "device file " + deviceFile + " (data entry at line " + line + ")";
        org.cardwright.data.GivenConditions g = org.cardwright.data.GivenConditions.NONE;
        if (temperature.isPresent()) {
            g = g.with(org.cardwright.data.Condition.TEMPERATURE, temperature.getAsDouble(), source);
        }
        for (Map.Entry<String, String> o : options.entrySet()) {
            org.cardwright.data.Condition c = org.cardwright.data.Condition.byKey(o.getKey()).orElseThrow(
                    () -> new IllegalStateException("option " + o.getKey() + " was not checked by the reader"));
            g = g.with(c, c.parse(o.getValue()), source);
        }
        return g;
    }

    /** The file resolved against the device file's folder. */
    public Path resolve(Path deviceFolder) {
        return deviceFolder.resolve(file).normalize();
    }
}
