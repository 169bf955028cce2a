package spanwright.electric;

import java.util.Arrays;
import spanwright.model.Edge;
import spanwright.model.Scenario;

/**
 * Witness sizes of one st-connectivity instance on one input, as electrical quantities.
 * Convention: the weight w_e of an edge is a resistance; a present edge is a resistor of
 * resistance w_e and an absent edge a capacitor of capacitance 1/w_e.
 *
 * <ul>
 *   <li>s and t connected in G(x): the witness size is the effective resistance
 *       R_st(G(x)) = min over unit s→t flows θ of Σ w_e θ_e² (Thomson's principle);
 *       Belovs &amp; Reichardt, "Span programs and quantum algorithms for st-connectivity and claw
 *       detection", ESA 2012, arXiv:1203.2603.</li>
 *   <li>Not connected: the effective capacitance C_st = min over potentials p with p(s)=1, p(t)=0,
 *       constant across every present edge, of Σ_absent (p_u − p_v)²/w_e; equivalently the
 *       effective conductance between s's and t's components in the graph of absent edges after
 *       contracting each component of G(x). Jarret, Jeffery, Kimmel &amp; Piedrafita, "Quantum
 *       algorithms for connectivity and related problems", ESA 2018, arXiv:1804.10591.</li>
 * </ul>
 *
 * <p>Method: union–find for the components of G(x), then a dense Cholesky factorisation of the
 * grounded Laplacian of the relevant (possibly contracted) network with the source node ordered
 * last, so that the last pivot is the Schur complement onto the source: the effective conductance
 * between source and ground. No solve is needed for the value; O(m³/6) flops for m network nodes,
 * O(|E| α(|V|)) for the components. The factorisation is written here (not taken from EJML)
 * because the dimension changes from input to input and the hot loop must not allocate; the tests
 * check it against EJML's pseudo-inverse.
 *
 * <p><b>Mutable and single-threaded</b>: an instance owns its work arrays (sized once for the
 * graph) and reuses them on every call. Use one instance per thread.
 */
public final class ElectricalNetwork {
    private final int vertexCount;
    private final int s;
    private final int t;
    private final int edgeCount;
    private final int[] eu;
    private final int[] ev;
    private final double[] conductance;
    private final double[] resistance;

    // work arrays, reused
    private final int[] parent;
    private final int[] parent2;
    private final int[] local;
    private final double[] matrix;
    private final double[] rhs;

    /** A network on {@code scenario}'s graph and weights; self-loops are ignored. */
    public ElectricalNetwork(Scenario scenario) {
        this(scenario.vertexCount(), scenario.s(), scenario.t(), endpoints(scenario, true),
                endpoints(scenario, false), weights(scenario));
    }

    /**
     * A network on vertices 0..vertexCount−1 with edges (u[i], v[i]) of resistance weight[i] > 0.
     */
    public ElectricalNetwork(int vertexCount, int s, int t, int[] u, int[] v, double[] weight) {
        if (s == t || s < 0 || t < 0 || s >= vertexCount || t >= vertexCount) {
            throw new IllegalArgumentException("s and t must be distinct vertices");
        }
        this.vertexCount = vertexCount;
        this.s = s;
        this.t = t;
        this.edgeCount = u.length;
        this.eu = u.clone();
        this.ev = v.clone();
        this.resistance = weight.clone();
        this.conductance = new double[edgeCount];
        for (int i = 0; i < edgeCount; i++) {
            if (!(weight[i] > 0) || Double.isInfinite(weight[i])) {
                throw new IllegalArgumentException("edge " + i + ": weight must be finite and > 0");
            }
            conductance[i] = 1.0 / weight[i];
        }
        parent = new int[vertexCount];
        parent2 = new int[vertexCount];
        local = new int[vertexCount];
        matrix = new double[vertexCount * vertexCount];
        rhs = new double[vertexCount];
    }

