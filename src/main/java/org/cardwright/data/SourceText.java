package org.cardwright.data;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;

/**
 * A file's raw bytes, their SHA-256, and their text as physical lines. The text must be UTF-8; a leading
 * byte-order mark is dropped. Lines end at LF, CR LF or a lone CR; {@code lines().get(k)} is line k + 1.
 *
 * @param sha256 SHA-256 of the raw bytes, lower-case hex
 * @param lines  the physical lines, without their line ends
 */
record SourceText(String sha256, List<String> lines) {
    private static final char BYTE_ORDER_MARK = '\uFEFF';

    SourceText {
        lines = List.copyOf(lines);
    }

    /**
     * Reads a whole file.
     *
     * @throws DataFileException at line 0 when the file cannot be read, at the line of the first bad byte when
     *                           it is not UTF-8
     */
    static SourceText read(Path file) throws DataFileException {
        byte[] bytes;
        try {
            if (Files.isDirectory(file)) {
                throw new DataFileException(file, 0, "cannot read: this is a directory, not a file", null);
            }
            bytes = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw new DataFileException(file, 0, "cannot read: no such file", null, e);
        } catch (AccessDeniedException e) {
            throw new DataFileException(file, 0, "cannot read: permission denied", null, e);
        } catch (IOException | SecurityException e) {
            String why = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
            throw new DataFileException(file, 0, "cannot read: " + why, null, e);
        }
        String text = decode(file, bytes);
        if (!text.isEmpty() && text.charAt(0) == BYTE_ORDER_MARK) {
            text = text.substring(1);
        }
        return new SourceText(sha256(bytes), text.lines().toList());
    }

    /** SHA-256 of the bytes, lower-case hex. */
    static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform must provide SHA-256", e);
        }
    }

    private static String decode(Path file, byte[] bytes) throws DataFileException {
        CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(bytes);
        CharBuffer out = CharBuffer.allocate(bytes.length + 1);
        CoderResult result = decoder.decode(in, out, true);
        if (result.isUnderflow()) {
            result = decoder.flush(out);
        }
        if (result.isError()) {
            int at = in.position();
            int length = Math.max(1, result.length());
            StringBuilder raw = new StringBuilder();
            for (int i = at; i < Math.min(bytes.length, at + length); i++) {
                raw.append(String.format("\\x%02X", bytes[i] & 0xFF));
            }
            throw new DataFileException(file, lineOfByte(bytes, at),
                    "not UTF-8 text: save the file as UTF-8", raw.toString(), asException(result));
        }
        out.flip();
        return out.toString();
    }

    private static CharacterCodingException asException(CoderResult result) {
        try {
            result.throwException();
        } catch (CharacterCodingException e) {
            return e;
        }
        return null;
    }

    /** The physical 1-based line holding the byte at the offset, counting LF, CR LF and lone CR as line ends. */
    static int lineOfByte(byte[] bytes, int offset) {
        int line = 1;
        for (int i = 0; i < offset; i++) {
            if (bytes[i] == '\n' || (bytes[i] == '\r' && (i + 1 >= bytes.length || bytes[i + 1] != '\n'))) {
                line++;
            }
        }
        return line;
    }
}
