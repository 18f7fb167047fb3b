package org.cardwright.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;

/** The streaming line reader under every data reader: line ends, digest, limits and files that are not files. */
class LineSourceTest {
    @TempDir
    Path dir;

    @Test
    void sha256MatchesThePublishedExample() throws Exception {
        // FIPS 180-2 (2002), appendix B.1: SHA-256("abc")
        String abc = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";
        assertEquals(abc, LineSource.sha256("abc".getBytes(StandardCharsets.US_ASCII)));
        Path f = dir.resolve("abc.txt");
        Files.writeString(f, "abc");
        try (LineSource s = LineSource.open(f)) {
            assertEquals("abc", s.next());
            assertEquals(abc, s.sha256());
        }
    }

    @Test
    void lineEndsAreLfCrLfAndLoneCrAndNumbersArePhysical() throws Exception {
        Path f = dir.resolve("ends.txt");
        Files.write(f, "\uFEFFa\nb\r\nc\rd\n\ne".getBytes(StandardCharsets.UTF_8));
        List<String> lines = new ArrayList<>();
        List<Integer> numbers = new ArrayList<>();
        try (LineSource s = LineSource.open(f)) {
            for (String l = s.next(); l != null; l = s.next()) {
                lines.add(l);
                numbers.add(s.lineNumber());
            }
            assertNull(s.next());
        }
        assertEquals(List.of("a", "b", "c", "d", "", "e"), lines, "byte-order mark dropped, every end kind");
        assertEquals(List.of(1, 2, 3, 4, 5, 6), numbers);
    }

    @Test
    void anUnhashedLookReadsTheSameLinesAndRefusesAHash() throws Exception {
        Path f = dir.resolve("look.txt");
        Files.write(f, "\uFEFFa\nb\r\nc\rd\n\ne".getBytes(StandardCharsets.UTF_8));
        List<String> hashed = new ArrayList<>();
        List<String> unhashed = new ArrayList<>();
        try (LineSource s = LineSource.open(f); LineSource u = LineSource.openUnhashed(f)) {
            for (String l = s.next(); l != null; l = s.next()) {
                hashed.add(l + "@" + s.lineNumber());
            }
            for (String l = u.next(); l != null; l = u.next()) {
                unhashed.add(l + "@" + u.lineNumber());
            }
            assertEquals(hashed, unhashed);
            assertThrows(IllegalStateException.class, u::sha256);
        }
        assertThrows(DataFileException.class, () -> LineSource.openUnhashed(dir));
    }

    @Test
    void digestCoversBytesNotYetRead() throws Exception {
        byte[] bytes = "V,I\n1,2\n3,4\n".getBytes(StandardCharsets.US_ASCII);
        Path f = dir.resolve("partial.csv");
        Files.write(f, bytes);
        try (LineSource s = LineSource.open(f)) {
            s.next();
            assertEquals(LineSource.sha256(bytes), s.sha256());
        }
    }

    @Test
    void badUtf8NamesLineAndByte() throws Exception {
        Path f = dir.resolve("latin1.csv");
        Files.write(f, new byte[] {'V', ',', 'I', '\n', '0', '.', '5', ',', (byte) 0xB5, 'A', '\n'});
        DataFileException e = assertThrows(DataFileException.class, () -> {
            try (LineSource s = LineSource.open(f)) {
                while (s.next() != null) {
                    // read to the end
                }
            }
        });
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("byte 5 of the line"), e.getMessage());
        assertTrue(e.getMessage().contains("\\xB5"), e.getMessage());
    }

    @Test
    void overlongLineIsRefusedWithItsNumber() throws Exception {
        Path f = dir.resolve("long.csv");
        Files.writeString(f, "V,I\n" + "1".repeat(LineSource.MAX_LINE_BYTES + 1) + "\n");
        DataFileException e = assertThrows(DataFileException.class, () -> {
            try (LineSource s = LineSource.open(f)) {
                while (s.next() != null) {
                    // read to the end
                }
            }
        });
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("line longer than"), e.getMessage());
    }

    @Test
    void folderIsRefused() {
        DataFileException e = assertThrows(DataFileException.class, () -> LineSource.open(dir));
        assertEquals(0, e.line());
        assertTrue(e.getMessage().contains("directory"), e.getMessage());
    }

    @Test
    @Timeout(value = 10, unit = TimeUnit.SECONDS)
    void endlessDevicesAreRefusedAtOnce() {
        for (String device : List.of("/dev/zero", "/dev/urandom", "/dev/null")) {
            Path p = Path.of(device);
            if (!Files.exists(p)) {
                continue; // not a Unix-like system: the FIFO test below still runs where mkfifo exists
            }
            DataFileException e = assertThrows(DataFileException.class, () -> LineSource.open(p));
            assertTrue(e.getMessage().contains("not a regular file"), e.getMessage());
        }
    }

    @Test
    @Timeout(value = 10, unit = TimeUnit.SECONDS)
    void fifoIsRefusedWithoutOpeningIt() throws Exception {
        Path fifo = dir.resolve("pipe.csv");
        Process mk;
        try {
            mk = new ProcessBuilder("mkfifo", fifo.toString()).start();
        } catch (java.io.IOException e) {
            org.junit.jupiter.api.Assumptions.abort("no mkfifo on this system: " + e.getMessage());
            return;
        }
        assertEquals(0, mk.waitFor());
        DataFileException e = assertThrows(DataFileException.class, () -> LineSource.open(fifo));
        assertTrue(e.getMessage().contains("not a regular file"), e.getMessage());
    }
}
