package spanwright.bounds;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import spanwright.model.Promise;

class ClassicalMeasuresTest {

    /** Every witness is checked against its definition, independently of how it was found. */
    static void checkWitnesses(ClassicalMeasures c) {
        TargetFunction f = c.function();
        int n = f.variableCount();
        // the decision tree computes f on every input of the domain and has the claimed depth
        int deepest = 0;
        for (int k = 0; k < f.size(); k++) {
            assertEquals(f.value(k), c.decisionTree().evaluate(f.input(k), n), "tree on " + f.format(f.input(k)));
            deepest = Math.max(deepest, c.decisionTree().queries(f.input(k), n));
        }
        assertTrue(c.decisionTree().depth() >= deepest);
        assertEquals(c.decisionTreeDepth(), c.decisionTree().depth());
        // certificates fix f on the domain
        for (Certificate cert : new Certificate[] {c.zeroCertificate(), c.oneCertificate()}) {
            if (cert != null) {
                assertTrue(Functions.isCertificate(f, cert.input(), cert.fixed()), "certificate of " + f.format(cert.input()));
                assertEquals(cert.value(), f.valueAt(cert.input()) == 1);
            }
        }
        // sensitive blocks are disjoint, non-empty, stay in the domain and flip f
        for (SensitiveBlocks b : new SensitiveBlocks[] {c.sensitiveInput(), c.sensitiveBlocks()}) {
            long union = 0;
            for (long block : b.blocks()) {
                assertEquals(0, union & block, "blocks overlap");
                union |= block;
                assertTrue(Functions.sensitiveTo(f, b.input(), block), "block does not flip f");
            }
        }
        for (long block : c.sensitiveInput().blocks()) {
            assertEquals(1, Long.bitCount(block));
        }
        assertEquals(c.sensitivity(), c.sensitiveInput().count());
        assertEquals(c.blockSensitivity(), c.sensitiveBlocks().count());
    }

    /** Values of the measures against brute-force definitions (independent computation). */
    static void checkAgainstBruteForce(ClassicalMeasures c) {
        TargetFunction f = c.function();
        int n = f.variableCount();
        assertEquals(Functions.bruteDepth(f, 0, 0), c.decisionTreeDepth(), "D");
        int c0 = 0;
        int c1 = 0;
        int s = 0;
        int bs = 0;
        for (int k = 0; k < f.size(); k++) {
            long x = f.input(k);
            int cx = Functions.bruteCertificate(f, x);
            if (f.value(k)) {
                c1 = Math.max(c1, cx);
            } else {
                c0 = Math.max(c0, cx);
            }
            int sx = 0;
            for (int i = 0; i < n; i++) {
                if (Functions.sensitiveTo(f, x, f.variableMask(i))) {
                    sx++;
                }
            }
            s = Math.max(s, sx);
            bs = Math.max(bs, Functions.bruteBlockSensitivity(f, x, (1L << n) - 1));
        }
        assertEquals(c0, c.c0(), "C0");
        assertEquals(c1, c.c1(), "C1");
        assertEquals(s, c.sensitivity(), "s");
        assertEquals(bs, c.blockSensitivity(), "bs");
        if (f.isTotal()) {
            // law: the multilinear degree equals the Fourier degree (affine substitution x = (1 − y)/2)
            assertEquals(Functions.fourierDegree(f), c.degree(), "deg");
        }
    }

    @Test
    void orAndAnd() {
        // Buhrman & de Wolf, "Complexity measures and decision tree complexity: a survey", TCS 288 (2002):
        // D(OR_n) = n, C0 = n, C1 = 1, s = bs = deg = n; AND_n is the dual (C0 = 1, C1 = n)
        for (int n = 1; n <= 6; n++) {
            ClassicalMeasures or = ClassicalMeasures.compute(Functions.or(n));
            assertEquals(n, or.decisionTreeDepth());
            assertEquals(n, or.c0());
            assertEquals(1, or.c1());
            assertEquals(n, or.sensitivity());
            assertEquals(n, or.blockSensitivity());
            assertEquals(n, or.degree());
            checkWitnesses(or);
            ClassicalMeasures and = ClassicalMeasures.compute(Functions.and(n));
            assertEquals(n, and.decisionTreeDepth());
            assertEquals(1, and.c0());
            assertEquals(n, and.c1());
            assertEquals(n, and.sensitivity());
            assertEquals(n, and.blockSensitivity());
            assertEquals(n, and.degree());
            // derived: AND_n = x1·x2·…·xn, one monomial with coefficient 1
            assertEquals(1, and.topMonomial().coefficient());
            checkWitnesses(and);
        }
    }

    @Test
    void parity() {
        // same survey: D = deg = s = bs = C = n for PARITY_n
        for (int n = 1; n <= 6; n++) {
            ClassicalMeasures c = ClassicalMeasures.compute(Functions.parity(n));
            assertEquals(n, c.decisionTreeDepth());
            assertEquals(n, c.degree());
            assertEquals(n, c.sensitivity());
            assertEquals(n, c.blockSensitivity());
            assertEquals(n, c.c());
            // derived: x1 ⊕ … ⊕ xn = Σ_S (−2)^{|S|−1} Π_S x_i, so the top coefficient is (−2)^{n−1}
            assertEquals((long) Math.pow(-2, n - 1), c.topMonomial().coefficient());
            checkWitnesses(c);
        }
    }