    private static int[] endpoints(Scenario sc, boolean first) {
        int[] r = new int[sc.edges().size()];
        for (int i = 0; i < r.length; i++) {
            Edge e = sc.edges().get(i);
            r[i] = first ? e.u() : e.v();
        }
        return r;
    }

    private static double[] weights(Scenario sc) {
        double[] r = new double[sc.edges().size()];
        for (int i = 0; i < r.length; i++) {
            r[i] = sc.edges().get(i).weight();
        }
        return r;
    }

    public int vertexCount() {
        return vertexCount;
    }

    public int edgeCount() {
        return edgeCount;
    }

    // ------------------------------------------------------------- union-find

    private static int find(int[] p, int x) {
        while (p[x] != x) {
            p[x] = p[p[x]];
            x = p[x];
        }
        return x;
    }

    private static void union(int[] p, int a, int b) {
        int ra = find(p, a);
        int rb = find(p, b);
        if (ra != rb) {
            p[ra] = rb;
        }
    }

    /** Fills {@link #parent} with the components of G(present). */
    private void components(boolean[] present) {
        for (int i = 0; i < vertexCount; i++) {
            parent[i] = i;
        }
        for (int e = 0; e < edgeCount; e++) {
            if (present[e]) {
                union(parent, eu[e], ev[e]);
            }
        }
    }

    /** Are s and t connected in G(present)? O(|E| α). */
    public boolean connected(boolean[] present) {
        components(present);
        return find(parent, s) == find(parent, t);
    }

    /**
     * The witness size on the input whose present edges are {@code present}: the effective
     * resistance if s and t are connected in G(x), otherwise the effective capacitance. Use
     * {@link #connected} (or the sign convention of {@link #evaluate}) to tell which.
     */
    public double witnessSize(boolean[] present) {
        double v = evaluate(present);
        return v < 0 ? -v - 1 : v;
    }

    /**
     * Evaluates one input in one pass: returns R ≥ 0 when s and t are connected, and −(1 + C)
     * when they are not (so the sign tells which side, with no second call). Allocation-free.
     */
    public double evaluate(boolean[] present) {
        components(present);
        int rs = find(parent, s);
        int rt = find(parent, t);
        if (rs == rt) {
            // positive: Laplacian of s's component, present edges only
            for (int i = 0; i < vertexCount; i++) {
                local[i] = -1;
            }
            int m = 0;
            for (int i = 0; i < vertexCount; i++) {
                if (i != s && i != t && find(parent, i) == rs) {
                    local[i] = m++;
                }
            }
            local[s] = m++;
            clear(m);
            for (int e = 0; e < edgeCount; e++) {
                if (present[e]) {
                    int a = local[eu[e]];
                    int b = local[ev[e]];
                    if (eu[e] == ev[e] || (a < 0 && b < 0 && eu[e] != t && ev[e] != t)) {
                        continue;
                    }
                    stamp(a, b, conductance[e], m);
                }
            }
            return 1.0 / lastPivot(m);
        }
        // negative: contract components; network of absent edges between different components.
        for (int i = 0; i < vertexCount; i++) {
            parent2[i] = i;
        }
        for (int e = 0; e < edgeCount; e++) {
            if (!present[e]) {
                int a = find(parent, eu[e]);
                int b = find(parent, ev[e]);
                if (a != b) {
                    union(parent2, a, b);
                }
            }
        }
        int cs = find(parent2, rs);
        if (cs != find(parent2, rt)) {
            return -1.0; // C = 0: no absent edge path joins s's side to t's side
        }
        for (int i = 0; i < vertexCount; i++) {
            local[i] = -1;
        }
        int m = 0;
        for (int i = 0; i < vertexCount; i++) {
            // nodes of the contracted network: component roots in the class-component of s
            if (parent[i] == i && i != rs && i != rt && find(parent2, i) == cs) {
                local[i] = m++;
            }
        }
        local[rs] = m++;
        clear(m);
        for (int e = 0; e < edgeCount; e++) {
            if (!present[e]) {
                int ca = find(parent, eu[e]);
                int cb = find(parent, ev[e]);
                if (ca == cb) {
                    continue;
                }
                int a = ca == rt ? -1 : local[ca];
                int b = cb == rt ? -1 : local[cb];
                stamp(a, b, conductance[e], m);
            }
        }
        return -1.0 - lastPivot(m);
    }

