package spanwright.model;

/**
 * A seeded pseudo-random stream (SplitMix64: Steele, Lea &amp; Flood, "Fast splittable
 * pseudorandom number generators", OOPSLA 2014) for code the page also runs. Written here
 * because TeaVM's {@code java.util.Random} ignores its seed, so the page and the command line
 * would otherwise differ for the same seed. <b>Mutable, single-threaded.</b>
 */
public final class SeededRandom {
    private final long[] state;

    public SeededRandom(long seed) {
        this.state = new long[] {seed};
    }

    /** The next value of a SplitMix64 stream whose state is {@code state[0]} (advanced in place). */
    public static long mix(long[] state) {
        long z = (state[0] += 0x9E3779B97F4A7C15L);
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    public long nextLong() {
        return mix(state);
    }

    /** Uniform in [0, 1), 53 random bits. */
    public double nextDouble() {
        return (mix(state) >>> 11) * 0x1.0p-53;
    }

    /** Uniform in 0..bound−1 (bound &gt; 0), by rejection so there is no modulo bias. */
    public int nextInt(int bound) {
        if (bound <= 0) {
            throw new IllegalArgumentException("bound must be > 0");
        }
        long limit = Long.MAX_VALUE - (Long.MAX_VALUE % bound);
        while (true) {
            long r = mix(state) >>> 1;
            if (r < limit) {
                return (int) (r % bound);
            }
        }
    }

    /** Standard normal, by the Box–Muller transform. */
    public double nextGaussian() {
        double u = 1.0 - nextDouble(); // (0, 1]
        double v = nextDouble();
        return Math.sqrt(-2.0 * Math.log(u)) * Math.cos(2 * Math.PI * v);
    }
}
