package dev.standin.maven;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class DigestsTest {

    @Test
    void sha256MatchesThePublishedVectors(@TempDir Path dir) throws Exception {
        // FIPS 180-2, Appendix B.1 ("abc") and the empty message (from memory; both also checked with
        // coreutils sha256sum when this test was written).
        assertEquals("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad",
                Digests.sha256("abc".getBytes(StandardCharsets.US_ASCII)));
        Path empty = Files.write(dir.resolve("empty"), new byte[0]);
        assertEquals("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855", Digests.sha256(empty));
        // A file larger than one 64 KiB read block hashes like the same bytes in memory.
        byte[] big = new byte[200_003];
        for (int i = 0; i < big.length; i++) {
            big[i] = (byte) (i * 31);
        }
        assertEquals(Digests.sha256(big), Digests.sha256(Files.write(dir.resolve("big"), big)));
    }

    @Test
    void theCodeFingerprintFollowsSnapshotContentButNotReleaseFiles(@TempDir Path dir) throws Exception {
        Path core = Files.write(dir.resolve("core.jar"), new byte[] {1, 2, 3});
        Path yaml = Files.write(dir.resolve("yaml.jar"), new byte[] {4, 5});
        List<Digests.CodePart> parts = List.of(new Digests.CodePart("g:core:jar:1-SNAPSHOT", core, true),
                new Digests.CodePart("g:yaml:jar:2.4", yaml, false));
        String before = Digests.codeFingerprint(parts);
        assertEquals(before, Digests.codeFingerprint(List.of(parts.get(1), parts.get(0))));
        Files.write(yaml, new byte[] {9});
        assertEquals(before, Digests.codeFingerprint(parts));
        Files.write(core, new byte[] {1, 2, 4});
        assertNotEquals(before, Digests.codeFingerprint(parts));
    }
}
