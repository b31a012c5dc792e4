package org.liepath.algebra.internal;

import java.util.Arrays;

/**
 * A growing, interning table of bit-packed Pauli strings: entry k occupies words {@code [k·2w, k·2w + w)} (x mask)
 * and {@code [k·2w + w, (k+1)·2w)} (z mask) of one flat array, so closure loops run over primitive memory with no
 * object per string. Lookup is open addressing on a hash of the words. Mutable, not thread-safe; confined to one
 * closure computation. Not part of the public API.
 */
public final class StringTable {
    private final int w;
    private long[] data;
    private int size;
    private int[] slots;
    private int mask;

    /** @param words 64-bit words per mask, ⌈qubits/64⌉ */
    public StringTable(int words) {
        this.w = words;
        this.data = new long[64 * 2 * words];
        this.slots = new int[128];
        Arrays.fill(slots, -1);
        this.mask = slots.length - 1;
    }

    /** @return the number of strings held */
    public int size() {
        return size;
    }

    /** @return words per mask */
    public int words() {
        return w;
    }

    /** @return the backing array (entry k at offset k·2w); valid until the next {@link #intern} */
    public long[] data() {
        return data;
    }

    /** Copies the x and z masks of entry k into the given arrays. */
    public void copy(int k, long[] x, long[] z) {
        System.arraycopy(data, k * 2 * w, x, 0, w);
        System.arraycopy(data, k * 2 * w + w, z, 0, w);
    }

    private static int hash(long[] a, int off, int len) {
        long h = 0x9E3779B97F4A7C15L;
        for (int k = 0; k < len; k++) {
            h = (h ^ a[off + k]) * 0xBF58476D1CE4E5B9L;
            h ^= h >>> 31;
        }
        return (int) (h ^ (h >>> 32));
    }

    private boolean same(int k, long[] a, int off) {
        int base = k * 2 * w;
        for (int t = 0; t < 2 * w; t++) {
            if (data[base + t] != a[off + t]) {
                return false;
            }
        }
        return true;
    }

    /** @return the index of the string stored in {@code a[off .. off+2w)} (x then z), or −1 */
    public int find(long[] a, int off) {
        int s = hash(a, off, 2 * w) & mask;
        while (slots[s] >= 0) {
            if (same(slots[s], a, off)) {
                return slots[s];
            }
            s = (s + 1) & mask;
        }
        return -1;
    }

    /** @return the index of the string in {@code a[off .. off+2w)}, adding it at index size() when absent */
    public int intern(long[] a, int off) {
        int s = hash(a, off, 2 * w) & mask;
        while (slots[s] >= 0) {
            if (same(slots[s], a, off)) {
                return slots[s];
            }
            s = (s + 1) & mask;
        }
        if ((size + 1) * 2 * w > data.length) {
            data = Arrays.copyOf(data, data.length * 2);
        }
        System.arraycopy(a, off, data, size * 2 * w, 2 * w);
        slots[s] = size++;
        if (size * 2 > slots.length) {
            rehash();
        }
        return size - 1;
    }

    private void rehash() {
        slots = new int[slots.length * 2];
        Arrays.fill(slots, -1);
        mask = slots.length - 1;
        for (int k = 0; k < size; k++) {
            int s = hash(data, k * 2 * w, 2 * w) & mask;
            while (slots[s] >= 0) {
                s = (s + 1) & mask;
            }
            slots[s] = k;
        }
    }

    /** @return true if entries i and j anticommute */
    public boolean anticommute(int i, int j) {
        int a = i * 2 * w, b = j * 2 * w;
        long acc = 0;
        for (int t = 0; t < w; t++) {
            acc ^= (data[a + t] & data[b + w + t]) ^ (data[a + w + t] & data[b + t]);
        }
        return (Long.bitCount(acc) & 1) != 0;
    }

    /**
     * Collects the indices j in [0, upTo) of entries that anticommute with entry i into {@code out} (grown as
     * needed; returned) and stores their number in {@code count[0]}. The hot loop of closures and of the
     * anticommutation graph: one-word strings (up to 64 qubits) take a branch-free path.
     */
    public int[] anticommutingWith(int i, int upTo, int[] out, int[] count) {
        int m = 0;
        if (out.length < upTo) {
            out = new int[Math.max(upTo, 2 * out.length)];
        }
        if (w == 1) {
            long xi = data[2 * i], zi = data[2 * i + 1];
            for (int j = 0; j < upTo; j++) {
                long xj = data[2 * j], zj = data[2 * j + 1];
                out[m] = j;
                m += Long.bitCount((xi & zj) ^ (zi & xj)) & 1;
            }
        } else {
            for (int j = 0; j < upTo; j++) {
                out[m] = j;
                m += anticommute(i, j) ? 1 : 0;
            }
        }
        count[0] = m;
        return out;
    }

    /**
     * Writes the string part of the product of entries i and j into {@code out[0 .. 2w)} and returns the phase
     * exponent k of P_i P_j = i^k R (see the derivation on PauliString.phase).
     */
    public int product(int i, int j, long[] out) {
        int a = i * 2 * w, b = j * 2 * w;
        int k = 0;
        for (int t = 0; t < w; t++) {
            long ax = data[a + t], az = data[a + w + t], bx = data[b + t], bz = data[b + w + t];
            long cx = ax ^ bx, cz = az ^ bz;
            out[t] = cx;
            out[w + t] = cz;
            k += Long.bitCount(ax & az) + Long.bitCount(bx & bz) - Long.bitCount(cx & cz) + 2 * Long.bitCount(az & bx);
        }
        return k & 3;
    }

    /** @return the OR of the x and z masks of entry k (its support), word t */
    public long supportWord(int k, int t) {
        return data[k * 2 * w + t] | data[k * 2 * w + w + t];
    }
}
