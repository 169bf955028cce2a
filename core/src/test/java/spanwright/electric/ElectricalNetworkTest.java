package spanwright.electric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Random;
import java.util.Set;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.jgrapht.Graph;
import org.jgrapht.alg.connectivity.ConnectivityInspector;
import org.jgrapht.graph.DefaultEdge;
import org.jgrapht.graph.Pseudograph;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import spanwright.model.Edge;
import spanwright.model.Scenario;

class ElectricalNetworkTest {
    private static final double EPS = 1e-12;

    // ------------------------------------------------------------ handbook values

    @Test
    void cubeOfUnitResistors() {
        // Doyle & Snell, "Random Walks and Electric Networks" (1984), the unit cube: opposite
        // corners 5/6, face diagonal 3/4, adjacent corners 7/12.
        int[][] e = Nets.cube();
        assertEquals(5.0 / 6, Nets.always(8, 0, 7, e, null).witnessSize(Nets.all(12)), EPS);
        assertEquals(3.0 / 4, Nets.always(8, 0, 3, e, null).witnessSize(Nets.all(12)), EPS);
        assertEquals(7.0 / 12, Nets.always(8, 0, 1, e, null).witnessSize(Nets.all(12)), EPS);
    }

    @ParameterizedTest
    @ValueSource(ints = {2, 3, 4, 5, 8, 13})
    void completeGraph(int n) {
        // Handbook value (Doyle & Snell 1984): between two vertices of K_n with unit resistors, 2/n.
        int[][] e = Nets.complete(n);
        assertEquals(2.0 / n, Nets.always(n, 0, n - 1, e, null).witnessSize(Nets.all(e.length)), EPS);
    }

    @ParameterizedTest
    @ValueSource(ints = {3, 4, 7, 10})
    void cycleAtDistanceK(int n) {
        // Two arcs of k and n−k unit resistors in parallel: k(n−k)/n (series and parallel laws).
        int[][] e = Nets.cycle(n);
        for (int k = 1; k < n; k++) {
            double r = Nets.always(n, 0, k, e, null).witnessSize(Nets.all(n));
            assertEquals(k * (n - k) / (double) n, r, EPS, "cycle " + n + " distance " + k);
        }
    }

    // ------------------------------------------------------------ laws

    @Test
    void fosterTheorem() {
        // Foster (1949): for a connected graph, sum over edges of R_eff(u_e, v_e) / w_e = |V| − 1.
        Random rnd = new Random(11);
        for (int trial = 0; trial < 20; trial++) {
            int n = 3 + rnd.nextInt(12);
            Scenario sc = Nets.randomScenario(rnd, 4, n, n - 1 + rnd.nextInt(2 * n));
            List<Edge> edges = sc.edges();
            double sum = 0;
            for (Edge e : edges) {
                ElectricalNetwork net = network(sc, e.u(), e.v());
                sum += net.witnessSize(Nets.all(edges.size())) / e.weight();
            }
            assertEquals(n - 1, sum, 1e-9, "trial " + trial);
        }
    }

    private static ElectricalNetwork network(Scenario sc, int s, int t) {
        int m = sc.edges().size();
        int[] u = new int[m];
        int[] v = new int[m];
        double[] w = new double[m];
        for (int i = 0; i < m; i++) {
            u[i] = sc.edges().get(i).u();
            v[i] = sc.edges().get(i).v();
            w[i] = sc.edges().get(i).weight();
        }
        return new ElectricalNetwork(sc.vertexCount(), s, t, u, v, w);
    }