    private void clear(int m) {
        Arrays.fill(matrix, 0, m * m, 0.0);
    }

    /** Adds conductance g between local nodes a and b (−1 = ground) to the lower triangle. */
    private void stamp(int a, int b, double g, int m) {
        if (a >= 0) {
            matrix[a * m + a] += g;
        }
        if (b >= 0) {
            matrix[b * m + b] += g;
        }
        if (a >= 0 && b >= 0) {
            if (a > b) {
                matrix[a * m + b] -= g;
            } else {
                matrix[b * m + a] -= g;
            }
        }
    }

    /**
     * In-place Cholesky (lower triangle, row-major, stride m) of the grounded Laplacian; returns
     * the last pivot d = L[m−1][m−1]², the Schur complement onto the last node.
     */
    private double lastPivot(int m) {
        double[] a = matrix;
        for (int j = 0; j < m; j++) {
            int rj = j * m;
            double d = a[rj + j];
            for (int k = 0; k < j; k++) {
                double l = a[rj + k];
                d -= l * l;
            }
            if (j == m - 1) {
                return d;
            }
            double ljj = Math.sqrt(d);
            a[rj + j] = ljj;
            double inv = 1.0 / ljj;
            for (int i = j + 1; i < m; i++) {
                int ri = i * m;
                double sum = a[ri + j];
                for (int k = 0; k < j; k++) {
                    sum -= a[ri + k] * a[rj + k];
                }
                a[ri + j] = sum * inv;
            }
        }
        return Double.NaN; // m == 0 cannot happen: the source node is always present
    }

    // ------------------------------------------------------------- witnesses

