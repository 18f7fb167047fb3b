package org.cardwright.lot;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import org.cardwright.data.Sha256;

/** A lot's fingerprints: SHA-256 ({@link Sha256}) over length-prefixed pieces. */
final class Hash {
    private Hash() {
    }

    /** A digest that is fed piece by piece. */
    static final class Running {
        private final MessageDigest digest;

        Running() {
            digest = Sha256.digest();
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
            return Sha256.hex(digest);
        }
    }
}
