package spanwright.bounds;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import spanwright.model.Promise;

class GeneralAdversaryTest {
    /** Feasibility tolerance of the certificate checks (the solver stops at 1e-9). */
    static final double FEASIBLE = 1e-7;

    static double[] eigenvalues(double[][] a) {
        int n = a.length;
        DMatrixRMaj m = new DMatrixRMaj(a);
        EigenDecomposition_F64<DMatrixRMaj> e = DecompositionFactory_DDRM.eig(n, false, true);
        assertTrue(e.decompose(m));
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            v[i] = e.getEigenvalue(i).real;
        }
        return v;
    }

    static double minEigenvalue(double[][] a) {
        double min = Double.POSITIVE_INFINITY;
        for (double v : eigenvalues(a)) {
            min = Math.min(min, v);
        }
        return min;
    }

    static double spectralNorm(double[][] a) {
        double max = 0;
        for (double v : eigenvalues(a)) {
            max = Math.max(max, Math.abs(v));
        }
        return max;
    }

    /**
     * Checks a witness of the minimisation (dual) form on the full D×D matrices, independently of
     * the solver's block decomposition: every X_i PSD (EJML eigenvalues), Σ_{i: x_i≠y_i} X_i[x,y] = 1
     * on every pair with f(x) ≠ f(y); returns max_x Σ_i X_i[x,x] (an upper bound on ADV±).
     */
    static double checkDualFeasible(TargetFunction f, double[][][] x) {
        return checkDualFeasible(f, x, false);
    }

    /**
     * As {@link #checkDualFeasible(TargetFunction, double[][][])}; with {@code atLeast} the pair
     * condition is Σ ≥ 1, the witness form of the positive-weight adversary ADV (dual of Γ ≥ 0).
     */
    static double checkDualFeasible(TargetFunction f, double[][][] x, boolean atLeast) {
        int n = f.variableCount();
        double scale = 1;
        for (int i = 0; i < n; i++) {
            assertTrue(minEigenvalue(x[i]) >= -FEASIBLE * scale, "X_" + i + " is not PSD");
        }
        for (int a = 0; a < f.size(); a++) {
            for (int b = 0; b < f.size(); b++) {
                if (f.value(a) == f.value(b)) {
                    continue;
                }
                long diff = f.input(a) ^ f.input(b);
                double s = 0;
                for (int i = 0; i < n; i++) {
                    if ((diff & f.variableMask(i)) != 0) {
                        s += x[i][a][b];
                    }
                }
                if (atLeast) {
                    assertTrue(s >= 1 - FEASIBLE, "pair inequality at " + f.format(f.input(a)) + ", " + f.format(f.input(b)));
                } else {
                    assertEquals(1, s, FEASIBLE, "pair equation at " + f.format(f.input(a)) + ", " + f.format(f.input(b)));
                }
            }
        }
        double max = 0;
        for (int a = 0; a < f.size(); a++) {
            double d = 0;
            for (int i = 0; i < n; i++) {
                d += x[i][a][a];
            }
            max = Math.max(max, d);
        }
        return max;
    }

    /**
     * Checks the certified result: the primal (Γ, α) is feasible — α ≥ 0, Σα = 1, Γ symmetric and
     * zero where f agrees, diag(α) − Γ∘Δ_i ⪰ 0 for every i — with ⟨Γ, J⟩ = lower; the dual X_i is
     * feasible with max diagonal sum = upper; lower ≤ upper (weak duality); and the spectral form
     * ‖G‖ / max_i ‖G∘Δ_i‖ of G = D_α^{-1/2} Γ D_α^{-1/2} (Høyer, Lee & Špalek, STOC 2007) is at
     * least lower.
     */
    static void checkCertificates(GeneralAdversary g) {
        checkCertificates(g, false);
    }

    /**
     * As {@link #checkCertificates(GeneralAdversary)}; with {@code positiveWeights} (the SDP of
     * {@link GeneralAdversary#positiveWeights}) Γ must also be entrywise ≥ 0 and the witness meets
     * the pair inequalities Σ ≥ 1 (Barnum, Saks &amp; Szegedy, CCC 2003: ADV is the same SDP with
     * Γ ≥ 0).
     */
    static void checkCertificates(GeneralAdversary g, boolean positiveWeights) {
        TargetFunction f = g.function();
        int n = f.variableCount();
        int size = f.size();
        double[][] gamma = g.adversaryMatrix();
        double sumAlpha = 0;
        double objective = 0;
        for (int a = 0; a < size; a++) {
            assertTrue(g.inputWeight(a) >= 0);
            sumAlpha += g.inputWeight(a);
            for (int b = 0; b < size; b++) {
                assertEquals(gamma[a][b], gamma[b][a], 0);
                if (f.value(a) == f.value(b)) {
                    assertEquals(0, gamma[a][b], 0);
                }
                objective += gamma[a][b];
                if (positiveWeights) {
                    assertTrue(gamma[a][b] >= 0, "Γ has a negative entry");
                }
            }
        }
        if (g.status() == GeneralAdversary.Status.CONSTANT) {
            assertEquals(0, g.lower(), 0);
            assertEquals(0, g.upper(), 0);
            return;
        }
        assertEquals(1, sumAlpha, 1e-9);
        assertEquals(g.lower(), objective, 1e-9 * Math.max(1, g.lower()));
        for (int i = 0; i < n; i++) {
            double[][] z = new double[size][size];
            for (int a = 0; a < size; a++) {
                z[a][a] = g.inputWeight(a);
                for (int b = 0; b < size; b++) {
                    if (((f.input(a) ^ f.input(b)) & f.variableMask(i)) != 0) {
                        z[a][b] -= gamma[a][b];
                    }
                }
            }
            assertTrue(minEigenvalue(z) >= -FEASIBLE / size, "diag(α) − Γ∘Δ_" + i + " is not PSD");
        }
        double[][][] x = new double[n][][];
        for (int i = 0; i < n; i++) {
            x[i] = g.witnessMatrix(i);
        }
        double dualValue = checkDualFeasible(f, x, positiveWeights);
        assertEquals(g.upper(), dualValue, 1e-9 * Math.max(1, dualValue));
        assertTrue(g.lower() <= g.upper() + 1e-9, "weak duality");
        // spectral form on the support of α
        double[][] gs = new double[size][size];
        for (int a = 0; a < size; a++) {
            for (int b = 0; b < size; b++) {
                double d = Math.sqrt(g.inputWeight(a) * g.inputWeight(b));
                gs[a][b] = d > 1e-14 ? gamma[a][b] / d : 0;
            }
        }
        double worst = 0;
        for (int i = 0; i < n; i++) {
            double[][] gi = new double[size][size];
            for (int a = 0; a < size; a++) {
                for (int b = 0; b < size; b++) {
                    if (((f.input(a) ^ f.input(b)) & f.variableMask(i)) != 0) {
                        gi[a][b] = gs[a][b];
                    }
                }
            }
            worst = Math.max(worst, spectralNorm(gi));
        }
        assertTrue(spectralNorm(gs) / worst >= g.lower() * (1 - 1e-6), "spectral form below the SDP value");
    }

    static void assertValue(double expected, GeneralAdversary g) {
        checkCertificates(g);
        assertTrue(g.lower() <= expected * (1 + 1e-8) && expected <= g.upper() * (1 + 1e-8),
                "[" + g.lower() + ", " + g.upper() + "] misses " + expected);
        assertTrue(g.gap() <= 1e-6 * Math.max(1, expected), "interval too wide: " + g.gap());
        assertEquals(GeneralAdversary.Status.CONVERGED, g.status());
    }

    @Test
    void orAndAndAreSquareRootOfN() {
        // ADV(OR_n) = √n (Ambainis' adversary; Barnum, Saks & Szegedy, CCC 2003) and ADV± ≥ ADV
        // (Høyer, Lee & Špalek, STOC 2007, arXiv:quant-ph/0611054); ADV± ≤ √n derived: n parallel
        // edges decide OR with W₊ = 1, W₋ = n, and every such graph has √(W₊W₋) ≥ ADV± (Reichardt,
        // SODA 2011). AND_n is OR_n with inputs and output negated, which leaves the SDP unchanged.
        for (int n = 1; n <= 6; n++) {
            assertValue(Math.sqrt(n), GeneralAdversary.compute(Functions.or(n)));
            assertValue(Math.sqrt(n), GeneralAdversary.compute(Functions.and(n)));
        }
    }

    @Test
    void parityIsN() {
        // derived, both sides. Lower: Γ = 1 on pairs at Hamming distance 1 has ‖Γ‖ = n (the cube's
        // degree) and ‖Γ∘Δ_i‖ = 1 (a perfect matching). Upper: the explicit witness below.
        for (int n = 1; n <= 5; n++) {
            assertValue(n, GeneralAdversary.compute(Functions.parity(n)));
        }
    }

    @Test
    void explicitParityWitnessIsFeasible() {
        // derived: v_{x,i} = (−1)^{x_1 ⊕ … ⊕ x_{i−1}} (one dimension), X_i = v_i v_iᵀ. For a pair
        // differing in the odd set {i_1 < … < i_k} the prefix parities of x and y differ by
        // (j − 1) mod 2 at i_j, so Σ_j X_{i_j}[x,y] = 1 − 1 + 1 − … = 1; every diagonal sum is n.
        // This exercises the feasibility checker on a witness the solver did not produce.
        int n = 4;
        TargetFunction f = Functions.parity(n);
        double[][][] x = new double[n][f.size()][f.size()];
        for (int i = 0; i < n; i++) {
            for (int a = 0; a < f.size(); a++) {
                for (int b = 0; b < f.size(); b++) {
                    x[i][a][b] = prefixSign(f, f.input(a), i) * prefixSign(f, f.input(b), i);
                }
            }
        }
        assertEquals(n, checkDualFeasible(f, x), 1e-12);
    }

    private static int prefixSign(TargetFunction f, long x, int i) {
        int parity = 0;
        for (int j = 0; j < i; j++) {
            parity ^= f.bit(x, j) ? 1 : 0;
        }
        return parity == 0 ? 1 : -1;
    }

    @Test
    void threeBitFunctionsMatchThePublishedTable() {
        // B. W. Reichardt & R. Špalek, "Quantum query complexity of up to four-bit functions", the
        // table accompanying "Span-program-based quantum algorithm for evaluating formulas"
        // (arXiv:0710.2630; Theory of Computing 8, 2012); one adversary value per function of at
        // most three bits, where ADV = ADV±.
        String[] functions = {"x1 & x2", "x1 & x2 & x3", "x1 | (x2 & x3)", "x1 ^ x2", "(x3 & x2) | (!x3 & x1)",
            "maj(x1, x2, x3)", "(x1 & x2 & x3) | (!x1 & !x2 & !x3)", "(x1 & x2 & x3) | (!x2 & !x3)",
            "x1 | (x2 ^ x3)", "x1 ^ (x2 | x3)", "exactly(2, x1, x2, x3)", "x1 ^ x2 ^ x3"};
        double[] published = {Math.sqrt(2), Math.sqrt(3), Math.sqrt(3), 2, 2, 2, 3 / Math.sqrt(2),
            Math.sqrt(3 + Math.sqrt(3)), Math.sqrt(5), 1 + Math.sqrt(2), Math.sqrt(7), 3};
        for (int k = 0; k < functions.length; k++) {
            assertValue(published[k], GeneralAdversary.compute(Functions.of(3, functions[k])));
        }
    }

    @Test
    void majorityOfThreeIsTwo() {
        // ADV± ≤ 2: Reichardt & Špalek (Theory of Computing 8, 2012) give a span program of witness
        // size 2 for MAJ3; ADV± ≥ ADV = 2 (derived in PositiveAdversaryTest)
        assertValue(2, GeneralAdversary.compute(Functions.of(3, "maj(x1, x2, x3)")));
    }

    @Test
    void ambainisFunctionBeatsThePositiveAdversary() {
        // from memory: Høyer, Lee & Špalek (STOC 2007) report ADV = 2.5 and ADV± ≈ 2.5135 for
        // Ambainis' 4-bit function (1 on the sorted strings: our sortedness function); the first
        // digits are what is checked here, the rest is our computation
        GeneralAdversary g = GeneralAdversary.compute(Functions.sortedness());
        checkCertificates(g);
        assertEquals(2.5135, g.lower(), 5e-5);
        assertTrue(g.lower() > 2.5 + 1e-3, "ADV± should exceed ADV = 2.5");
    }

    @Test
    void compositionOfAndAndOr() {
        // ADV±(f∘g) = ADV±(f)·ADV±(g) for Boolean f, g (Høyer, Lee & Špalek, STOC 2007, ≥;
        // Reichardt, SODA 2011, =): AND_2∘OR_2 = √2·√2 = 2
        assertValue(2, GeneralAdversary.compute(Functions.of(4, "(x1 | x2) & (x3 | x4)")));
    }

    @Tag("slow")
    @Test
    void compositionOfOrAndAnd() {
        // the same theorem: OR_3∘AND_2 = √3·√2 = √6 (m = 1,063 constraints, a few seconds)
        assertValue(Math.sqrt(6), GeneralAdversary.compute(Functions.of(6, "(x1 & x2) | (x3 & x4) | (x5 & x6)")));
    }

    @Test
    void promiseFunctions() {
        // derived: OR_3 restricted to Hamming weight ≤ 1 is "find the marked item"; its adversary
        // matrix (0…0 against each weight-1 input) gives √3, and the 3 parallel edges still decide it
        // with √(W₊W₋) = √3, so ADV± = √3 on this promise too
        TargetFunction f = Functions.of(3, "any(x1, x2, x3)", Promise.weights(new int[] {0, 1}));
        assertValue(Math.sqrt(3), GeneralAdversary.compute(f));
    }

    @Test
    void constantFunctionHasNoPairs() {
        // common practice, no source: nothing to distinguish, ADV± = 0
        GeneralAdversary g = GeneralAdversary.compute(Functions.of(3, "x1 | !x1"));
        assertEquals(GeneralAdversary.Status.CONSTANT, g.status());
        checkCertificates(g);
    }

    @Test
    void seededRandomFunctionsGiveCertifiedTightIntervals() {
        for (int seed = 1; seed <= 12; seed++) {
            int n = 2 + seed % 4;
            GeneralAdversary g = GeneralAdversary.compute(Functions.random(n, seed, seed % 3 == 0));
            checkCertificates(g);
            // primal ≤ dual within tolerance, and the interval is narrow
            assertTrue(g.gap() >= -1e-9);
            assertTrue(g.gap() <= 1e-6 * Math.max(1, g.upper()), "gap " + g.gap());
        }
    }

    @Tag("slow")
    @Test
    void interiorPointTakesOverAtSevenVariables() {
        // a seeded random 7-variable function on a random 70 % of the cube: m between the two
        // interior-point limits and no symmetry, so the interior-point method runs at once. Checks:
        // both certificates on the full matrices (EJML), the width, and an independent solver —
        // the splitting method forced on the same SDP — whose certified interval must overlap
        TargetFunction f = Functions.random(7, 3, true);
        GeneralAdversary g = GeneralAdversary.compute(f);
        assertTrue(g.constraintCount() > GeneralAdversary.INTERIOR_POINT_MAX_CONSTRAINTS
                && g.constraintCount() <= GeneralAdversary.INTERIOR_POINT_FALLBACK_CONSTRAINTS, "m = " + g.constraintCount());
        assertEquals(GeneralAdversary.Method.INTERIOR_POINT, g.method());
        assertEquals(GeneralAdversary.Status.CONVERGED, g.status());
        checkCertificates(g);
        assertTrue(g.gap() <= 1e-6 * g.upper(), "width " + g.gap());
        GeneralAdversary s = GeneralAdversary.compute(f, GeneralAdversary.Method.SPLITTING);
        assertTrue(s.lower() <= g.upper() * (1 + 1e-12) && g.lower() <= s.upper() * (1 + 1e-12),
                "[" + g.lower() + ", " + g.upper() + "] and [" + s.lower() + ", " + s.upper() + "] must overlap");
    }

    @Tag("slow")
    @Test
    void interiorPointOverConstraintOrbitsAtSevenVariables() {
        // x1 ⊕ (x2∧x3) ⊕ (x4∨x5) ⊕ (x6∧¬x7): an XOR of functions on disjoint variables with ADV±
        // 1, √2, √2, √2, so ADV± = 1 + 3√2 (composition of the general adversary, Lee, Mittal,
        // Reichardt, Špalek & Szegedy, FOCS 2011, with the weighted parity's value Σ of the
        // weights — from memory). f has symmetries (x2↔x3, x4↔x5 and their compositions),
        // so the Schur system is solved over constraint orbits, far smaller than m
        TargetFunction f = Functions.of(7, "x1 ^ (x2 & x3) ^ (x4 | x5) ^ (x6 & !x7)");
        GeneralAdversary g = GeneralAdversary.compute(f);
        assertEquals(GeneralAdversary.Method.INTERIOR_POINT, g.method());
        assertTrue(g.schurOrder() > 0 && g.schurOrder() < g.constraintCount() / 4,
                "Schur order " + g.schurOrder() + " of m = " + g.constraintCount());
        checkCertificates(g);
        double expected = 1 + 3 * Math.sqrt(2);
        assertTrue(g.lower() <= expected * (1 + 1e-9) && expected <= g.upper() * (1 + 1e-9),
                "[" + g.lower() + ", " + g.upper() + "] misses " + expected);
        assertTrue(g.gap() <= 1e-6 * g.upper(), "width " + g.gap());
        assertEquals(GeneralAdversary.Status.CONVERGED, g.status());
    }

    @Test
    void splittingMethodAgreesWithInteriorPoint() {
        // independent computation: the splitting method (a different algorithm on the same SDP)
        // must return an interval overlapping the interior-point one; both are certified
        for (int seed = 1; seed <= 4; seed++) {
            TargetFunction f = Functions.random(4, 100 + seed, false);
            GeneralAdversary ip = GeneralAdversary.compute(f, GeneralAdversary.Method.INTERIOR_POINT);
            GeneralAdversary sp = GeneralAdversary.compute(f, GeneralAdversary.Method.SPLITTING);
            checkCertificates(sp);
            assertEquals(GeneralAdversary.Method.SPLITTING, sp.method());
            assertTrue(sp.lower() <= ip.upper() * (1 + 1e-9) && ip.lower() <= sp.upper() * (1 + 1e-9),
                    "[" + sp.lower() + ", " + sp.upper() + "] vs [" + ip.lower() + ", " + ip.upper() + "]");
            assertTrue(sp.gap() <= GeneralAdversary.SPLITTING_RELATIVE_GAP * sp.upper() * 1.0001
                    || sp.status() == GeneralAdversary.Status.CONVERGED);
        }
    }
}