    @Test
    void positiveWitnessObeysKirchhoffOhmAndThomson() {
        // Kirchhoff's current law and Ohm's law on the returned current; Thomson's principle:
        // its energy equals R, and adding any circulation (a cycle flow) raises the energy.
        Random rnd = new Random(5);
        int checked = 0;
        for (int trial = 0; trial < 40; trial++) {
            Scenario sc = Nets.randomScenario(rnd, 6, 10, 24);
            ElectricalNetwork net = new ElectricalNetwork(sc);
            for (long x = 0; x < 64; x += 1 + rnd.nextInt(6)) {
                boolean[] p = Nets.present(sc, x);
                Witness w = net.witness(p);
                if (!w.connected) {
                    continue;
                }
                checked++;
                assertEquals(net.witnessSize(p), w.value, 1e-10 * w.value);
                double[] net_out = new double[sc.vertexCount()];
                double energy = 0;
                for (int e = 0; e < sc.edges().size(); e++) {
                    Edge ed = sc.edges().get(e);
                    double i = w.current[e];
                    if (!p[e]) {
                        assertEquals(0.0, i, 0.0, "no current on an absent edge");
                        continue;
                    }
                    net_out[ed.u()] += i;
                    net_out[ed.v()] -= i;
                    energy += ed.weight() * i * i;
                    assertEquals(ed.weight() * i * i, w.energy[e], 1e-12 * Math.max(1, w.value), "edge energy w i^2");
                    if (!Double.isNaN(w.potential[ed.u()])) {
                        // Ohm: potential drop = resistance × current
                        assertEquals(w.potential[ed.u()] - w.potential[ed.v()], ed.weight() * i, 1e-10);
                    }
                }
                for (int v = 0; v < sc.vertexCount(); v++) {
                    double expect = v == sc.s() ? 1.0 : (v == sc.t() ? -1.0 : 0.0);
                    assertEquals(expect, net_out[v], 1e-10, "KCL at vertex " + v);
                }
                assertEquals(w.value, energy, 1e-10 * w.value, "Thomson: energy of the current = R");
                assertEquals(w.value, w.potential[sc.s()] - w.potential[sc.t()], 1e-10 * w.value);
                // Thomson: any other unit flow = current + circulation has at least that energy.
                double[] other = w.current.clone();
                int[] cyc = findCycle(sc, p);
                if (cyc != null) {
                    double delta = 0.1 + rnd.nextDouble();
                    for (int k = 0; k < cyc.length; k += 2) {
                        other[cyc[k]] += cyc[k + 1] * delta;
                    }
                    double e2 = 0;
                    for (int e = 0; e < other.length; e++) {
                        if (p[e]) {
                            e2 += sc.edges().get(e).weight() * other[e] * other[e];
                        }
                    }
                    assertTrue(e2 > energy, "Thomson: a perturbed flow has more energy");
                }
            }
        }
        assertTrue(checked > 50, "enough positive inputs checked: " + checked);
    }

    /**
     * A cycle of present edges as (edge, orientation ±1) pairs, found from a non-tree edge of a
     * spanning forest, or null.
     */
    private static int[] findCycle(Scenario sc, boolean[] p) {
        int n = sc.vertexCount();
        int[] parentEdge = new int[n];
        int[] parentVertex = new int[n];
        int[] depth = new int[n];
        java.util.Arrays.fill(depth, -1);
        java.util.List<Integer> tree = new java.util.ArrayList<>();
        for (int root = 0; root < n; root++) {
            if (depth[root] >= 0) {
                continue;
            }
            depth[root] = 0;
            parentEdge[root] = -1;
            java.util.ArrayDeque<Integer> q = new java.util.ArrayDeque<>();
            q.add(root);
            while (!q.isEmpty()) {
                int a = q.poll();
                for (int e = 0; e < p.length; e++) {
                    Edge ed = sc.edges().get(e);
                    if (!p[e] || (ed.u() != a && ed.v() != a) || ed.u() == ed.v()) {
                        continue;
                    }
                    int b = ed.u() == a ? ed.v() : ed.u();
                    if (depth[b] < 0) {
                        depth[b] = depth[a] + 1;
                        parentEdge[b] = e;
                        parentVertex[b] = a;
                        tree.add(e);
                        q.add(b);
                    }
                }
            }
        }
        for (int e = 0; e < p.length; e++) {
            Edge ed = sc.edges().get(e);
            if (!p[e] || tree.contains(e) || ed.u() == ed.v()) {
                continue;
            }
            // cycle: u -> v along e, then v back to u through the tree
            java.util.List<Integer> out = new java.util.ArrayList<>();
            out.add(e);
            out.add(1);
            int a = ed.v();
            int b = ed.u();
            java.util.List<Integer> tail = new java.util.ArrayList<>();
            while (a != b) {
                if (depth[a] >= depth[b]) {
                    int pe = parentEdge[a];
                    // walking from a to its parent: orientation +1 if edge is (a -> parent) as (u,v)
                    out.add(pe);
                    out.add(sc.edges().get(pe).u() == a ? 1 : -1);
                    a = parentVertex[a];
                } else {
                    int pe = parentEdge[b];
                    // walking from parent to b (reverse order later)
                    tail.add(0, sc.edges().get(pe).u() == b ? -1 : 1);
                    tail.add(0, pe);
                    b = parentVertex[b];
                }
            }
            out.addAll(tail);
            int[] r = new int[out.size()];
            for (int i = 0; i < r.length; i++) {
                r[i] = out.get(i);
            }
            return r;
        }
        return null;
    }

