package org.cardwright.data;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayOutputStream;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@link LineSource} decodes an all-ASCII line without the strict UTF-8 decoder and every other line with it. The
 * reference here is each line decoded by the JDK's strict UTF-8 decoder on its own: on a seeded family of files
 * mixing ASCII lines, control characters, valid multi-byte UTF-8 and bytes that are not UTF-8, the lines read must
 * be those, and a file holding a line that is not UTF-8 must be refused at that line.
 */
class LineSourceDecodeTest {
    @TempDir
    Path dir;

    private static final byte[][] PIECES = {
        "V,I".getBytes(StandardCharsets.US_ASCII), "0.65,1e-3".getBytes(StandardCharsets.US_ASCII), {'\t'}, {0x01},
        {0x7F}, "\u00b5A".getBytes(StandardCharsets.UTF_8), "\u20ac".getBytes(StandardCharsets.UTF_8),
        {(byte) 0xB5}, {(byte) 0xC3}, {(byte) 0xE2, (byte) 0x82}, {' '}, {'"'}, {}};

    @Test
    void seededLinesReadAsTheStrictDecoderReadsThem() throws Exception {
        Random random = new Random(4242L);
        for (int n = 0; n < 400; n++) {
            ByteArrayOutputStream file = new ByteArrayOutputStream();
            List<String> expected = new ArrayList<>();
            int badLine = 0;
            int lines = 1 + random.nextInt(6);
            for (int l = 1; l <= lines; l++) {
                ByteArrayOutputStream line = new ByteArrayOutputStream();
                int parts = random.nextInt(5);
                for (int p = 0; p < parts; p++) {
                    byte[] piece = PIECES[random.nextInt(PIECES.length)];
                    if ((piece.length > 0 && piece[0] < 0 && piece.length < 2) || piece.length == 2 && piece[0] == (byte) 0xE2) {
                        if (random.nextInt(3) != 0) {
                            continue; // bad bytes in a third of the draws only, so that most files read to the end
                        }
                    }
                    line.writeBytes(piece);
                }
                byte[] bytes = line.toByteArray();
                try {
                    expected.add(StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                            .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString());
                } catch (CharacterCodingException e) {
                    if (badLine == 0) {
                        badLine = l;
                    }
                }
                file.writeBytes(bytes);
                file.write('\n');
            }
            Path f = dir.resolve("f" + n + ".csv");
            Files.write(f, file.toByteArray());
            List<String> got = new ArrayList<>();
            int refusedAt = 0;
            try (LineSource s = LineSource.open(f)) {
                for (String l = s.next(); l != null; l = s.next()) {
                    got.add(l);
                }
            } catch (DataFileException e) {
                refusedAt = e.line();
            }
            int fileNumber = n;
            assertEquals(badLine, refusedAt, () -> "file " + fileNumber + ": the line refused as not UTF-8");
            List<String> want = badLine == 0 ? expected : expected.subList(0, badLine - 1);
            assertEquals(want, got, () -> "file " + fileNumber);
        }
    }
}
