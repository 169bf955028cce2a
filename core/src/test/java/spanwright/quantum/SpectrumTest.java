package spanwright.quantum;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.analysis.InputDetail;
import spanwright.model.Scenario;

/**
 * The spectrum of U(x) seen from |0⟩, against the theory of the span-program algorithm and
 * against independent computations.
 */
class SpectrumTest {

    private static InputSimulation solve(SpectrumSolver solver, Scenario sc, long x) {
        InputDetail d = Analysis.detail(sc, x);
        return solver.solve(x, d.present, true, d.witness.connected, d.witness.value, true);
    }

    /** A check of one simulated input, given α² and the analysis' witness size R(x) or C(x). */
    private interface InputCheck {
        void check(InputSimulation r, double alpha2, double witnessSize);
    }

    /**
     * Runs {@code check} on every positive (or every negative) input of {@code trials} seeded random
     * scenarios (5 variables, growing size), for α² = W₊ (1 when there is no positive input) and
     * each of {@code moreAlpha2}; returns how many inputs were checked.
     */
    private static int forEachInput(long seed, int trials, boolean positive, double[] moreAlpha2, InputCheck check) {
        Random rnd = new Random(seed);
        int checked = 0;
        for (int trial = 0; trial < trials; trial++) {
            Scenario sc = QuantumNets.random(rnd, 5, 5 + trial, 9 + 2 * trial);
            AnalysisResult a = Analysis.run(sc);
            double[] alphas = new double[moreAlpha2.length + 1];
            alphas[0] = a.positiveCount() > 0 ? a.maxResistance() : 1;
            System.arraycopy(moreAlpha2, 0, alphas, 1, moreAlpha2.length);
            for (double alpha2 : alphas) {
                SpectrumSolver solver = new SpectrumSolver(new SpanProgramUnitary(sc, alpha2));
                for (int i = 0; i < a.domainSize(); i++) {
                    if (a.connected(i) == positive) {
                        check.check(solve(solver, sc, a.input(i)), alpha2, a.value(i));
                        checked++;
                    }
                }
            }
        }
        return checked;
    }

    @Test
    void positiveInputsPutWeightAlphaSquaredOverAlphaSquaredPlusROnPhaseZero() {
        // Derived (cf. Ito & Jeffery, "Approximate span programs", Algorithmica 2019,
        // arXiv:1507.00432, and Belovs & Reichardt, ESA 2012, arXiv:1203.2603): let θ be the unit
        // s→t electrical flow on G(x) and w = Σ_e θ_e √w_e |e⟩. Then Ãw = Σ θ_e(|u⟩−|v⟩) = |s⟩−|t⟩
        // = Ã(α|0⟩), so v = α|0⟩ − w ∈ ker Ã ∩ H̃(x) and U(x)v = v. The 1-eigenspace's part that
        // |0⟩ ∈ H̃(x) can see is ker Ã ∩ H̃(x) = span{v} ⊕ {circulations on G(x)}, and circulations are
        // orthogonal to both |0⟩ and w (Thomson: the electrical flow is orthogonal to cycles in the
        // w-weighted inner product). Hence the weight is ⟨0|v⟩²/‖v‖² = α²/(α² + ‖w‖²) = α²/(α² + R(x)).
        // R(x) comes from the analysis (star–mesh elimination), an independent code path.
        int checked = forEachInput(2024, 6, true, new double[] {0.25, 7.5}, (r, alpha2, value) -> {
            double expected = alpha2 / (alpha2 + value);
            assertEquals(expected, r.phaseZeroWeight, 1e-9, "x " + r.input + " alpha2 " + alpha2);
        });
        assertTrue(checked > 100, "checked " + checked);
    }