    @Test
    void negativeWitnessIsAnOptimalAdmissiblePotential() {
        // Definition of effective capacitance (Jarret, Jeffery, Kimmel & Piedrafita 2018,
        // arXiv:1804.10591): p(s)=1, p(t)=0, p constant across present edges, energy
        // sum_absent (p_u-p_v)^2 / w = C. Optimality (Dirichlet principle): perturbing p on one
        // free component raises the energy; at the optimum the net "charge flow" into every
        // free component vanishes.
        Random rnd = new Random(9);
        int checked = 0;
        for (int trial = 0; trial < 40; trial++) {
            Scenario sc = Nets.randomScenario(rnd, 6, 10, 22);
            ElectricalNetwork net = new ElectricalNetwork(sc);
            for (long x = 0; x < 64; x++) {
                boolean[] p = Nets.present(sc, x);
                Witness w = net.witness(p);
                if (w.connected) {
                    continue;
                }
                checked++;
                assertEquals(1.0, w.potential[sc.s()], 0.0);
                assertEquals(0.0, w.potential[sc.t()], 0.0);
                double energy = 0;
                for (int e = 0; e < p.length; e++) {
                    Edge ed = sc.edges().get(e);
                    double d = w.potential[ed.u()] - w.potential[ed.v()];
                    if (p[e]) {
                        assertEquals(0.0, d, 1e-12, "potential constant across a present edge");
                    } else {
                        energy += d * d / ed.weight();
                        assertEquals(d * d / ed.weight(), w.energy[e], 1e-12);
                    }
                }
                assertEquals(net.witnessSize(p), w.value, 1e-10 * Math.max(1, w.value));
                assertEquals(w.value, energy, 1e-10 * Math.max(1, energy));
                // stationarity on each free component (not containing s or t)
                ElectricalNetwork comp = net;
                int[] label = componentLabels(sc, p);
                for (int c = 0; c < sc.vertexCount(); c++) {
                    if (label[c] != c || label[sc.s()] == c || label[sc.t()] == c) {
                        continue;
                    }
                    double flow = 0;
                    for (int e = 0; e < p.length; e++) {
                        Edge ed = sc.edges().get(e);
                        if (p[e]) {
                            continue;
                        }
                        boolean inU = label[ed.u()] == c;
                        boolean inV = label[ed.v()] == c;
                        if (inU != inV) {
                            int other = inU ? ed.v() : ed.u();
                            flow += (w.potential[other] - w.potential[inU ? ed.u() : ed.v()]) / ed.weight();
                        }
                    }
                    assertEquals(0.0, flow, 1e-9, "stationary on component " + c);
                }
                assertTrue(comp != null);
            }
        }
        assertTrue(checked > 100, "enough negative inputs checked: " + checked);
    }

    private static int[] componentLabels(Scenario sc, boolean[] p) {
        int n = sc.vertexCount();
        int[] parent = new int[n];
        for (int i = 0; i < n; i++) {
            parent[i] = i;
        }
        for (int e = 0; e < p.length; e++) {
            if (p[e]) {
                int a = root(parent, sc.edges().get(e).u());
                int b = root(parent, sc.edges().get(e).v());
                parent[Math.max(a, b)] = Math.min(a, b);
            }
        }
        int[] label = new int[n];
        for (int i = 0; i < n; i++) {
            label[i] = root(parent, i);
        }
        return label;
    }

    private static int root(int[] parent, int x) {
        while (parent[x] != x) {
            x = parent[x];
        }
        return x;
    }

