package dev.standin.engine;

import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;

/** SHA-256 in lower-case hex. */
final class Hashes {

    private Hashes() {
    }

    static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }

    static String hex(byte[] digest) {
        StringBuilder sb = new StringBuilder(digest.length * 2);
        for (byte b : digest) {
            sb.append(Character.forDigit((b >> 4) & 0xF, 16)).append(Character.forDigit(b & 0xF, 16));
        }
        return sb.toString();
    }

    static String sha256(byte[] bytes) {
        return hex(sha256().digest(bytes));
    }
}