    @Test
    void phaseZeroVectorIsTheElectricalFlowCertificate() {
        // Derived (see the test above): P₀|0⟩ = (⟨0|v⟩/‖v‖²) v = (α/(α²+R)) (α|0⟩ − Σ θ_e√w_e|e⟩).
        // Checked against the analysis' currents (Analysis.detail), and as a certificate: its |0⟩
        // coordinate is the weight, it vanishes on absent edges, lies in ker Ã and is fixed by U(x).
        Random rnd = new Random(99);
        for (int trial = 0; trial < 4; trial++) {
            Scenario sc = QuantumNets.random(rnd, 4, 6 + trial, 11 + trial);
            double alpha2 = 1.5 + trial;
            SpanProgramUnitary u = new SpanProgramUnitary(sc, alpha2);
            SpectrumSolver solver = new SpectrumSolver(u);
            DMatrixRMaj a = u.targetMap();
            for (long x = 0; x < 16; x++) {
                InputDetail d = Analysis.detail(sc, x);
                InputSimulation r = solve(solver, sc, x);
                double[] z = r.phaseZeroVector();
                assertEquals(r.phaseZeroWeight, z[0], 1e-12);
                DMatrixRMaj az = QuantumNets.multiply(a, z);
                for (int i = 0; i < az.numRows; i++) {
                    assertEquals(0, az.get(i, 0), 1e-10);
                }
                DMatrixRMaj uz = QuantumNets.multiply(u.unitary(d.present), z);
                for (int i = 0; i < z.length; i++) {
                    assertEquals(z[i], uz.get(i, 0), 1e-10);
                }
                double alpha = Math.sqrt(alpha2);
                for (int j = 0; j < u.edgeCount(); j++) {
                    int e = u.edgeIndex(j);
                    if (!d.present[e]) {
                        assertEquals(0, z[j + 1], 1e-12, "absent edge");
                    } else if (d.witness.connected) {
                        double expected = -alpha / (alpha2 + d.witness.value) * d.witness.current[e]
                                * Math.sqrt(sc.edges().get(e).weight());
                        assertEquals(expected, z[j + 1], 1e-9, "trial " + trial + " x " + x + " edge " + e);
                    }
                }
                if (!d.witness.connected) {
                    assertEquals(0, r.phaseZeroWeight, 1e-20);
                }
            }
        }
    }

    @Test
    void negativeInputsObeyTheEffectiveSpectralGapLemma() {
        // Lee, Mittal, Reichardt, Špalek & Szegedy, "Quantum query complexity of state conversion",
        // FOCS 2011, arXiv:1011.3020, the effective spectral gap lemma (Lemma 4.2 there; number from
        // memory): for projections Π, Δ, U = (2Π−1)(2Δ−1) and P_Θ the projection on eigenphases
        // |θ| ≤ Θ, if Δ|w⟩ = 0 then ‖P_Θ Π|w⟩‖ ≤ (Θ/2)‖w‖.
        // Applied (derived) to Uᵀ = U⁻¹ = (2Π_H̃ − 1)(2Π_K − 1), whose P_Θ is U's (conjugate phases),
        // with w = α Ãᵀp for the optimal negative potential p (p(s)=1, p(t)=0, constant on present
        // edges): Π_K w = 0 since w is in the row space, and w = |0⟩ + α Σ_absent (p_u−p_v)/√w_e |e⟩,
        // so Π_H̃ w = |0⟩ and ‖w‖² = 1 + α²C(x). The inequality tested, on every negative input and
        // every Θ (each phase of |0⟩'s measure and a grid), is
        //     weight of |0⟩ on {|θ| ≤ Θ}  ≤  (Θ²/4)(1 + α² C(x)).
        int checked = forEachInput(31337, 8, false, new double[] {0.1, 10}, (r, alpha2, value) -> {
            double scale = 1 + alpha2 * value;
            for (double theta : r.measurePhases()) {
                double bound = theta * theta / 4 * scale;
                assertTrue(r.weightWithin(theta) <= bound + 1e-12,
                        "x " + r.input + " theta " + theta + ": " + r.weightWithin(theta) + " > " + bound);
            }
            for (double theta = 0.01; theta <= Math.PI; theta += 0.01) {
                assertTrue(r.weightWithin(theta) <= theta * theta / 4 * scale + 1e-12);
            }
            assertTrue(Simulation.lemmaRatio(r, alpha2) <= 1 + 1e-9);
        });
        assertTrue(checked > 100, "checked " + checked);
    }

