package spanwright.quantum;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import spanwright.model.Condition;
import spanwright.model.Edge;
import spanwright.model.Promise;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;
import spanwright.model.Vertex;

/** Test helpers: gadget networks built in code, and brute-force simulations of the circuit. */
final class QuantumNets {
    private QuantumNets() {}

    private static List<String> names(int n) {
        List<String> v = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            v.add("x" + (i + 1));
        }
        return v;
    }

    /** OR_n: n parallel s–t edges, edge i present when x_i = 1, unit weights; optional promise. */
    static Scenario or(int n, Promise promise) {
        List<String> v = names(n);
        List<Vertex> vs = List.of(new Vertex("s"), new Vertex("t"));
        List<Edge> es = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            es.add(new Edge("e" + (i + 1), 0, 1, Condition.literal(i, v.get(i), true), 1.0));
        }
        return new Scenario("or", "", v, null, null, promise, vs, 0, 1, es, null);
    }

    /**
     * OR_n under the promise |x| ≤ 1, the n + 1 inputs listed explicitly (a listed promise allows up
     * to 63 variables; a Hamming-weight promise would enumerate the whole cube).
     */
    static Scenario orAtMostOne(int n) {
        long[] inputs = new long[n + 1];
        for (int i = 0; i < n; i++) {
            inputs[i + 1] = 1L << i;
        }
        return or(n, Promise.inputs(inputs));
    }

    /** AND_n: a path s = v0 – v1 – … – vn = t, edge i present when x_i = 1, unit weights. */
    static Scenario and(int n) {
        List<String> v = names(n);
        List<Vertex> vs = new ArrayList<>();
        for (int i = 0; i <= n; i++) {
            vs.add(new Vertex("v" + i));
        }
        List<Edge> es = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            es.add(new Edge("e" + (i + 1), i, i + 1, Condition.literal(i, v.get(i), true), 1.0));
        }
        return new Scenario("and", "", v, null, null, Promise.NONE, vs, 0, n, es, null);
    }

    /** Seeded random scenarios of both polarities (the shared generator). */
    static Scenario random(Random rnd, int vars, int vertices, int edges) {
        return RandomScenarios.generate(rnd, vars, vertices, edges, 0.1, 0.4, 0.5, 2.0);
    }

    static DMatrixRMaj multiply(DMatrixRMaj a, double[] x) {
        DMatrixRMaj y = new DMatrixRMaj(a.numRows, 1);
        for (int i = 0; i < a.numRows; i++) {
            double s = 0;
            for (int j = 0; j < a.numCols; j++) {
                s += a.get(i, j) * x[j];
            }
            y.set(i, 0, s);
        }
        return y;
    }

    /**
     * Brute force, no spectrum: after the controlled powers and the inverse QFT, the phase register
     * reads 0 with the state (1/M) Σ_{k&lt;M} U^k |0⟩ (derived: the inverse QFT's row 0 is uniform
     * 1/√M and the register held (1/√M) Σ_k |k⟩ U^k|0⟩), so the acceptance is its squared norm.
     * O(M (|E|+1)²) by repeated matrix–vector products.
     */
    static double acceptanceByPowers(DMatrixRMaj u, int bits) {
        int n = u.numRows;
        int m = 1 << bits;
        double[] v = new double[n];
        v[0] = 1;
        double[] sum = new double[n];
        double[] next = new double[n];
        for (int k = 0; k < m; k++) {
            for (int i = 0; i < n; i++) {
                sum[i] += v[i];
            }
            for (int i = 0; i < n; i++) {
                double s = 0;
                for (int j = 0; j < n; j++) {
                    s += u.get(i, j) * v[j];
                }
                next[i] = s;
            }
            double[] t = v;
            v = next;
            next = t;
        }
        double p = 0;
        for (int i = 0; i < n; i++) {
            p += sum[i] * sum[i];
        }
        return p / ((double) m * m);
    }

    /**
     * A brute-force state-vector simulation of the b-bit phase-estimation circuit, complex
     * amplitudes: Hadamard on each phase qubit, controlled-U^(2^j) from phase qubit j (U applied
     * 2^j times on the branch where the qubit is 1), the inverse QFT as the explicit matrix
     * (1/√M) e^{−2πi yk/M}; returns P(y) for every outcome y. Initial state: phase register 0,
     * state register {@code re + i·im}. Textbook circuit (Cleve, Ekert, Macchiavello &amp; Mosca 1998,
     * arXiv:quant-ph/9708016); O(M² n + b·2^b·M n²).
     */
    static double[] circuit(DMatrixRMaj u, double[] re, double[] im, int bits) {
        int n = u.numRows;
        int m = 1 << bits;
        double[][] ar = new double[m][n];
        double[][] ai = new double[m][n];
        ar[0] = re.clone();
        ai[0] = im.clone();
        // Hadamard on each phase qubit
        double h = 1 / Math.sqrt(2);
        for (int q = 0; q < bits; q++) {
            int bit = 1 << q;
            for (int k = 0; k < m; k++) {
                if ((k & bit) == 0) {
                    int k1 = k | bit;
                    for (int s = 0; s < n; s++) {
                        double r0 = ar[k][s];
                        double i0 = ai[k][s];
                        double r1 = ar[k1][s];
                        double i1 = ai[k1][s];
                        ar[k][s] = h * (r0 + r1);
                        ai[k][s] = h * (i0 + i1);
                        ar[k1][s] = h * (r0 - r1);
                        ai[k1][s] = h * (i0 - i1);
                    }
                }
            }
        }
        // controlled-U^(2^q) from phase qubit q
        for (int q = 0; q < bits; q++) {
            int bit = 1 << q;
            for (int k = 0; k < m; k++) {
                if ((k & bit) != 0) {
                    for (int rep = 0; rep < bit; rep++) {
                        ar[k] = apply(u, ar[k]);
                        ai[k] = apply(u, ai[k]); // U is real: acts on both parts alike
                    }
                }
            }
        }
        // inverse QFT, explicit matrix, then outcome probabilities
        double[] prob = new double[m];
        for (int y = 0; y < m; y++) {
            double[] sr = new double[n];
            double[] si = new double[n];
            for (int k = 0; k < m; k++) {
                double ang = -2 * Math.PI * ((long) y * k % m) / m;
                double c = Math.cos(ang) / Math.sqrt(m);
                double sn = Math.sin(ang) / Math.sqrt(m);
                for (int s = 0; s < n; s++) {
                    sr[s] += c * ar[k][s] - sn * ai[k][s];
                    si[s] += c * ai[k][s] + sn * ar[k][s];
                }
            }
            double p = 0;
            for (int s = 0; s < n; s++) {
                p += sr[s] * sr[s] + si[s] * si[s];
            }
            prob[y] = p;
        }
        return prob;
    }

    private static double[] apply(DMatrixRMaj u, double[] x) {
        int n = u.numRows;
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            double s = 0;
            for (int j = 0; j < n; j++) {
                s += u.get(i, j) * x[j];
            }
            y[i] = s;
        }
        return y;
    }
}
