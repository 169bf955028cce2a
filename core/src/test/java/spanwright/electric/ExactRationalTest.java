package spanwright.electric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import spanwright.model.Edge;

/**
 * Witness sizes against an independent computation, exact rational Laplacian elimination: every
 * double weight is turned into the exact fraction it stands for, components are found by a plain
 * union–find of this class, and the grounded Laplacian is eliminated in exact fractions, so the
 * reference has no rounding at all. Weights span 1e-12 … 1e12 (and single switches up to the ends
 * of the accepted range); the tolerance is 1e-12 relative.
 */
class ExactRationalTest {
    private static final MathContext MC = new MathContext(40);
    private static final double TOL = 1e-12;

    /** An exact fraction num/den with den &gt; 0, in lowest terms. */
    private record Frac(BigInteger num, BigInteger den) {
        static final Frac ZERO = new Frac(BigInteger.ZERO, BigInteger.ONE);

        static Frac of(BigInteger n, BigInteger d) {
            if (d.signum() < 0) {
                n = n.negate();
                d = d.negate();
            }
            BigInteger g = n.gcd(d);
            return g.signum() == 0 ? ZERO : new Frac(n.divide(g), d.divide(g));
        }

        /** The exact value of a double (BigDecimal(double) is exact). */
        static Frac of(double x) {
            BigDecimal b = new BigDecimal(x);
            return b.scale() > 0 ? of(b.unscaledValue(), BigInteger.TEN.pow(b.scale()))
                    : of(b.toBigIntegerExact(), BigInteger.ONE);
        }

        Frac plus(Frac o) {
            return of(num.multiply(o.den).add(o.num.multiply(den)), den.multiply(o.den));
        }

        Frac minus(Frac o) {
            return plus(new Frac(o.num.negate(), o.den));
        }

        Frac times(Frac o) {
            return of(num.multiply(o.num), den.multiply(o.den));
        }

        Frac inverse() {
            return of(den, num);
        }

        BigDecimal decimal() {
            return new BigDecimal(num).divide(new BigDecimal(den), MC);
        }
    }

    private static int find(int[] p, int x) {
        while (p[x] != x) {
            x = p[x];
        }
        return x;
    }

    /**
     * Effective conductance between node {@code src} and node {@code gnd} of a network on nodes
     * 0..k−1 with conductances {@code g[e]} between a[e] and b[e] (only edges with {@code use[e]}),
     * by exact elimination of every node but src and gnd (Schur complement). Nodes not joined to
     * src are dropped first (they would make the matrix singular).
     */
    private static Frac conductance(int k, int src, int gnd, int[] a, int[] b, Frac[] g, boolean[] use) {
        int[] p = new int[k];
        for (int i = 0; i < k; i++) {
            p[i] = i;
        }
        for (int e = 0; e < a.length; e++) {
            if (use[e]) {
                p[find(p, a[e])] = find(p, b[e]);
            }
        }
        if (find(p, src) != find(p, gnd)) {
            return Frac.ZERO;
        }
        // order: inner nodes of src's piece, then src; gnd is eliminated by grounding
        int[] idx = new int[k];
        int m = 0;
        for (int i = 0; i < k; i++) {
            idx[i] = -1;
        }
        for (int i = 0; i < k; i++) {
            if (i != src && i != gnd && find(p, i) == find(p, src)) {
                idx[i] = m++;
            }
        }
        idx[src] = m++;
        Frac[][] lap = new Frac[m][m];
        for (Frac[] row : lap) {
            java.util.Arrays.fill(row, Frac.ZERO);
        }
        for (int e = 0; e < a.length; e++) {
            if (!use[e] || a[e] == b[e]) {
                continue;
            }
            int i = idx[a[e]];
            int j = idx[b[e]];
            if (i >= 0) {
                lap[i][i] = lap[i][i].plus(g[e]);
            }
            if (j >= 0) {
                lap[j][j] = lap[j][j].plus(g[e]);
            }
            if (i >= 0 && j >= 0) {
                lap[i][j] = lap[i][j].minus(g[e]);
                lap[j][i] = lap[j][i].minus(g[e]);
            }
        }
        for (int q = 0; q < m - 1; q++) {
            Frac piv = lap[q][q];
            for (int i = q + 1; i < m; i++) {
                if (lap[i][q].num().signum() == 0) {
                    continue;
                }
                Frac f = lap[i][q].times(piv.inverse());
                for (int j = q + 1; j < m; j++) {
                    lap[i][j] = lap[i][j].minus(f.times(lap[q][j]));
                }
            }
        }
        return lap[m - 1][m - 1];
    }

