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
        this(words, 64);
    }

    /**
     * @param words 64-bit words per mask
     * @param expected the number of strings expected (the table grows beyond it; small closures start small)
     */
    public StringTable(int words, int expected) {
        this.w = words;
        int cap = Math.max(8, expected);
        this.data = new long[cap * 2 * words];
        this.slots = new int[Math.max(16, Integer.highestOneBit(cap - 1) << 2)];
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

    /**
     * {@link #intern} for one-word strings (w = 1, at most 64 qubits), with the masks passed as values: the hot path
     * of string closures, which then touch no buffer.
     *
     * @return the index of the string (x, z), adding it at index size() when absent
     */
    public int intern1(long x, long z) {
        int s = hash2(x, z) & mask;
        int k;
        while ((k = slots[s]) >= 0) {
            if (data[2 * k] == x && data[2 * k + 1] == z) {
                return k;
            }
            s = (s + 1) & mask;
        }
        if (2 * (size + 1) > data.length) {
            data = Arrays.copyOf(data, data.length * 2);
        }
        data[2 * size] = x;
        data[2 * size + 1] = z;
        slots[s] = size++;
        if (size * 2 > slots.length) {
            rehash();
        }
        return size - 1;
    }

    /** The same value as {@link #hash} of the two words {x, z}. */
    private static int hash2(long x, long z) {
        long h = 0x9E3779B97F4A7C15L;
        h = (h ^ x) * 0xBF58476D1CE4E5B9L;
        h ^= h >>> 31;
        h = (h ^ z) * 0xBF58476D1CE4E5B9L;
        h ^= h >>> 31;
        return (int) (h ^ (h >>> 32));
    }

    /**
     * @return the indices 0 … size()−1 sorted into the canonical order of Pauli strings (lexicographic on the letters
     *     from qubit 0, I &lt; X &lt; Y &lt; Z, as {@code PauliString.compareTo} for strings of one length), by a merge
     *     sort on primitive indices (stable; no object per string)
     */
    public int[] canonicalOrder() {
        int idBits = 32 - Integer.numberOfLeadingZeros(Math.max(1, size - 1));
        int qubits = 64 - Long.numberOfLeadingZeros(supportUnion());
        if (w == 1 && 2 * qubits + idBits <= 63) {
            return packedOrder(qubits, idBits);
        }
        int[] a = new int[size], tmp = new int[size];
        for (int k = 0; k < size; k++) {
            a[k] = k;
        }
        // bottom-up merge sort; runs of 8 first by insertion (most closures are a few hundred strings)
        for (int lo = 0; lo < size; lo += 8) {
            int hi = Math.min(size, lo + 8);
            for (int i = lo + 1; i < hi; i++) {
                int v = a[i], j = i - 1;
                while (j >= lo && compare(a[j], v) > 0) {
                    a[j + 1] = a[j];
                    j--;
                }
                a[j + 1] = v;
            }
        }
        for (int width = 8; width < size; width *= 2) {
            for (int lo = 0; lo < size; lo += 2 * width) {
                int mid = Math.min(size, lo + width), hi = Math.min(size, lo + 2 * width);
                int i = lo, j = mid, o = lo;
                while (i < mid && j < hi) {
                    tmp[o++] = compare(a[j], a[i]) < 0 ? a[j++] : a[i++];
                }
                while (i < mid) {
                    tmp[o++] = a[i++];
                }
                while (j < hi) {
                    tmp[o++] = a[j++];
                }
            }
            int[] t = a;
            a = tmp;
            tmp = t;
        }
        return a;
    }

    /** OR of the supports of all one-word entries (bit q set when some string acts on qubit q). */
    private long supportUnion() {
        long u = 0;
        if (w == 1) {
            for (int k = 0; k < 2 * size; k++) {
                u |= data[k];
            }
        }
        return u;
    }

    /**
     * {@link #canonicalOrder} for short one-word strings: each entry becomes one long, its letter codes (qubit 0 most
     * significant, two bits each) above its index, so a primitive sort of the longs orders the strings.
     */
    private int[] packedOrder(int qubits, int idBits) {
        long[] keys = new long[size];
        for (int k = 0; k < size; k++) {
            long x = data[2 * k], z = data[2 * k + 1], key = 0;
            for (int q = 0; q < qubits; q++) {
                key = (key << 2) | letter(x, z, q);
            }
            keys[k] = (key << idBits) | k;
        }
        Arrays.sort(keys);
        int[] a = new int[size];
        long idMask = (1L << idBits) - 1;
        for (int k = 0; k < size; k++) {
            a[k] = (int) (keys[k] & idMask);
        }
        return a;
    }

    /** Canonical comparison of entries i and j: the letter codes I = 0, X = 1, Y = 2, Z = 3 at the first difference. */
    private int compare(int i, int j) {
        int a = i * 2 * w, b = j * 2 * w;
        for (int t = 0; t < w; t++) {
            long ax = data[a + t], az = data[a + w + t], bx = data[b + t], bz = data[b + w + t];
            long diff = (ax ^ bx) | (az ^ bz);
            if (diff != 0) {
                int q = Long.numberOfTrailingZeros(diff);
                return Integer.compare(letter(ax, az, q), letter(bx, bz, q));
            }
        }
        return 0;
    }

    private static int letter(long x, long z, int q) {
        int xb = (int) (x >>> q) & 1, zb = (int) (z >>> q) & 1;
        return xb == 0 ? (zb == 0 ? 0 : 3) : (zb == 0 ? 1 : 2);
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
