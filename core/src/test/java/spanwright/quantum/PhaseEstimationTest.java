package spanwright.quantum;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.analysis.InputDetail;
import spanwright.model.Scenario;

class PhaseEstimationTest {

    @Test
    void phaseZeroIsAlwaysAccepted() {
        // F_M(0) = |(1/M) Σ 1|² = 1 (derived from the geometric sum); also at 2π (periodic).
        for (int b = 1; b <= 62; b++) {
            assertEquals(1.0, PhaseEstimation.fejer(0, b), 0.0);
            assertEquals(1.0, PhaseEstimation.fejer(2 * Math.PI, b), 1e-12);
        }
    }

    @Test
    void anExactBBitPhaseIsReturnedWithProbabilityOne() {
        // Common practice, no source: a phase 2πy/M is estimated exactly by b-bit phase estimation;
        // every other outcome has probability 0 (F_M vanishes at the nonzero grid points).
        for (int b = 1; b <= 8; b++) {
            int m = 1 << b;
            for (int y = 0; y < m; y++) {
                double theta = 2 * Math.PI * y / m;
                for (int z = 0; z < m; z++) {
                    assertEquals(z == y ? 1.0 : 0.0, PhaseEstimation.outcomeProbability(theta, b, z), 1e-12);
                }
            }
        }
    }

    @Test
    void outcomeProbabilitiesSumToOne() {
        // Identity (Parseval for the discrete Fourier transform): Σ_y F_M(θ − 2πy/M) = 1 for every θ.
        Random rnd = new Random(3);
        for (int trial = 0; trial < 200; trial++) {
            double theta = (rnd.nextDouble() * 2 - 1) * Math.PI;
            int b = 1 + rnd.nextInt(10);
            double s = 0;
            for (long y = 0; y < (1L << b); y++) {
                s += PhaseEstimation.outcomeProbability(theta, b, y);
            }
            assertEquals(1.0, s, 1e-12);
        }
        // and the small-angle branch joins the direct formula smoothly (derived Taylor expansion)
        for (int b = 1; b <= 16; b++) {
            double phi = 0.999 * 2e-4 / (1 << b); // just inside the Taylor branch (M φ/2 < 1e-4)
            double direct = Math.pow(Math.sin((1 << b) * phi / 2) / ((1 << b) * Math.sin(phi / 2)), 2);
            assertEquals(direct, PhaseEstimation.fejer(phi, b), 1e-14);
        }
    }

    @Test
    void bruteForceCircuitOnARotationReturnsItsPhase() {
        // Common practice, no source: the circuit on an eigenvector (1, −i)/√2 of the rotation by
        // 2πy/M returns y with probability 1 — a check of the brute-force simulator itself.
        for (int b = 1; b <= 4; b++) {
            int m = 1 << b;
            for (int y = 0; y < m; y++) {
                double t = 2 * Math.PI * y / m;
                DMatrixRMaj rot = new DMatrixRMaj(new double[][] {
                    {Math.cos(t), -Math.sin(t)}, {Math.sin(t), Math.cos(t)}});
                double h = 1 / Math.sqrt(2);
                double[] p = QuantumNets.circuit(rot, new double[] {h, 0}, new double[] {0, -h}, b);
                for (int z = 0; z < m; z++) {
                    assertEquals(z == y ? 1.0 : 0.0, p[z], 1e-12, "b " + b + " y " + y + " z " + z);
                }
            }
        }
    }

    @Test
    void closedFormAgreesWithABruteForceCircuitSimulation() {
        // Independent computation: a complex state-vector simulation of the whole phase-estimation
        // circuit on U(x) (QuantumNets.circuit) against the closed form from the spectrum. Outcome 0
        // is the acceptance; for y ≠ 0 the real eigenbasis gives each |θ| half its weight at +|θ| and
        // half at −|θ| (|0⟩ is real, so its weights on e^{iθ} and e^{−iθ} are equal; derived):
        //     P(y) = Σ_k w_k (F_M(|θ_k| − 2πy/M) + F_M(−|θ_k| − 2πy/M)) / 2.
        // Also the simpler brute force Σ_k U^k|0⟩ / M (QuantumNets.acceptanceByPowers).
        Random rnd = new Random(17);
        for (int trial = 0; trial < 3; trial++) {
            Scenario sc = QuantumNets.random(rnd, 3, 4 + trial, 6 + trial);
            SpanProgramUnitary u = new SpanProgramUnitary(sc, 0.7 + trial);
            SpectrumSolver solver = new SpectrumSolver(u);
            for (long x = 0; x < 8; x++) {
                InputDetail d = Analysis.detail(sc, x);
                InputSimulation r = solver.solve(x, d.present, true, d.witness.connected, d.witness.value, true);
                DMatrixRMaj ux = u.unitary(d.present);
                double[] re = new double[ux.numRows];
                re[0] = 1;
                for (int b = 1; b <= 5; b++) {
                    double[] p = QuantumNets.circuit(ux, re, new double[ux.numRows], b);
                    assertEquals(p[0], r.acceptance(b), 1e-10, "trial " + trial + " x " + x + " b " + b);
                    assertEquals(QuantumNets.acceptanceByPowers(ux, b), r.acceptance(b), 1e-10);
                    double[] ph = r.spectrumPhases();
                    double[] w = r.spectrumWeights();
                    for (int y = 0; y < (1 << b); y++) {
                        double q = 0;
                        for (int k = 0; k < ph.length; k++) {
                            q += w[k] * (PhaseEstimation.outcomeProbability(ph[k], b, y)
                                    + PhaseEstimation.outcomeProbability(-ph[k], b, y)) / 2;
                        }
                        assertEquals(p[y], q, 1e-10, "outcome " + y);
                    }
                }
            }
        }
    }
}