    @Test
    void rayleighMonotonicity() {
        // Rayleigh's monotonicity law: removing a present edge never lowers R (if s, t stay
        // connected); making an absent edge present (contracting it) never lowers C (if s, t stay
        // apart) — C is a minimum over a smaller set of potentials. Raising a weight raises R and
        // lowers C.
        Random rnd = new Random(21);
        for (int trial = 0; trial < 30; trial++) {
            Scenario sc = Nets.randomScenario(rnd, 5, 9, 20);
            ElectricalNetwork net = new ElectricalNetwork(sc);
            for (long x = 0; x < 32; x++) {
                boolean[] p = Nets.present(sc, x);
                double base = net.evaluate(p);
                for (int e = 0; e < p.length; e++) {
                    boolean[] q = p.clone();
                    q[e] = !q[e];
                    double other = net.evaluate(q);
                    if (base >= 0 && other >= 0 && !p[e]) {
                        assertTrue(other <= base + 1e-12, "adding a resistor does not raise R");
                    }
                    if (base >= 0 && other >= 0 && p[e]) {
                        assertTrue(other >= base - 1e-12, "removing a resistor does not lower R");
                    }
                    if (base < 0 && other < 0) {
                        double c0 = ElectricalNetwork.value(base);
                        double c1 = ElectricalNetwork.value(other);
                        if (!p[e]) {
                            assertTrue(c1 >= c0 - 1e-12, "contracting an absent edge does not lower C");
                        } else {
                            assertTrue(c1 <= c0 + 1e-12, "un-contracting a present edge does not raise C");
                        }
                    }
                }
                // weight scaling: all weights × λ gives R × λ and C / λ
                double lambda = 2.5;
                double[] w = new double[sc.edges().size()];
                for (int e = 0; e < w.length; e++) {
                    w[e] = sc.edges().get(e).weight() * lambda;
                }
                ElectricalNetwork scaled = new ElectricalNetwork(sc.withWeights(w));
                double v0 = net.witnessSize(p);
                double v1 = scaled.witnessSize(p);
                if (base >= 0) {
                    assertEquals(v0 * lambda, v1, 1e-10 * v1, "R scales with the weights");
                } else {
                    assertEquals(v0 / lambda, v1, 1e-10 * Math.max(1, v0), "C scales with 1/weights");
                }
            }
        }
    }

    // ------------------------------------------------------------ independent computation

    @Test
    void agreesWithEjmlPseudoInverse() {
        // Independent computation: R_eff(a, b) = (e_a − e_b)^T L^+ (e_a − e_b) with L^+ the
        // Moore–Penrose pseudo-inverse of the Laplacian (EJML's pinv). For negative inputs the
        // components of G(x) come from JGraphT's ConnectivityInspector, the contracted Laplacian of
        // the absent edges is pseudo-inverted, and C = 1 / R_eff between s's and t's components.
        Random rnd = new Random(2024);
        int compared = 0;
        for (int trial = 0; trial < 25; trial++) {
            Scenario sc = Nets.randomScenario(rnd, 8, 4 + rnd.nextInt(14), 10 + rnd.nextInt(30));
            ElectricalNetwork net = new ElectricalNetwork(sc);
            for (int rep = 0; rep < 12; rep++) {
                long x = rnd.nextInt(256);
                boolean[] p = Nets.present(sc, x);
                double fast = net.evaluate(p);
                double reference = reference(sc, p);
                if (fast >= 0) {
                    assertTrue(reference >= 0, "both positive");
                    assertEquals(reference, fast, 1e-9 * reference, "R trial " + trial);
                } else {
                    double c = ElectricalNetwork.value(fast);
                    double cref = ElectricalNetwork.value(reference);
                    assertTrue(reference < 0, "both negative");
                    assertEquals(cref, c, 1e-9 * Math.max(cref, 1e-300), "C trial " + trial);
                }
                compared++;
            }
        }
        assertEquals(300, compared);
    }

