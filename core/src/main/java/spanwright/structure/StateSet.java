package spanwright.structure;

import java.util.Arrays;

/**
 * One level of a frontier search: distinct packed states (a fixed number of {@code long} words
 * each) in an open-addressing hash table, with each state's best value, its count, and the
 * parent state and decision that gave the best value. At most {@code budget} states:
 * {@link #add} returns −1 instead of growing past it. <b>Mutable, single-threaded</b>; two of
 * these are swapped level after level and their arrays reused.
 */
final class StateSet {
    final int words;
    private final long budget;
    long[] keys;
    double[] value;
    final Counts count;
    int[] parent;
    byte[] decision;
    int size;
    private int[] table;
    private int mask;

    StateSet(int words, long budget) {
        this.words = words;
        this.budget = budget;
        int cap = 1024;
        keys = new long[cap * words];
        value = new double[cap];
        count = new Counts(cap);
        parent = new int[cap];
        decision = new byte[cap];
        table = new int[2 * cap];
        Arrays.fill(table, -1);
        mask = table.length - 1;
    }

    void clear() {
        count.clear(size);
        size = 0;
        Arrays.fill(table, -1);
    }

    private static int hash(long[] key, int words) {
        long h = 0x9E3779B97F4A7C15L;
        for (int i = 0; i < words; i++) {
            h = (h ^ key[i]) * 0xBF58476D1CE4E5B9L;
            h ^= h >>> 31;
        }
        return (int) (h ^ (h >>> 32));
    }

    /**
     * The index of {@code key} (words 0..words−1), added with count 0 and value −∞ if new; −1 when
     * adding it would pass the budget.
     */
    int add(long[] key) {
        int slot = hash(key, words) & mask;
        while (true) {
            int idx = table[slot];
            if (idx < 0) {
                break;
            }
            if (same(idx, key)) {
                return idx;
            }
            slot = (slot + 1) & mask;
        }
        if (size >= budget) {
            return -1;
        }
        if (size == value.length) {
            grow();
            return add(key);
        }
        int idx = size++;
        System.arraycopy(key, 0, keys, idx * words, words);
        value[idx] = Double.NEGATIVE_INFINITY;
        count.set(idx, 0L);
        table[slot] = idx;
        return idx;
    }

    private boolean same(int idx, long[] key) {
        int off = idx * words;
        for (int i = 0; i < words; i++) {
            if (keys[off + i] != key[i]) {
                return false;
            }
        }
        return true;
    }

    private void grow() {
        int cap = value.length * 2;
        keys = Arrays.copyOf(keys, cap * words);
        value = Arrays.copyOf(value, cap);
        count.ensure(cap);
        parent = Arrays.copyOf(parent, cap);
        decision = Arrays.copyOf(decision, cap);
        table = new int[2 * cap];
        Arrays.fill(table, -1);
        mask = table.length - 1;
        long[] key = new long[words];
        for (int idx = 0; idx < size; idx++) {
            System.arraycopy(keys, idx * words, key, 0, words);
            int slot = hash(key, words) & mask;
            while (table[slot] >= 0) {
                slot = (slot + 1) & mask;
            }
            table[slot] = idx;
        }
    }

    /** Merges one arrival: count += c·1 from {@code from[j]}; the best value keeps its parent. */
    void offer(int idx, double v, Counts from, int j, int parentIdx, int dec) {
        count.addProduct(idx, from, j, 1);
        if (v > value[idx]) {
            value[idx] = v;
            parent[idx] = parentIdx;
            decision[idx] = (byte) dec;
        }
    }
}