    /** Exact R (positive) or C (negative) of one input; [0] = 1 for positive. */
    static Frac exact(int n, int s, int t, int[] u, int[] v, double[] w, boolean[] present, boolean[] positive) {
        int edges = u.length;
        Frac[] g = new Frac[edges];
        for (int e = 0; e < edges; e++) {
            g[e] = Frac.of(w[e]).inverse();
        }
        int[] p = new int[n];
        for (int i = 0; i < n; i++) {
            p[i] = i;
        }
        for (int e = 0; e < edges; e++) {
            if (present[e]) {
                p[find(p, u[e])] = find(p, v[e]);
            }
        }
        if (find(p, s) == find(p, t)) {
            positive[0] = true;
            return conductance(n, s, t, u, v, g, present).inverse();
        }
        positive[0] = false;
        int[] a = new int[edges];
        int[] b = new int[edges];
        boolean[] absent = new boolean[edges];
        for (int e = 0; e < edges; e++) {
            a[e] = find(p, u[e]);
            b[e] = find(p, v[e]);
            absent[e] = !present[e];
        }
        return conductance(n, find(p, s), find(p, t), a, b, g, absent);
    }

    private static double relativeError(double got, Frac want) {
        BigDecimal x = want.decimal();
        if (x.signum() == 0) {
            return got == 0 ? 0 : Double.POSITIVE_INFINITY;
        }
        return new BigDecimal(got).subtract(x).abs().divide(x.abs(), MC).doubleValue();
    }

    @Test
    void randomGraphsWithWeightsAcrossTwentyFourDecades() {
        randomGraphs(new Random(1313), 6, 0);
    }

    @Test
    void sparseFormAgreesWithExactArithmetic() {
        // the same check with every local network eliminated in sparse (minimum-degree) form, on
        // graphs of 3 to 14 vertices; the witness is the sparse back-substitution's
        randomGraphs(new Random(1414), 12, 1);
    }

    private static void randomGraphs(Random rnd, int sizes, int form) {
        int compared = 0;
        int negatives = 0;
        double worst = 0;
        for (int trial = 0; trial < 60; trial++) {
            int n = 3 + rnd.nextInt(sizes);
            int m = n - 1 + rnd.nextInt(2 * n);
            int[] u = new int[m];
            int[] v = new int[m];
            double[] w = new double[m];
            for (int e = 0; e < m; e++) {
                // a spanning tree first, then random edges (parallel edges and loops allowed)
                u[e] = e < n - 1 ? e + 1 : rnd.nextInt(n);
                v[e] = e < n - 1 ? rnd.nextInt(e + 1) : rnd.nextInt(n);
                w[e] = Math.pow(10, -12 + 24 * rnd.nextDouble());
            }
            ElectricalNetwork net = new ElectricalNetwork(n, 0, n - 1, u, v, w);
            net.forceForm(form);
            for (int rep = 0; rep < 8; rep++) {
                boolean[] present = new boolean[m];
                for (int e = 0; e < m; e++) {
                    present[e] = rnd.nextBoolean();
                }
                boolean[] pos = new boolean[1];
                Frac want = exact(n, 0, n - 1, u, v, w, present, pos);
                double code = net.evaluate(present);
                assertEquals(pos[0], ElectricalNetwork.isPositive(code), "side, trial " + trial);
                double err = relativeError(ElectricalNetwork.value(code), want);
                assertTrue(err <= TOL, "trial " + trial + " rep " + rep + ": relative error " + err);
                // the witness (what `detail` shows) gives the same number, bit for bit
                Witness wit = net.witness(present);
                assertEquals(ElectricalNetwork.value(code), wit.value, 0.0);
                if (pos[0]) {
                    // Ohm's law on the returned potentials: R = φ(s) − φ(t) = φ(s), up to rounding
                    assertTrue(relativeError(wit.potential[0], want) <= 1e-10, "potential of s, trial " + trial);
                }
                worst = Math.max(worst, err);
                negatives += pos[0] ? 0 : 1;
                compared++;
            }
        }
        assertEquals(480, compared);
        assertTrue(negatives > 100 && negatives < 380, "both sides exercised: " + negatives);
        assertTrue(worst < TOL, "worst " + worst);
    }

