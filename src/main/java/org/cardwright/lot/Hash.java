package org.cardwright.lot;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/** SHA-256 in hex, for fingerprints and file names. */
final class Hash {
    private Hash() {
    }

    static String sha256(String text) {
        return sha256(text.getBytes(StandardCharsets.UTF_8));
    }

    static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 missing from the JDK", e);
        }
    }

    /** A digest that is fed piece by piece. */
    static final class Running {
        private final MessageDigest digest;

        Running() {
            try {
                digest = MessageDigest.getInstance("SHA-256");
            } catch (NoSuchAlgorithmException e) {
                throw new IllegalStateException("SHA-256 missing from the JDK", e);
            }
        }

        Running add(String text) {
            byte[] b = text.getBytes(StandardCharsets.UTF_8);
            add(b);
            return this;
        }

        Running add(byte[] b) {
            digest.update(Integer.toString(b.length).getBytes(StandardCharsets.US_ASCII));
            digest.update((byte) ':');
            digest.update(b);
            return this;
        }

        String hex() {
            return HexFormat.of().formatHex(digest.digest());
        }
    }
}