    /** Reference value in {@link ElectricalNetwork#evaluate}'s sign convention, via JGraphT + EJML. */
    static double reference(Scenario sc, boolean[] p) {
        int n = sc.vertexCount();
        Graph<Integer, DefaultEdge> g = new Pseudograph<>(null, DefaultEdge::new, false);
        for (int i = 0; i < n; i++) {
            g.addVertex(i);
        }
        for (int e = 0; e < p.length; e++) {
            if (p[e]) {
                g.addEdge(sc.edges().get(e).u(), sc.edges().get(e).v());
            }
        }
        ConnectivityInspector<Integer, DefaultEdge> ci = new ConnectivityInspector<>(g);
        List<Set<Integer>> comps = ci.connectedSets();
        int[] cls = new int[n];
        for (int c = 0; c < comps.size(); c++) {
            for (int v : comps.get(c)) {
                cls[v] = c;
            }
        }
        boolean positive = ci.pathExists(sc.s(), sc.t());
        int m = positive ? n : comps.size();
        DMatrixRMaj lap = new DMatrixRMaj(m, m);
        for (int e = 0; e < p.length; e++) {
            if (p[e] != positive) {
                continue;
            }
            Edge ed = sc.edges().get(e);
            int a = positive ? ed.u() : cls[ed.u()];
            int b = positive ? ed.v() : cls[ed.v()];
            if (a == b) {
                continue;
            }
            double gc = 1.0 / ed.weight();
            lap.add(a, a, gc);
            lap.add(b, b, gc);
            lap.add(a, b, -gc);
            lap.add(b, a, -gc);
        }
        int a = positive ? sc.s() : cls[sc.s()];
        int b = positive ? sc.t() : cls[sc.t()];
        if (!positive) {
            // s's and t's components joined by absent edges at all? (else C = 0)
            Graph<Integer, DefaultEdge> q = new Pseudograph<>(null, DefaultEdge::new, false);
            for (int i = 0; i < m; i++) {
                q.addVertex(i);
            }
            for (int e = 0; e < p.length; e++) {
                if (!p[e] && cls[sc.edges().get(e).u()] != cls[sc.edges().get(e).v()]) {
                    q.addEdge(cls[sc.edges().get(e).u()], cls[sc.edges().get(e).v()]);
                }
            }
            if (!new ConnectivityInspector<>(q).pathExists(a, b)) {
                return -Double.MIN_NORMAL; // C = 0 in evaluate's code
            }
        }
        DMatrixRMaj pinv = new DMatrixRMaj(m, m);
        CommonOps_DDRM.pinv(lap, pinv);
        double r = pinv.get(a, a) + pinv.get(b, b) - pinv.get(a, b) - pinv.get(b, a);
        return positive ? r : -(1.0 / r + Double.MIN_NORMAL);
    }

    @Test
    void disconnectedWholeGraphHasZeroCapacitance() {
        // Derived: if no edge at all joins s's side to t's side, the potential 1 on s's part and 0
        // elsewhere has zero energy, so C = 0.
        ElectricalNetwork net = Nets.always(4, 0, 3, new int[][] {{0, 1}, {2, 3}}, null);
        boolean[] none = {false, false};
        assertFalse(net.connected(none));
        assertFalse(ElectricalNetwork.isPositive(net.evaluate(none)), "coded as negative");
        assertEquals(0.0, ElectricalNetwork.value(net.evaluate(none)), 0.0);
        assertEquals(0.0, net.witness(none).value, 0.0);
    }

    @Test
    void componentWithNoPathToTCarriesNoCurrent() {
        // Derived: a dangling component attached to s only (or floating) carries no current;
        // s–t path of two unit resistors plus a pendant triangle on s: R = 2.
        int[][] e = {{0, 1}, {1, 4}, {0, 2}, {2, 3}, {3, 0}, {5, 6}};
        ElectricalNetwork net = Nets.always(7, 0, 4, e, null);
        Witness w = net.witness(Nets.all(e.length));
        assertEquals(2.0, w.value, EPS);
        assertEquals(0.0, w.current[2], EPS);
        assertEquals(0.0, w.current[5], EPS);
        assertTrue(Double.isNaN(w.potential[5]), "floating vertex has no potential");
    }

    // ------------------------------------------------------------ size: O(|V| + |E|), no |V|²