    /**
     * The full witness of one input: for a positive input the unit s→t electrical current on every
     * present edge (oriented u→v) and vertex potentials with φ(t) = 0 and φ(s) = R (vertices
     * outside s's component have NaN potential); for a negative input the optimal potential with
     * p = 1 on s's side and 0 on t's side, constant on components of G(x), and the energy
     * (p_u − p_v)²/w_e on every absent edge. Allocates the returned record; O(|V|³).
     */
    public Witness witness(boolean[] present) {
        components(present);
        int rs = find(parent, s);
        int rt = find(parent, t);
        double[] pot = new double[vertexCount];
        double[] current = new double[edgeCount];
        double[] energy = new double[edgeCount];
        if (rs == rt) {
            // Solve L φ = e_s on s's component with φ(t) = 0.
            int[] loc = new int[vertexCount];
            Arrays.fill(loc, -1);
            int m = 0;
            for (int i = 0; i < vertexCount; i++) {
                if (i != t && find(parent, i) == rs) {
                    loc[i] = m++;
                }
            }
            double[] lap = new double[m * m];
            for (int e = 0; e < edgeCount; e++) {
                if (present[e] && eu[e] != ev[e] && find(parent, eu[e]) == rs) {
                    fullStamp(lap, loc[eu[e]], loc[ev[e]], conductance[e], m);
                }
            }
            double[] b = new double[m];
            b[loc[s]] = 1.0;
            double[] phi = solveSpd(lap, b, m);
            for (int i = 0; i < vertexCount; i++) {
                pot[i] = i == t ? 0.0 : (loc[i] >= 0 ? phi[loc[i]] : Double.NaN);
            }
            for (int e = 0; e < edgeCount; e++) {
                current[e] = present[e] && find(parent, eu[e]) == rs
                        ? (pot[eu[e]] - pot[ev[e]]) * conductance[e] : 0.0;
                energy[e] = 0.0;
            }
            return new Witness(true, pot[s], pot, current, energy);
        }
        int[] p2 = new int[vertexCount];
        for (int i = 0; i < vertexCount; i++) {
            p2[i] = i;
        }
        for (int e = 0; e < edgeCount; e++) {
            if (!present[e]) {
                int a = find(parent, eu[e]);
                int b = find(parent, ev[e]);
                if (a != b) {
                    union(p2, a, b);
                }
            }
        }
        int cs = find(p2, rs);
        double[] classPot = new double[vertexCount];
        if (cs != find(p2, rt)) {
            for (int i = 0; i < vertexCount; i++) {
                classPot[i] = find(p2, i) == cs ? 1.0 : 0.0;
            }
        } else {
            int[] loc = new int[vertexCount];
            Arrays.fill(loc, -1);
            int m = 0;
            for (int i = 0; i < vertexCount; i++) {
                if (parent[i] == i && i != rt && find(p2, i) == cs) {
                    loc[i] = m++;
                }
            }
            double[] lap = new double[m * m];
            for (int e = 0; e < edgeCount; e++) {
                if (!present[e]) {
                    int ca = find(parent, eu[e]);
                    int cb = find(parent, ev[e]);
                    if (ca != cb && find(p2, ca) == cs) {
                        fullStamp(lap, loc[ca], loc[cb], conductance[e], m);
                    }
                }
            }
            double[] b = new double[m];
            b[loc[rs]] = 1.0;
            double[] phi = solveSpd(lap, b, m);
            double scale = phi[loc[rs]];
            for (int i = 0; i < vertexCount; i++) {
                // classes outside the s–t part of the absent-edge network carry no energy: p = 0
                classPot[i] = loc[i] >= 0 ? phi[loc[i]] / scale : 0.0;
            }
        }
        for (int i = 0; i < vertexCount; i++) {
            pot[i] = classPot[find(parent, i)];
        }
        double total = 0;
        for (int e = 0; e < edgeCount; e++) {
            current[e] = 0.0;
            if (!present[e]) {
                double d = pot[eu[e]] - pot[ev[e]];
                energy[e] = d * d * conductance[e];
                total += energy[e];
            }
        }
        return new Witness(false, total, pot, current, energy);
    }

    private static void fullStamp(double[] a, int i, int j, double g, int m) {
        if (i >= 0) {
            a[i * m + i] += g;
        }
        if (j >= 0) {
            a[j * m + j] += g;
        }
        if (i >= 0 && j >= 0) {
            a[i * m + j] -= g;
            a[j * m + i] -= g;
        }
    }

    /** Solves A x = b for symmetric positive definite A (row-major m×m) by Cholesky. */
    private static double[] solveSpd(double[] a, double[] b, int m) {
        double[] l = new double[m * m];
        for (int j = 0; j < m; j++) {
            double d = a[j * m + j];
            for (int k = 0; k < j; k++) {
                d -= l[j * m + k] * l[j * m + k];
            }
            double ljj = Math.sqrt(d);
            l[j * m + j] = ljj;
            for (int i = j + 1; i < m; i++) {
                double sum = a[i * m + j];
                for (int k = 0; k < j; k++) {
                    sum -= l[i * m + k] * l[j * m + k];
                }
                l[i * m + j] = sum / ljj;
            }
        }
        double[] y = new double[m];
        for (int i = 0; i < m; i++) {
            double sum = b[i];
            for (int k = 0; k < i; k++) {
                sum -= l[i * m + k] * y[k];
            }
            y[i] = sum / l[i * m + i];
        }
        double[] x = new double[m];
        for (int i = m - 1; i >= 0; i--) {
            double sum = y[i];
            for (int k = i + 1; k < m; k++) {
                sum -= l[k * m + i] * x[k];
            }
            x[i] = sum / l[i * m + i];
        }
        return x;
    }

    /** Resistance of edge {@code e}. */
    public double weight(int e) {
        return resistance[e];
    }
}