    @Test
    void majorityOfThree() {
        // the values; derived: maj(a,b,c) = ab + ac + bc − 2abc, so deg = 3 (coefficient −2);
        // C = 2 (two agreeing variables certify), s = bs = 2 at 011-type inputs, D = 3
        ClassicalMeasures c = ClassicalMeasures.compute(Functions.of(3, "maj(x1, x2, x3)"));
        assertEquals(3, c.decisionTreeDepth());
        assertEquals(2, c.c());
        assertEquals(2, c.sensitivity());
        assertEquals(2, c.blockSensitivity());
        assertEquals(3, c.degree());
        assertEquals(-2, c.topMonomial().coefficient());
        checkWitnesses(c);
        checkAgainstBruteForce(c);
    }

    @Test
    void sortednessSeparatesSensitivityFromBlockSensitivity() {
        // S. Aaronson, "My Philomath Project: Sensitivity versus Block-Sensitivity", Shtetl-Optimized
        // (2010): the 4-bit sortedness function has s = 2 and bs = 3
        ClassicalMeasures c = ClassicalMeasures.compute(Functions.sortedness());
        assertEquals(2, c.sensitivity());
        assertEquals(3, c.blockSensitivity());
        checkWitnesses(c);
        checkAgainstBruteForce(c);
    }

    @Test
    void promiseVersionsUseOnlyTheDomain() {
        // the bridge of the ferry demo under "at most two of five cancelled": values by brute force
        // on the 16 inputs of Hamming weight 3..5 (independent computation)
        TargetFunction f = TargetFunction.parse(java.util.List.of("hw", "he", "wm", "em", "k"),
                "(hw & wm) | (he & em) | (hw & k & em) | (he & k & wm)", Promise.weights(new int[] {3, 4, 5}));
        assertFalse(f.isTotal());
        ClassicalMeasures c = ClassicalMeasures.compute(f);
        assertFalse(c.hasDegree());
        assertEquals(-1, c.degree());
        assertNull(c.topMonomial());
        checkWitnesses(c);
        checkAgainstBruteForce(c);
    }

    @Test
    void constantFunctions() {
        // common practice, no source: a constant needs no query and no certificate; the zero
        // polynomial is reported with degree 0 and the constant 1 as the empty monomial
        ClassicalMeasures zero = ClassicalMeasures.compute(Functions.of(3, "0"));
        assertEquals(0, zero.decisionTreeDepth());
        assertEquals(0, zero.c());
        assertEquals(0, zero.sensitivity());
        assertEquals(0, zero.blockSensitivity());
        assertEquals(0, zero.degree());
        assertNull(zero.oneCertificate());
        ClassicalMeasures one = ClassicalMeasures.compute(Functions.of(3, "1"));
        assertEquals(1, one.topMonomial().coefficient());
        checkWitnesses(one);
    }

    @Test
    void seededRandomFunctionsAgreeWithBruteForceAndTheChain() {
        for (int seed = 1; seed <= 30; seed++) {
            int n = 2 + seed % 4;
            for (boolean promise : new boolean[] {false, true}) {
                TargetFunction f = Functions.random(n, seed, promise);
                ClassicalMeasures c = ClassicalMeasures.compute(f);
                checkWitnesses(c);
                checkAgainstBruteForce(c);
                // Buhrman & de Wolf 2002: s ≤ bs ≤ C ≤ D and deg ≤ D
                assertTrue(c.sensitivity() <= c.blockSensitivity());
                assertTrue(c.blockSensitivity() <= c.c());
                assertTrue(c.c() <= c.decisionTreeDepth());
                if (f.isTotal()) {
                    assertTrue(c.degree() <= c.decisionTreeDepth());
                    // Nisan, SIAM J. Comput. 20 (1991): C ≤ s·bs for total functions;
                    // D ≤ C0·C1 for non-constant total functions (Blum & Impagliazzo 1987, Hartmanis & Hemachandra
                    // 1987; stated in the Buhrman & de Wolf survey)
                    assertTrue(c.c() <= c.sensitivity() * c.blockSensitivity() || f.isConstant());
                    assertTrue(c.decisionTreeDepth() <= c.c0() * c.c1() || f.isConstant());
                }
            }
        }
    }

    @Test
    void twelveVariablesWithinLimit() {
        // OR_12: the limit case; the values are the survey's (n for D, s, bs, deg; C1 = 1)
        ClassicalMeasures c = ClassicalMeasures.compute(Functions.or(ClassicalMeasures.MAX_VARIABLES));
        assertEquals(12, c.decisionTreeDepth());
        assertEquals(12, c.blockSensitivity());
        assertEquals(1, c.c1());
        checkWitnesses(c);
    }
}
