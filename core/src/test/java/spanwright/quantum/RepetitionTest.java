package spanwright.quantum;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.MathContext;
import org.junit.jupiter.api.Test;

class RepetitionTest {

    /**
     * P[Bin(k, p) ≥ τ] for τ = 0 … k + 1, summing C(k, j) p^j (1 − p)^(k−j) in decimal arithmetic
     * (independent of the code's log-space recurrence).
     */
    private static double[] tails(int k, double p) {
        MathContext mc = MathContext.DECIMAL64;
        BigDecimal bp = new BigDecimal(p);
        BigDecimal bq = BigDecimal.ONE.subtract(bp);
        BigDecimal[] pmf = new BigDecimal[k + 1];
        BigDecimal binom = BigDecimal.ONE;
        for (int j = 0; j <= k; j++) {
            if (j > 0) {
                binom = binom.multiply(BigDecimal.valueOf(k - j + 1)).divide(BigDecimal.valueOf(j), mc);
            }
            pmf[j] = binom.multiply(bp.pow(j, mc)).multiply(bq.pow(k - j, mc), mc);
        }
        double[] tail = new double[k + 2];
        BigDecimal acc = BigDecimal.ZERO;
        for (int j = k; j >= 0; j--) {
            acc = acc.add(pmf[j], mc);
            tail[j] = acc.doubleValue();
        }
        return tail;
    }

    private static double tail(int k, double p, int tau) {
        return tails(k, p)[tau];
    }

    private static boolean feasible(int k, double pPos, double pNeg, double eps) {
        double[] neg = tails(k, pNeg);
        double[] pos = tails(k, pPos);
        for (int tau = 0; tau <= k + 1; tau++) {
            if (neg[tau] <= eps && pos[tau] >= 1 - eps) {
                return true;
            }
        }
        return false;
    }

    @Test
    void foundRunsAreFeasibleAndNearTheLeast() {
        // Independent computation: exact binomial tails (BigDecimal) and a brute-force scan from
        // k = 1 for the least feasible k, which the search (starting at Pinsker's lower bound) must
        // find; the bound itself must not exceed it (Pinsker's inequality, e.g. Cover & Thomas,
        // Lemma 11.6.1).
        double[][] cases = {
            {0.5, 0.1, 0.1}, {0.5085, 0.0401, 0.1}, {0.6, 0.4, 0.05}, {0.92, 0.05, 0.1}, {0.55, 0.45, 0.2},
        };
        for (double[] c : cases) {
            Repetition r = Repetition.find(c[0], c[1], c[2]);
            assertNotNull(r);
            assertEquals(tail(r.runs, c[0], r.threshold), r.positiveAcceptance, 1e-9);
            assertEquals(tail(r.runs, c[1], r.threshold), r.negativeAcceptance, 1e-9);
            assertTrue(r.positiveAcceptance >= 1 - c[2] && r.negativeAcceptance <= c[2]);
            int least = 1;
            while (!feasible(least, c[0], c[1], c[2])) {
                least++;
            }
            assertEquals(least, r.runs);
            assertTrue(Repetition.lowerBound(c[0], c[1], c[2]) <= least);
        }
    }

    @Test
    void oneRunSufficesWhenTheRunAlreadyHasErrorEpsilon() {
        // Derived: with p₊ ≥ 1 − ε and p₋ ≤ ε, k = 1 and τ = 1 work.
        Repetition r = Repetition.find(0.95, 0.03, 0.1);
        assertEquals(1, r.runs);
        assertEquals(1, r.threshold);
        assertNull(Repetition.find(0.3, 0.3, 0.1));
        assertNull(Repetition.find(0.2, 0.4, 0.1));
    }
}
