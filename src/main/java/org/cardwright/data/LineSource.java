package org.cardwright.data;

import java.io.Closeable;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.Locale;

/**
 * A measurement file read as a stream of physical lines, with bounded work whatever the file holds: only a
 * regular file is opened (a folder, FIFO, socket or device such as {@code /dev/zero} is refused before anything
 * is read, so nothing can hang), the file may hold at most {@link #MAX_FILE_BYTES} bytes and a line at most
 * {@link #MAX_LINE_BYTES}, and each line is decoded as strict UTF-8 on its own, so a bad byte is reported with
 * its line and column. The SHA-256 of the raw bytes is computed on the way through. Nothing but the current
 * line is held, so the memory used does not grow with the file.
 *
 * <p>Lines end at LF, CR LF or a lone CR; a UTF-8 byte-order mark at the very start is dropped. Line numbers are
 * physical and 1-based.
 */
final class LineSource implements Closeable {
    /**
     * Largest measurement file read [bytes]: 256 MiB, about seven million rows of a typical 35-byte I-V row,
     * far beyond any bench sweep; a larger file is refused rather than read into memory.
     */
    static final long MAX_FILE_BYTES = 256L << 20;
    /** Longest physical line [bytes]: 64 KiB, hundreds of times the widest export row seen in practice. */
    static final int MAX_LINE_BYTES = 64 << 10;
    private static final int CHUNK = 64 << 10;
    private static final byte[] BYTE_ORDER_MARK = {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF};

    private final Path file;
    private final InputStream in;
    private final MessageDigest digest;
    private final CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
            .onMalformedInput(CodingErrorAction.REPORT)
            .onUnmappableCharacter(CodingErrorAction.REPORT);
    private final byte[] chunk = new byte[CHUNK];
    private int chunkLength;
    private int chunkAt;
    private byte[] line = new byte[256];
    private int lineLength;
    private int lineNumber;
    private long total;
    private boolean ended;
    private boolean pendingCr;

    private LineSource(Path file, InputStream in, boolean hashed) {
        this.file = file;
        this.in = in;
        this.digest = hashed ? newDigest() : null;
    }

    /**
     * Opens a file for reading, after checking that it is a regular file within the size limit.
     *
     * @throws DataFileException at line 0 when the file is missing, unreadable, not a regular file or too large
     */
    static LineSource open(Path file) throws DataFileException {
        return open(file, true);
    }

    /**
     * Opens a file as {@link #open} does, without computing its SHA-256 ({@link #sha256} is then unavailable): for a
     * look at the first lines that decides how the file is to be read (SHA-256 in a fresh JVM's interpreter costs as
     * much as the rest of the reading).
     */
    static LineSource openUnhashed(Path file) throws DataFileException {
        return open(file, false);
    }

    private static LineSource open(Path file, boolean hashed) throws DataFileException {
        BasicFileAttributes attributes;
        try {
            attributes = Files.readAttributes(file, BasicFileAttributes.class);
        } catch (NoSuchFileException e) {
            throw new DataFileException(file, 0, "cannot read: no such file", null, e);
        } catch (AccessDeniedException e) {
            throw new DataFileException(file, 0, "cannot read: permission denied", null, e);
        } catch (IOException | SecurityException e) {
            throw new DataFileException(file, 0, "cannot read: " + reason(e), null, e);
        }
        if (attributes.isDirectory()) {
            throw new DataFileException(file, 0, "cannot read: this is a directory, not a file", null);
        }
        if (!attributes.isRegularFile()) {
            throw new DataFileException(file, 0, "cannot read: not a regular file (a device, FIFO or socket); "
                    + "give a measurement file", null);
        }
        if (attributes.size() > MAX_FILE_BYTES) {
            throw new DataFileException(file, 0, tooLarge(attributes.size()), null);
        }
        try {
            return new LineSource(file, Files.newInputStream(file), hashed);
        } catch (AccessDeniedException e) {
            throw new DataFileException(file, 0, "cannot read: permission denied", null, e);
        } catch (IOException | SecurityException e) {
            throw new DataFileException(file, 0, "cannot read: " + reason(e), null, e);
        }
    }

