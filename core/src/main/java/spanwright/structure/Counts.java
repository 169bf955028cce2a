package spanwright.structure;

import java.math.BigInteger;
import java.util.Arrays;

/**
 * A growable array of non-negative counts kept as {@code long} and moved to {@link BigInteger}
 * one entry at a time when an entry would overflow (the entry's long then holds −1). Written here
 * because the dynamic programs add and multiply counts billions of times and almost all fit a long.
 * <b>Mutable, single-threaded</b>; reused across levels.
 */
final class Counts {
    private static final long BIG = -1L;
    private long[] small;
    private BigInteger[] big;

    Counts(int capacity) {
        small = new long[Math.max(1, capacity)];
    }

    void ensure(int capacity) {
        if (capacity > small.length) {
            int c = Math.max(capacity, small.length * 2);
            small = Arrays.copyOf(small, c);
            if (big != null) {
                big = Arrays.copyOf(big, c);
            }
        }
    }

    /** Sets entries 0..n−1 to zero. */
    void clear(int n) {
        Arrays.fill(small, 0, n, 0L);
        if (big != null) {
            Arrays.fill(big, 0, Math.min(n, big.length), null);
        }
    }

    void set(int i, long c) {
        small[i] = c;
    }

    boolean isZero(int i) {
        return small[i] == 0L;
    }

    BigInteger get(int i) {
        long c = small[i];
        return c == BIG ? big[i] : BigInteger.valueOf(c);
    }

    /** Entry dst += src[j] · mult (mult ≥ 1). */
    void addProduct(int dst, Counts src, int j, long mult) {
        long a = src.small[j];
        long d = small[dst];
        if (a != BIG && d != BIG && (mult == 1 || a <= Long.MAX_VALUE / mult)) {
            long r = d + a * mult;
            if (r >= 0) {
                small[dst] = r;
                return;
            }
        }
        BigInteger r = get(dst).add(src.get(j).multiply(BigInteger.valueOf(mult)));
        if (r.bitLength() < 63) {
            small[dst] = r.longValue();
            return;
        }
        if (big == null) {
            big = new BigInteger[small.length];
        }
        small[dst] = BIG;
        big[dst] = r;
    }

    /** Entry dst = src[j] (overwrites). */
    void copy(int dst, Counts src, int j) {
        small[dst] = 0L;
        addProduct(dst, src, j, 1);
    }
}