    @Test
    void manyIsolatedVerticesCostNoQuadraticMemory() {
        // Derived: 100,000 isolated vertices change nothing on the 4-cycle s–a–t–b (edges s–a,
        // a–t, s–b, b–t, unit weights). A dense |V|×|V| matrix would need 80 GB here (and its int
        // index overflows past 46,340 vertices); the network must only touch the s–t part.
        int n = 100_004;
        int[] u = {0, 1, 0, 2};
        int[] v = {1, 3, 2, 3};
        ElectricalNetwork net = new ElectricalNetwork(n, 0, 3, u, v, new double[] {1, 1, 1, 1});
        // derived: all present, two paths of 2 in parallel: R = 1
        assertEquals(1.0, net.witnessSize(new boolean[] {true, true, true, true}), EPS);
        // derived: s–a absent: the path s–b–t carries the current (a hangs off t): R = 2
        assertEquals(2.0, net.witnessSize(new boolean[] {false, true, true, true}), EPS);
        // derived: s–a and s–b absent: s alone, {a, t, b} one class; two unit capacitors in parallel, C = 2
        double code = net.evaluate(new boolean[] {false, true, false, true});
        assertFalse(ElectricalNetwork.isPositive(code));
        assertEquals(2.0, ElectricalNetwork.value(code), EPS);
        Witness w = net.witness(new boolean[] {false, true, false, true});
        assertEquals(n, w.potential.length);
        assertEquals(2.0, w.value, EPS);
    }

    @ParameterizedTest
    @ValueSource(ints = {257, 1_000, 60_000})
    void longSeriesChainsAreEliminatedInSparseForm(int length) {
        // Derived (series law): a chain s = 0 – 1 – … – length = t of weights 1 + (i mod 3):
        // all present, R = Σ w; all absent, the capacitors 1/w in series give C = 1/Σ w. Past
        // 46,340 vertices a dense index would overflow; a chain of 60,000 nodes must be O(length).
        int[] u = new int[length];
        int[] v = new int[length];
        double[] w = new double[length];
        double sum = 0;
        for (int i = 0; i < length; i++) {
            u[i] = i;
            v[i] = i + 1;
            w[i] = 1 + (i % 3);
            sum += w[i];
        }
        ElectricalNetwork net = new ElectricalNetwork(length + 1, 0, length, u, v, w);
        boolean[] all = Nets.all(length);
        assertEquals(sum, net.witnessSize(all), 1e-12 * sum);
        assertEquals(1.0 / sum, net.witnessSize(new boolean[length]), 1e-12 / sum);
        Witness wit = net.witness(all);
        // Kirchhoff: the unit current flows through every edge of the chain
        assertEquals(1.0, wit.current[length / 2], 1e-9);
        assertEquals(sum, wit.potential[0], 1e-9 * sum);
    }

    @Test
    void sparseAndDenseFormsAgreeOnGrids() {
        // Independent computation: the same 9×9 grid inputs eliminated densely (index order) and
        // sparsely (minimum-degree order) agree to 1e-13 relative; seeded random inputs.
        int k = 9;
        List<int[]> edges = new java.util.ArrayList<>();
        for (int r = 0; r < k; r++) {
            for (int c = 0; c < k; c++) {
                if (c + 1 < k) {
                    edges.add(new int[] {r * k + c, r * k + c + 1});
                }
                if (r + 1 < k) {
                    edges.add(new int[] {r * k + c, (r + 1) * k + c});
                }
            }
        }
        int[][] e = edges.toArray(new int[0][]);
        Random rnd = new Random(99);
        double[] w = new double[e.length];
        for (int i = 0; i < w.length; i++) {
            w[i] = Math.pow(10, -3 + 6 * rnd.nextDouble());
        }
        ElectricalNetwork dense = Nets.always(k * k, 0, k * k - 1, e, w);
        dense.forceForm(-1);
        ElectricalNetwork sparse = Nets.always(k * k, 0, k * k - 1, e, w);
        sparse.forceForm(1);
        for (int rep = 0; rep < 50; rep++) {
            boolean[] present = new boolean[e.length];
            for (int i = 0; i < present.length; i++) {
                present[i] = rnd.nextDouble() < 0.6;
            }
            double a = dense.evaluate(present);
            double b = sparse.evaluate(present);
            assertEquals(ElectricalNetwork.isPositive(a), ElectricalNetwork.isPositive(b));
            double va = ElectricalNetwork.value(a);
            assertEquals(va, ElectricalNetwork.value(b), 1e-13 * va, "input " + rep);
        }
    }
}
