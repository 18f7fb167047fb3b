package org.cardwright.data;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/**
 * SHA-256 digests (FIPS 180-4) as 64 lower-case hex digits: the one helper for data files' fingerprints, the
 * library's build records and the lot's keys. It lives here, at the bottom of the package order, so that every
 * package that names its evidence by hash can use it.
 */
public final class Sha256 {
    private Sha256() {
    }

    /** A fresh SHA-256 digest, to be fed piece by piece. */
    public static MessageDigest digest() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform must provide SHA-256", e);
        }
    }

    /** The digest of {@code d} so far, in hex (the digest is reset). */
    public static String hex(MessageDigest d) {
        return HexFormat.of().formatHex(d.digest());
    }

    /** The digest of {@code bytes}. */
    public static String hex(byte[] bytes) {
        return HexFormat.of().formatHex(digest().digest(bytes));
    }

    /** The digest of {@code text} in UTF-8. */
    public static String hex(String text) {
        return hex(text.getBytes(StandardCharsets.UTF_8));
    }

    /** The digest of a file, read in blocks: memory stays small whatever the file's size. */
    public static String hex(Path file) throws IOException {
        MessageDigest d = digest();
        byte[] block = new byte[1 << 16];
        try (InputStream in = Files.newInputStream(file)) {
            for (int n = in.read(block); n >= 0; n = in.read(block)) {
                d.update(block, 0, n);
            }
        }
        return hex(d);
    }
}
