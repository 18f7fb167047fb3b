package org.cardwright.card;

import java.nio.file.Path;

/** Where the hand-written card corpus lives: fixtures/cards under the project folder. */
final class Fixtures {
    private Fixtures() {
    }

    static Path cards() {
        String project = System.getenv("CARDWRIGHT_PROJECT_DIR");
        return (project == null ? Path.of("") : Path.of(project)).toAbsolutePath().resolve("fixtures/cards");
    }

    static Path card(String fileName) {
        return cards().resolve(fileName);
    }
}