    @ParameterizedTest
    @ValueSource(doubles = {1e-100, 1e-12, 1, 1e8, 1e9, 1e12, 1e15, 1e16, 1e100})
    void oneSwitchOfAnyWeight(double w) {
        // Derived: one edge s–t of weight w. Present: R = w; the network works in conductances,
        // so R = 1/(1/w), two roundings: within 2.3e-16 relative. Absent: C = 1/w, the correctly
        // rounded 1/w (within 1.2e-16). The exact fraction is the reference.
        ElectricalNetwork net = new ElectricalNetwork(2, 0, 1, new int[] {0}, new int[] {1}, new double[] {w});
        double r = net.witnessSize(new boolean[] {true});
        assertTrue(relativeError(r, Frac.of(w)) <= 2.3e-16, "R of one switch of weight " + w + ": " + r);
        double c = net.witnessSize(new boolean[] {false});
        double err = relativeError(c, Frac.of(w).inverse());
        assertTrue(err <= 1.2e-16, "C of one switch of weight " + w + ": " + c + ", relative error " + err);
    }

    @Test
    void scaleFreeAtTheEndsOfTheRange() {
        // Law: all weights × λ gives R × λ and C / λ, so R·C is unchanged. The 4-cycle s–a–t–b
        // with unit weights, one switch absent: checked at λ = 1e-100 and 1e100 against λ = 1.
        int[] u = {0, 1, 0, 2};
        int[] v = {1, 3, 2, 3};
        boolean[] present = {true, true, false, true};
        boolean[] negative = {false, true, false, true};
        for (double lambda : new double[] {1e-100, 1e100}) {
            double[] w = {lambda, lambda, lambda, lambda};
            ElectricalNetwork net = new ElectricalNetwork(4, 0, 3, u, v, w);
            double r = net.witnessSize(present);
            double c = net.witnessSize(negative);
            boolean[] pos = new boolean[1];
            assertTrue(relativeError(r, exact(4, 0, 3, u, v, w, present, pos)) <= TOL, "R at " + lambda);
            assertTrue(relativeError(c, exact(4, 0, 3, u, v, w, negative, pos)) <= TOL, "C at " + lambda);
            // derived: R = 2λ (path s–a–t; b hangs off t), C = 2/λ (a and b are merged with t,
            // leaving the capacitors s–a and s–b, 1/λ each, in parallel): R·C = 4 at any λ
            assertEquals(4.0, r * c, 1e-14, "R·C is scale-free at " + lambda);
        }
    }

    @Test
    void subnormalAndOutOfRangeWeightsAreRefused() {
        // IEEE 754: 1/5e-324 overflows to infinity, so a subnormal weight has no conductance.
        try {
            new ElectricalNetwork(2, 0, 1, new int[] {0}, new int[] {1}, new double[] {5e-324});
            throw new AssertionError("a subnormal weight was accepted");
        } catch (IllegalArgumentException expected) {
            assertTrue(expected.getMessage().contains("conductance"), expected.getMessage());
        }
        assertFalse(Edge.weightProblem(Edge.MIN_WEIGHT) != null, "the lower end is accepted");
        assertFalse(Edge.weightProblem(Edge.MAX_WEIGHT) != null, "the upper end is accepted");
        assertTrue(Edge.weightProblem(Math.nextDown(Edge.MIN_WEIGHT)).contains("[1e-100, 1e100]"));
        assertTrue(Edge.weightProblem(Math.nextUp(Edge.MAX_WEIGHT)).contains("scale all weights"));
        assertTrue(Edge.weightProblem(5e-324).contains("outside the accepted range"));
    }
}
