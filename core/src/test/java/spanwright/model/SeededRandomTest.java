package spanwright.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class SeededRandomTest {
    @Test
    void splitMixFirstOutputForSeedZero() {
        // From memory: SplitMix64 (Steele, Lea & Flood, OOPSLA 2014) started from state 0 first
        // returns 0xE220A8397B1DCDAF.
        assertEquals(0xE220A8397B1DCDAFL, SeededRandom.mix(new long[] {0L}));
    }

    @Test
    void uniformAndGaussianMoments() {
        // Law of large numbers (common practice, no source): mean 1/2 and variance 1/12 for
        // U(0,1); mean 0 and variance 1 for N(0,1); nextInt covers its range evenly.
        SeededRandom r = new SeededRandom(7);
        int n = 200_000;
        double s = 0;
        double s2 = 0;
        double g = 0;
        double g2 = 0;
        int[] counts = new int[5];
        for (int i = 0; i < n; i++) {
            double u = r.nextDouble();
            assertTrue(u >= 0 && u < 1);
            s += u;
            s2 += u * u;
            double x = r.nextGaussian();
            g += x;
            g2 += x * x;
            counts[r.nextInt(5)]++;
        }
        assertEquals(0.5, s / n, 0.005);
        assertEquals(1.0 / 12, s2 / n - (s / n) * (s / n), 0.002);
        assertEquals(0.0, g / n, 0.01);
        assertEquals(1.0, g2 / n, 0.02);
        for (int c : counts) {
            assertEquals(n / 5.0, c, n * 0.01);
        }
    }

    @Test
    void sameSeedSameStream() {
        SeededRandom a = new SeededRandom(99);
        SeededRandom b = new SeededRandom(99);
        for (int i = 0; i < 100; i++) {
            assertEquals(a.nextLong(), b.nextLong());
        }
    }
}
