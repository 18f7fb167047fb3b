package org.cardwright.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;

/** Finds the bad-input fixtures and checks how reading one fails. */
final class BadFixtures {
    private BadFixtures() {
    }

    /** The fixture folder fixtures/bad of the project. */
    static Path folder() {
        String projectDir = System.getenv("CARDWRIGHT_PROJECT_DIR");
        Path root = projectDir == null ? Path.of("") : Path.of(projectDir);
        Path folder = root.resolve("fixtures").resolve("bad");
        assertTrue(Files.isDirectory(folder), "fixture folder missing: " + folder.toAbsolutePath());
        return folder;
    }

    /** One fixture, which must exist. */
    static Path fixture(String name) {
        Path file = folder().resolve(name);
        assertTrue(Files.isRegularFile(file), "fixture missing: " + file.toAbsolutePath());
        return file;
    }

    /**
     * Reads the file, expects a {@link DataFileException}, and checks it names the file, the line and the raw
     * value, in its accessors and in its one-line message.
     */
    static DataFileException assertRejected(Path file, ReadOptions options, int line, String raw) {
        DataFileException e = assertThrows(DataFileException.class, () -> new MeasurementReader(options).read(file));
        String message = e.getMessage();
        assertEquals(file, e.file(), message);
        assertEquals(line, e.line(), message);
        assertEquals(raw, e.rawValue(), message);
        assertTrue(message.contains(file.getFileName().toString()), message);
        assertTrue(message.startsWith(file + ":" + line + ": "), message);
        if (raw != null) {
            assertTrue(message.endsWith(" (value '" + raw + "')"), message);
        }
        assertFalse(message.contains("\n") || message.contains("\r"), "message must be one line: " + message);
        return e;
    }

    /** As {@link #assertRejected(Path, ReadOptions, int, String)} for a fixture read with the default options. */
    static DataFileException assertRejected(String fixture, int line, String raw) {
        return assertRejected(fixture(fixture), ReadOptions.defaults(), line, raw);
    }

    /** Asserts the text contains the fragment, showing the text on failure. */
    static void assertMentions(String text, String fragment) {
        assertTrue(text.contains(fragment), "expected '" + fragment + "' in: " + text);
    }
}
