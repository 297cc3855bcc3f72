package dev.standin.maven;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;

/** SHA-256 (FIPS 180-4) of bytes and files in lower-case hex, and the fingerprint of the plugin's code. */
final class Digests {

    private Digests() {
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }

    static String sha256(byte[] bytes) {
        return hex(sha256().digest(bytes));
    }

    /** The SHA-256 of a file's content, read in blocks (the file may be large). */
    static String sha256(Path file) throws IOException {
        MessageDigest digest = sha256();
        byte[] buffer = new byte[1 << 16];
        try (InputStream in = Files.newInputStream(file)) {
            for (int n; (n = in.read(buffer)) > 0; ) {
                digest.update(buffer, 0, n);
            }
        }
        return hex(digest.digest());
    }

    private static String hex(byte[] digest) {
        StringBuilder sb = new StringBuilder(digest.length * 2);
        for (byte b : digest) {
            sb.append(Character.forDigit((b >> 4) & 0xF, 16)).append(Character.forDigit(b & 0xF, 16));
        }
        return sb.toString();
    }

    /**
     * One jar on the plugin's class path: its coordinates and file; {@code byContent} when the
     * coordinates do not pin the bytes (a SNAPSHOT, or a folder of classes).
     */
    record CodePart(String id, Path file, boolean byContent) {
        CodePart {
            Objects.requireNonNull(id, "id");
        }
    }

    /**
     * A fingerprint of the code that generates: the SHA-256 of one line per part, sorted by id,
     * holding the id and, for parts identified by content, the SHA-256 of the jar. A released
     * artifact never changes under its coordinates, so its id is enough; a SNAPSHOT rebuilt with
     * other code gets another fingerprint, and its outputs are regenerated. A part given as a folder
     * (classes not packaged) or that cannot be read counts by its id alone.
     */
    static String codeFingerprint(List<CodePart> parts) {
        List<CodePart> sorted = new ArrayList<>(parts);
        sorted.sort(Comparator.comparing(CodePart::id));
        StringBuilder lines = new StringBuilder();
        for (CodePart p : sorted) {
            lines.append(p.id());
            if (p.byContent() && p.file() != null && Files.isRegularFile(p.file())) {
                try {
                    lines.append(' ').append(sha256(p.file()));
                } catch (IOException e) {
                    lines.append(" unreadable");
                }
            }
            lines.append('\n');
        }
        return sha256(lines.toString().getBytes(StandardCharsets.UTF_8));
    }
}
