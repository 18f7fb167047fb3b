package org.cardwright.data;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/** The digest and the byte-to-line mapping under the reader. */
class SourceTextTest {

    @Test
    void sha256MatchesThePublishedExample() {
        // FIPS 180-2 (2002), appendix B.1: SHA-256("abc")
        assertEquals("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad",
                SourceText.sha256("abc".getBytes(StandardCharsets.US_ASCII)));
    }

    @Test
    void byteOffsetsMapToPhysicalLines() {
        byte[] bytes = "a\nb\r\nc\rd".getBytes(StandardCharsets.US_ASCII);
        assertEquals(1, SourceText.lineOfByte(bytes, 0));
        assertEquals(2, SourceText.lineOfByte(bytes, 2));
        assertEquals(2, SourceText.lineOfByte(bytes, 4)); // the LF of CR LF still ends line 2
        assertEquals(3, SourceText.lineOfByte(bytes, 5));
        assertEquals(4, SourceText.lineOfByte(bytes, 7));
    }
}