    @Test
    void orNetworkClosedForms() {
        // Derived. OR_n: n parallel unit s–t edges. Row space of Ã is spanned by r = (1/α, 1, …, 1),
        // so 2Π_K − I = I − 2r̂r̂ᵀ. In the plane of |0⟩ and u = Σ|e⟩/√n, r̂ = (cos φ, sin φ) with
        // tan φ = α√n.
        // Negative input 0…0: D = diag(1, −1, …, −1) is the reflection about |0⟩'s line; the product
        // of the reflections about lines at angles 0 and φ + π/2 is the rotation by 2φ + π, so |0⟩
        // has weight 1 on |θ| = π − 2φ = 2 arctan(1/(α√n)); all other eigenvectors are orthogonal
        // to |0⟩.
        // Positive input (one edge present): weight α²/(α² + 1) on phase 0 (R = 1).
        for (int n : new int[] {1, 2, 3, 5, 8, 13}) {
            Scenario sc = QuantumNets.or(n, null);
            for (double alpha2 : new double[] {1, 0.5, 4}) {
                SpectrumSolver solver = new SpectrumSolver(new SpanProgramUnitary(sc, alpha2));
                InputSimulation neg = solve(solver, sc, 0);
                double theta = 2 * Math.atan(1 / Math.sqrt(alpha2 * n));
                double[] p = neg.measurePhases();
                double[] w = neg.measureWeights();
                double at = 0;
                for (int k = 0; k < p.length; k++) {
                    if (Math.abs(p[k] - theta) < 1e-9) {
                        at += w[k];
                    }
                }
                assertEquals(1, at, 1e-12, "n " + n + " alpha2 " + alpha2);
                assertEquals(theta, neg.weightedPhaseGap, 1e-12);
                for (int b = 1; b <= PhaseEstimation.MAX_BITS; b++) {
                    assertEquals(PhaseEstimation.fejer(theta, b), neg.acceptance(b), 1e-12);
                }
                InputSimulation pos = solve(solver, sc, 1L << (n - 1));
                assertEquals(alpha2 / (alpha2 + 1), pos.phaseZeroWeight, 1e-12);
            }
        }
    }

    @Test
    void andNetworkClosedForms() {
        // Derived. AND_n: a path of n unit edges. Ã has rank n (connected, n+1 vertices), so
        // ker Ã = span{k}, k = (α, −1, …, −1)/√(α²+n) (the unit flow), and 2Π_K − I = 2kkᵀ − I.
        // Positive input 1…1: weight ⟨0|k⟩² = α²/(α²+n) = α²/(α²+R) on phase 0.
        // Negative input with edge j absent (C = 1): D = I − 2e_je_jᵀ. On span{k, e_j} the two
        // reflections' mirror lines (k and the direction p ⊥ e_j) meet at angle β with
        // sin β = |⟨k, e_j⟩| = 1/√(α²+n), so U rotates by 2β: weight of |0⟩ on that plane is
        // ⟨0|p⟩² = α²/(α²+n−1) at |θ| = 2 arcsin(1/√(α²+n)); on the orthogonal complement both
        // reflections act as −1 and +1, so U = −1 there: the rest (n−1)/(α²+n−1) sits at θ = π.
        for (int n : new int[] {1, 2, 4, 7}) {
            Scenario sc = QuantumNets.and(n);
            for (double alpha2 : new double[] {n, 1, 0.3}) {
                SpectrumSolver solver = new SpectrumSolver(new SpanProgramUnitary(sc, alpha2));
                long all = (1L << n) - 1;
                assertEquals(alpha2 / (alpha2 + n), solve(solver, sc, all).phaseZeroWeight, 1e-12);
                for (int j = 0; j < n; j++) {
                    long x = all & ~(1L << (n - 1 - j));
                    InputSimulation neg = solve(solver, sc, x);
                    double theta = 2 * Math.asin(1 / Math.sqrt(alpha2 + n));
                    double onBlock = 0;
                    double atPi = 0;
                    double[] p = neg.measurePhases();
                    double[] w = neg.measureWeights();
                    for (int k = 0; k < p.length; k++) {
                        if (Math.abs(p[k] - theta) < 1e-9) {
                            onBlock += w[k];
                        } else if (Math.abs(p[k] - Math.PI) < 1e-13) {
                            // exact π to rounding: the phase comes from |cos(θ/2)| there
                            atPi += w[k];
                        }
                    }
                    assertEquals(alpha2 / (alpha2 + n - 1), onBlock, 1e-12, "n " + n + " j " + j);
                    assertEquals((n - 1) / (alpha2 + n - 1), atPi, 1e-9);
                }
            }
        }
    }

