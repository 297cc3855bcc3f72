package dev.standin.output;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.util.Arrays;

/**
 * A growable buffer of output bytes (UTF-8) with the number formatting of {@link NumberText} written
 * straight into it, so formatting a cell allocates nothing. One buffer per thread; not thread-safe.
 */
public final class ByteText {

    private byte[] buf;
    private int len;

    /** An empty buffer with room for {@code capacity} bytes before it grows. */
    public ByteText(int capacity) {
        this.buf = new byte[Math.max(capacity, 64)];
    }

    /** The number of bytes held. */
    public int length() {
        return len;
    }

    /** Empties the buffer, keeping its storage. */
    public void clear() {
        len = 0;
    }

    private void ensure(int extra) {
        if (len + extra > buf.length) {
            buf = Arrays.copyOf(buf, Math.max(buf.length * 2, len + extra));
        }
    }

    public void append(byte b) {
        ensure(1);
        buf[len++] = b;
    }

    public void append(byte[] bytes) {
        ensure(bytes.length);
        System.arraycopy(bytes, 0, buf, len, bytes.length);
        len += bytes.length;
    }

    /** Appends a string as UTF-8. */
    public void append(String s) {
        append(s.getBytes(StandardCharsets.UTF_8));
    }

    /** Appends the decimal text of a long, as {@link Long#toString(long)} writes it. */
    public void appendLong(long v) {
        if (v == Long.MIN_VALUE) {
            append(Long.toString(v));
            return;
        }
        ensure(20);
        if (v < 0) {
            buf[len++] = '-';
            v = -v;
        }
        int n = NumberText.digitCount(v);
        int i = len + n;
        len = i;
        do {
            long t = v / 10;
            buf[--i] = (byte) ('0' + (int) (v - t * 10));
            v = t;
        } while (v != 0);
    }

    /**
     * Appends {@link NumberText#fixed(double, int)} of the value and returns the double that text reads
     * back as ({@link Double#parseDouble} of it, computed without parsing where exact).
     */
    public double appendFixed(double value, int decimals) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("value must be finite: " + value);
        }
        long q = NumberText.scaledHalfEven(value, decimals);
        if (q == NumberText.NO_FAST_PATH) {
            String s = NumberText.fixed(value, decimals);
            append(s);
            return Double.parseDouble(s);
        }
        ensure(NumberText.MAX_FIXED_CHARS);
        boolean negative = value < 0;
        len = NumberText.writeScaled(q, negative, decimals, buf, len);
        return NumberText.scaledValue(q, negative, decimals);
    }

    /**
     * Makes room for {@code extra} more bytes and returns the storage, to be written from
     * {@link #length()} on and then committed with {@link #setLength}; valid until the next append.
     */
    public byte[] reserve(int extra) {
        ensure(extra);
        return buf;
    }

    /** Sets the number of bytes held, after writing into {@link #reserve}'s storage. */
    public void setLength(int length) {
        if (length < 0 || length > buf.length) {
            throw new IllegalArgumentException("length must be in [0, " + buf.length + "]: " + length);
        }
        len = length;
    }

    /** Writes the decimal text of v (not Long.MIN_VALUE) at pos; returns the position after it. */
    public static int writeLong(long v, byte[] buf, int pos) {
        if (v < 0) {
            buf[pos++] = '-';
            v = -v;
        }
        int n = NumberText.digitCount(v);
        int i = pos + n;
        int end = i;
        do {
            long t = v / 10;
            buf[--i] = (byte) ('0' + (int) (v - t * 10));
            v = t;
        } while (v != 0);
        return end;
    }

    /** Writes the bytes held to a stream. */
    public void writeTo(OutputStream out) throws IOException {
        out.write(buf, 0, len);
    }

    /**
     * Writes the bytes held to a file channel at a position (a positional write: the channel's own
     * position is not used, so threads may write their texts to the same file at once).
     */
    public void writeTo(FileChannel channel, long position) throws IOException {
        ByteBuffer b = ByteBuffer.wrap(buf, 0, len);
        while (b.hasRemaining()) {
            position += channel.write(b, position);
        }
    }

    /** Feeds the bytes held to a message digest. */
    public void updateDigest(MessageDigest digest) {
        digest.update(buf, 0, len);
    }

    /** A copy of the bytes held. */
    public byte[] toByteArray() {
        return Arrays.copyOf(buf, len);
    }

    /** The bytes held as a UTF-8 string (for tests and small texts). */
    @Override
    public String toString() {
        return new String(buf, 0, len, StandardCharsets.UTF_8);
    }
}