    /**
     * The next physical line without its line end, or null at the end of the file.
     *
     * @throws DataFileException when the line is too long, is not UTF-8, or the file cannot be read further
     */
    String next() throws DataFileException {
        if (ended) {
            return null;
        }
        lineLength = 0;
        boolean any = false;
        while (true) {
            if (chunkAt == chunkLength && !fill()) {
                ended = true;
                if (!any) {
                    return null;
                }
                break;
            }
            byte b = chunk[chunkAt++];
            if (pendingCr) {
                pendingCr = false;
                if (b == '\n') {
                    continue;
                }
            }
            any = true;
            if (b == '\n') {
                break;
            }
            if (b == '\r') {
                pendingCr = true;
                break;
            }
            if (lineLength == MAX_LINE_BYTES) {
                throw new DataFileException(file, lineNumber + 1, "line longer than " + MAX_LINE_BYTES
                        + " bytes; a measurement row is a few dozen", null);
            }
            if (lineLength == line.length) {
                line = java.util.Arrays.copyOf(line, Math.min(MAX_LINE_BYTES, line.length * 2));
            }
            line[lineLength++] = b;
        }
        lineNumber++;
        int from = 0;
        if (lineNumber == 1 && startsWithByteOrderMark()) {
            from = BYTE_ORDER_MARK.length;
        }
        return decode(from);
    }

    /** The physical 1-based line number of the line {@link #next} returned last; 0 before the first [1]. */
    int lineNumber() {
        return lineNumber;
    }

    /**
     * Reads whatever is left (still within the size limit) and returns the SHA-256 of all the file's bytes,
     * lower-case hex.
     */
    String sha256() throws DataFileException {
        if (digest == null) {
            throw new IllegalStateException("opened without hashing: " + file);
        }
        while (fill()) {
            chunkAt = chunkLength;
        }
        ended = true;
        return HexFormat.of().formatHex(digest.digest());
    }

    @Override
    public void close() {
        try {
            in.close();
        } catch (IOException e) {
            // nothing was written, so nothing is lost
        }
    }

    private boolean startsWithByteOrderMark() {
        return lineLength >= 3 && line[0] == BYTE_ORDER_MARK[0] && line[1] == BYTE_ORDER_MARK[1]
                && line[2] == BYTE_ORDER_MARK[2];
    }

    private boolean fill() throws DataFileException {
        try {
            int n = in.read(chunk);
            if (n <= 0) {
                return false;
            }
            total += n;
            if (total > MAX_FILE_BYTES) {
                throw new DataFileException(file, 0, tooLarge(total), null);
            }
            if (digest != null) {
                digest.update(chunk, 0, n);
            }
            chunkLength = n;
            chunkAt = 0;
            return true;
        } catch (IOException e) {
            throw new DataFileException(file, 0, "cannot read: " + reason(e), null, e);
        }
    }

    private String decode(int from) throws DataFileException {
        boolean ascii = true;
        for (int i = from; i < lineLength && ascii; i++) {
            ascii = line[i] >= 0;
        }
        if (ascii) {
            // ASCII bytes are valid UTF-8, one character each: the strict decoder below would give the same string
            return new String(line, from, lineLength - from, StandardCharsets.US_ASCII);
        }
        decoder.reset();
        ByteBuffer bytes = ByteBuffer.wrap(line, from, lineLength - from);
        CharBuffer out = CharBuffer.allocate(lineLength - from + 1);
        CoderResult result = decoder.decode(bytes, out, true);
        if (result.isUnderflow()) {
            result = decoder.flush(out);
        }
        if (result.isError()) {
            int at = bytes.position();
            StringBuilder raw = new StringBuilder();
            for (int i = at; i < Math.min(lineLength, at + Math.max(1, result.length())); i++) {
                raw.append(String.format(Locale.ROOT, "\\x%02X", line[i] & 0xFF));
            }
            throw new DataFileException(file, lineNumber, "not UTF-8 text (byte " + (at + 1) + " of the line): "
                    + "save the file as UTF-8", raw.toString());
        }
        out.flip();
        return out.toString();
    }

    private static String tooLarge(long bytes) {
        return "file too large: more than " + MAX_FILE_BYTES + " bytes (" + bytes + " read or listed); split it, or "
                + "thin the sweep";
    }

    private static String reason(Exception e) {
        return e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
    }

    private static MessageDigest newDigest() {
        return Sha256.digest();
    }

    /** SHA-256 of the bytes, lower-case hex. */
    static String sha256(byte[] bytes) {
        return Sha256.hex(bytes);
    }
}