    @Test
    void pairsOfOppositePhasesCarryEqualWeights() {
        // Derived (orNetworkClosedForms): on OR_n's negative input 0…0 all of |0⟩'s weight sits on
        // the pair e^{±iθ}, θ = 2 arctan(1/(α√n)); |0⟩ is real, so the complex eigenvectors of
        // e^{iθ} and e^{−iθ} are conjugate and carry equal weight: 1/2 each. Also the AND path's
        // θ = π eigenvalues (andNetworkClosedForms) come out as π to rounding.
        for (int n : new int[] {2, 3, 5}) {
            Scenario sc = QuantumNets.or(n, null);
            SpectrumSolver solver = new SpectrumSolver(new SpanProgramUnitary(sc, 1));
            InputSimulation neg = solve(solver, sc, 0);
            double theta = 2 * Math.atan(1 / Math.sqrt(n));
            double[] p = neg.spectrumPhases();
            double[] w = neg.spectrumWeights();
            int found = 0;
            for (int k = 0; k < p.length; k++) {
                if (Math.abs(p[k] - theta) < 1e-9) {
                    assertEquals(0.5, w[k], 1e-12, "n " + n);
                    found++;
                }
            }
            assertEquals(2, found, "two entries, one per eigenvalue of the pair");
        }
        Scenario and = QuantumNets.and(4);
        SpectrumSolver solver = new SpectrumSolver(new SpanProgramUnitary(and, 1));
        double[] p = solve(solver, and, 0b0111).spectrumPhases();
        assertEquals(Math.PI, p[p.length - 1], 1e-14);
    }

    @Test
    void aPhaseGapOfExactlyPiIsReportedAsPi() {
        // Derived: one s–t edge of weight 1, α = 1, edge present. Ã = (|s⟩ − |t⟩)(⟨0| + ⟨e|), so
        // ker Ã = span{(|0⟩ − |e⟩)/√2} and D(x) = I: U = 2Π_K − I has eigenvalue +1 on ker Ã and −1 on
        // (|0⟩ + |e⟩)/√2. |0⟩ has weight 1/2 on each (= α²/(α² + R) with R = 1 at phase 0), and the
        // only non-zero phase, hence the phase gap, is exactly π.
        Scenario sc = QuantumNets.or(1, null);
        SpectrumSolver solver = new SpectrumSolver(new SpanProgramUnitary(sc, 1));
        InputSimulation r = solve(solver, sc, 1);
        assertEquals(Math.PI, r.phaseGap, 1e-15);
        assertEquals(Math.PI, r.weightedPhaseGap, 1e-15);
        assertEquals(0.5, r.phaseZeroWeight, 1e-15);
        double[] p = r.spectrumPhases();
        double[] w = r.spectrumWeights();
        assertEquals(2, p.length);
        assertEquals(0, p[0], 1e-15);
        assertEquals(Math.PI, p[1], 1e-15);
        assertEquals(0.5, w[1], 1e-15);
    }

    @Test
    void weightsSumToOneAndPhasesMatchEjmlsGeneralEigenvalues() {
        // Parseval: |0⟩ is a unit vector and the eigenbasis is orthonormal, so the weights sum to 1
        // (identity). Independent computation: EJML's nonsymmetric eigenvalue algorithm on U(x)
        // itself; the multiset {|arg λ|} must equal our phases (each eigenvalue once).
        Random rnd = new Random(5);
        for (int trial = 0; trial < 5; trial++) {
            Scenario sc = QuantumNets.random(rnd, 3, 5 + trial, 7 + 2 * trial);
            SpanProgramUnitary u = new SpanProgramUnitary(sc, 1.3);
            SpectrumSolver solver = new SpectrumSolver(u);
            for (long x = 0; x < 8; x++) {
                InputSimulation r = solve(solver, sc, x);
                double sum = 0;
                for (double w : r.spectrumWeights()) {
                    sum += w;
                }
                assertEquals(1, sum, 1e-12);
                DMatrixRMaj ux = u.unitary(Analysis.presentEdges(sc, x));
                EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(ux.numRows, false);
                assertTrue(eig.decompose(ux.copy()));
                double[] args = new double[ux.numRows];
                for (int k = 0; k < args.length; k++) {
                    args[k] = Math.abs(Math.atan2(eig.getEigenvalue(k).imaginary, eig.getEigenvalue(k).real));
                    assertEquals(1, eig.getEigenvalue(k).getMagnitude(), 1e-9, "|λ| = 1 for an orthogonal matrix");
                }
                Arrays.sort(args);
                double[] ours = r.spectrumPhases();
                for (int k = 0; k < args.length; k++) {
                    assertEquals(args[k], ours[k], 1e-6, "trial " + trial + " x " + x + " k " + k);
                }
            }
        }
    }
}
