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
 * <p>Method: union–find for the components of G(x), then Gaussian elimination of the grounded
 * Laplacian of the relevant (possibly contracted) network with the source node ordered last, so
 * that the last pivot is the Schur complement onto the source: the effective conductance between
 * source and ground. The elimination is done in conductance form (star–mesh transform, as in the
 * Grassmann–Taksar–Heyman algorithm for Markov chains), which adds only non-negative numbers and so
 * keeps full relative accuracy even when weights differ by many orders of magnitude. No solve is
 * needed for the value. Only the part that matters is eliminated: s's component of G(x) (positive
 * input) or the contracted classes joined to s's class by absent edges (negative input); its m nodes
 * get local indices, so vertices elsewhere (isolated ones, other components) cost O(1) each. Up to
 * {@link #DENSE_LIMIT} nodes (or up to {@link #DENSE_MAX} with many links per node) the local
 * network is a dense m × m matrix (O(m³/6) flops); otherwise it is kept as adjacency lists and
 * eliminated in minimum-degree order (the same star–mesh updates, so the same accuracy): memory
 * and time O(m + links + fill), which is O(|V| + |E|) for trees, series–parallel graphs and other
 * graphs of small tree-width, and never |V|². O(|E| α(|V|)) for the components. The elimination
 * is written here (not taken from EJML) because the dimension changes from input to input, the
 * hot loop must not allocate, and a general Cholesky loses relative accuracy through
 * cancellation on ill-conditioned networks; the tests check it against EJML's pseudo-inverse.
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

    // work arrays, reused: O(|V|) ones sized once, the local network's ones grown on demand
    private final int[] parent;
    private final int[] parent2;
    private final int[] local;
    private final double[] ground;
    private final double[] pivot;
    private final double[] column;
    /** Dense local matrix (m × m, lower triangle), grown to the largest m ≤ denseLimit seen. */
    private double[] matrix = new double[0];
    /** Testing hook: +1 always sparse form, −1 always dense, 0 the rule of {@link #DENSE_LIMIT}. */
    private int forced;
    /** Whether the network last built is held in sparse form. */
    private boolean sparse;
    /** Sparse form: node i's links are (adjNode[i][k], adjConductance[i][k]) for k &lt; degree[i]. */
    private int[][] adjNode = new int[0][];
    private double[][] adjConductance = new double[0][];
    private int[] degree = new int[0];
    /** Sparse form: elimination order, scatter map (−1 = absent), eliminated marks, min-degree heap. */
    private int[] order = new int[0];
    private int[] position = new int[0];
    private boolean[] eliminated = new boolean[0];
    private long[] heap = new long[16];

    /**
     * Local networks of at most this many nodes are eliminated as a dense m × m matrix (at most
     * 512 KiB; fastest for the small networks of enumeration, and as fast as the sparse form up to
     * here on random graphs of average degree 3, measured with bench); larger ones in sparse form with a minimum-degree order, so
     * memory is O(nodes + links + fill) instead of O(m²) and no index can overflow — unless they
     * have at least {@link #DENSE_DEGREE}·m links and at most {@link #DENSE_MAX} nodes: such
     * networks (random graphs of average degree ≥ 6, say) fill in almost completely, and the dense
     * loop is then several times faster for the same m²/2 numbers.
     */
    static final int DENSE_LIMIT = 256;
    /** See {@link #DENSE_LIMIT}: links per node from which a network is taken as dense. */
    static final int DENSE_DEGREE = 3;
    /** See {@link #DENSE_LIMIT}: most nodes of a dense matrix (2048² doubles = 32 MiB). */
    static final int DENSE_MAX = 2048;

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
            checkWeight(i, weight[i]);
            conductance[i] = 1.0 / weight[i];
        }
        parent = new int[vertexCount];
        parent2 = new int[vertexCount];
        local = new int[vertexCount];
        ground = new double[vertexCount];
        pivot = new double[vertexCount];
        column = new double[vertexCount];
    }

    /**
     * Precondition of every weight: finite, &gt; 0 and with a finite conductance 1/w (so no
     * subnormal). Accuracy (about 1e-13 relative on small networks) is stated for weights in
     * [{@link spanwright.model.Edge#MIN_WEIGHT}, {@link spanwright.model.Edge#MAX_WEIGHT}], the
     * range every scenario is held to.
     */
    private static void checkWeight(int i, double w) {
        if (!(w > 0) || Double.isInfinite(w) || Double.isInfinite(1.0 / w)) {
            throw new IllegalArgumentException("edge " + i + ": weight must be finite, > 0 and have a finite"
                    + " conductance 1/w, got " + w);
        }
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
        return value(evaluate(present));
    }

    /**
     * The offset of the negative code: a negative input is returned as −(C + OFFSET). OFFSET is
     * the smallest normal double, far below half an ulp of any capacitance a network with weights
     * in [{@link spanwright.model.Edge#MIN_WEIGHT}, {@link spanwright.model.Edge#MAX_WEIGHT}] can
     * have (C ≥ 1e-100/|V| when C ≠ 0), so C + OFFSET rounds to C and {@link #value} gives C back
     * bit for bit; C = 0 is coded −OFFSET, still strictly negative. (An earlier code, −(1 + C),
     * lost about 1e-16 absolute: 9e-5 relative at C = 1e-12 and all of C below 1e-16.)
     */
    private static final double OFFSET = Double.MIN_NORMAL;

    /**
     * Evaluates one input in one pass: returns R &gt; 0 when s and t are connected, and
     * −(C + {@link Double#MIN_NORMAL}) &lt; 0 when they are not (so the sign tells which side,
     * with no second call). Decode with {@link #isPositive} and {@link #value}, which return
     * exactly the R or C of the elimination. Allocation-free.
     */
    public double evaluate(boolean[] present) {
        int m = build(present);
        if (m < 0) {
            return -OFFSET; // C = 0: no absent edge path joins s's side to t's side
        }
        double g = eliminate(m);
        return positiveCase ? 1.0 / g : -(g + OFFSET);
    }

    /** Whether a code returned by {@link #evaluate} belongs to a positive input (s ~ t). */
    public static boolean isPositive(double code) {
        return code >= 0;
    }

    /** The witness size (R or C) of a code returned by {@link #evaluate}, exactly. */
    public static double value(double code) {
        return code >= 0 ? code : -code - OFFSET;
    }

    /** Set by {@link #build}: whether the last input built was positive. */
    private boolean positiveCase;
    /** Set by {@link #build}: root of s's and t's components of G(x). */
    private int rootS;
    private int rootT;

    /**
     * Builds the network whose effective conductance between the source node (local index m−1)
     * and ground is 1/R (positive input: present edges of s's component, t grounded) or C
     * (negative input: absent edges between components of G(x), t's component grounded).
     *
     * @return m, the number of non-ground nodes, or −1 when C = 0
     */
    private int build(boolean[] present) {
        components(present);
        int rs = find(parent, s);
        int rt = find(parent, t);
        rootS = rs;
        rootT = rt;
        positiveCase = rs == rt;
        for (int i = 0; i < vertexCount; i++) {
            local[i] = -1;
        }
        int m = 0;
        if (positiveCase) {
            for (int i = 0; i < vertexCount; i++) {
                if (i != s && i != t && find(parent, i) == rs) {
                    local[i] = m++;
                }
            }
            local[s] = m++;
            int links = 0;
            if (m > DENSE_LIMIT && m <= DENSE_MAX) {
                for (int e = 0; e < edgeCount; e++) {
                    if (present[e] && eu[e] != ev[e] && find(parent, eu[e]) == rs) {
                        links++;
                    }
                }
            }
            clear(m, links);
            for (int e = 0; e < edgeCount; e++) {
                if (present[e] && eu[e] != ev[e] && find(parent, eu[e]) == rs) {
                    stamp(local[eu[e]], local[ev[e]], conductance[e], m);
                }
            }
            return m;
        }
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
            return -1;
        }
        for (int i = 0; i < vertexCount; i++) {
            // nodes of the contracted network: component roots in the class-component of s
            if (parent[i] == i && i != rs && i != rt && find(parent2, i) == cs) {
                local[i] = m++;
            }
        }
        local[rs] = m++;
        int links = 0;
        if (m > DENSE_LIMIT && m <= DENSE_MAX) {
            for (int e = 0; e < edgeCount; e++) {
                if (!present[e]) {
                    int ca = find(parent, eu[e]);
                    int cb = find(parent, ev[e]);
                    if (ca != cb && (local[ca] >= 0 || local[cb] >= 0)) {
                        links++;
                    }
                }
            }
        }
        clear(m, links);
        for (int e = 0; e < edgeCount; e++) {
            if (!present[e]) {
                int ca = find(parent, eu[e]);
                int cb = find(parent, ev[e]);
                if (ca != cb) {
                    stamp(local[ca], local[cb], conductance[e], m);
                }
            }
        }
        return m;
    }

    private void clear(int m, int links) {
        Arrays.fill(ground, 0, m, 0.0);
        sparse = forced != 0 ? forced > 0
                : m > DENSE_LIMIT && (m > DENSE_MAX || links < (long) DENSE_DEGREE * m);
        if (!sparse) {
            if (matrix.length < m * m) {
                matrix = new double[m * m];
            }
            Arrays.fill(matrix, 0, m * m, 0.0);
            return;
        }
        if (degree.length < m) {
            int cap = Math.max(m, Math.min(vertexCount, 2 * degree.length));
            adjNode = Arrays.copyOf(adjNode, cap);
            adjConductance = Arrays.copyOf(adjConductance, cap);
            degree = new int[cap];
            order = new int[cap];
            position = new int[cap];
            eliminated = new boolean[cap];
            Arrays.fill(position, -1);
        }
        Arrays.fill(degree, 0, m, 0);
        Arrays.fill(eliminated, 0, m, false);
    }

    /** Testing hook: +1 always the sparse form, −1 always dense (m² must fit an array), 0 the rule. */
    void forceForm(int which) {
        forced = Integer.signum(which);
    }

    /**
     * Adds conductance g between local nodes a and b (−1 = ground): off-diagonal conductances in
     * the lower triangle, conductance to ground in {@link #ground}.
     */
    private void stamp(int a, int b, double g, int m) {
        if (sparse && a >= 0 && b >= 0) {
            if (a != b) {
                append(a, b, g);
                append(b, a, g);
            }
        } else if (a >= 0 && b >= 0) {
            if (a > b) {
                matrix[a * m + b] += g;
            } else if (b > a) {
                matrix[b * m + a] += g;
            }
        } else if (a >= 0) {
            ground[a] += g;
        } else if (b >= 0) {
            ground[b] += g;
        }
    }

    /**
     * Eliminates nodes 0..m−2 in turn by the star–mesh transform (Gaussian elimination on the
     * grounded Laplacian written in conductances, as in the Grassmann–Taksar–Heyman algorithm:
     * the pivot is the sum of the node's conductances, and every update adds non-negative
     * numbers, so no cancellation occurs and the result has small relative error however
     * ill-conditioned the network). Leaves each eliminated node's row and pivot for
     * {@link #backSubstitute}. Returns the last node's conductance to ground: the effective
     * conductance between the source and ground. O(m³/6).
     */
    private double eliminate(int m) {
        if (sparse) {
            return eliminateSparse(m);
        }
        double[] c = matrix;
        double[] col = column;
        for (int k = 0; k < m - 1; k++) {
            double d = ground[k];
            for (int j = k + 1; j < m; j++) {
                double v = c[j * m + k];
                col[j] = v;
                d += v;
            }
            pivot[k] = d;
            if (d == 0) {
                continue;
            }
            double inv = 1.0 / d;
            double gk = ground[k];
            for (int i = k + 1; i < m; i++) {
                double cik = col[i];
                if (cik == 0) {
                    continue;
                }
                double f = cik * inv;
                ground[i] += f * gk;
                int ri = i * m;
                for (int j = k + 1; j < i; j++) {
                    c[ri + j] += f * col[j];
                }
            }
        }
        pivot[m - 1] = ground[m - 1];
        return ground[m - 1];
    }


    // ------------------------------------------------------------- sparse form

    /** Appends the link (a → b, conductance g) to a's list; duplicates are merged later. */
    private void append(int a, int b, double g) {
        int d = degree[a];
        int[] nb = adjNode[a];
        if (nb == null || d == nb.length) {
            int cap = nb == null ? 4 : 2 * nb.length;
            adjNode[a] = nb = nb == null ? new int[cap] : Arrays.copyOf(nb, cap);
            adjConductance[a] = adjConductance[a] == null ? new double[cap] : Arrays.copyOf(adjConductance[a], cap);
        }
        nb[d] = b;
        adjConductance[a][d] = g;
        degree[a] = d + 1;
    }

    /**
     * Compacts node a's list in place: links to eliminated nodes dropped, parallel links merged
     * (conductances added, in list order). Leaves {@link #position} set for a's neighbours, to be
     * cleared by {@link #unscatter}. O(degree).
     */
    private void scatter(int a) {
        int[] nb = adjNode[a];
        double[] cond = adjConductance[a];
        int d = degree[a];
        int w = 0;
        for (int q = 0; q < d; q++) {
            int b = nb[q];
            if (eliminated[b]) {
                continue;
            }
            int at = position[b];
            if (at >= 0) {
                cond[at] += cond[q];
            } else {
                position[b] = w;
                nb[w] = b;
                cond[w] = cond[q];
                w++;
            }
        }
        degree[a] = w;
    }

    private void unscatter(int a) {
        int[] nb = adjNode[a];
        for (int q = 0; q < degree[a]; q++) {
            position[nb[q]] = -1;
        }
    }

    private int heapSize;

    private void push(long key) {
        if (heapSize == heap.length) {
            heap = Arrays.copyOf(heap, 2 * heap.length);
        }
        int i = heapSize++;
        while (i > 0) {
            int up = (i - 1) >>> 1;
            if (heap[up] <= key) {
                break;
            }
            heap[i] = heap[up];
            i = up;
        }
        heap[i] = key;
    }

    private long pop() {
        long top = heap[0];
        long last = heap[--heapSize];
        int i = 0;
        while (true) {
            int c = 2 * i + 1;
            if (c >= heapSize) {
                break;
            }
            if (c + 1 < heapSize && heap[c + 1] < heap[c]) {
                c++;
            }
            if (heap[c] >= last) {
                break;
            }
            heap[i] = heap[c];
            i = c;
        }
        if (heapSize > 0) {
            heap[i] = last;
        }
        return top;
    }

    /**
     * The sparse form of {@link #eliminate}: nodes 0..m−2 are eliminated in minimum-degree order
     * (ties by index; a lazy heap of (degree, node) keys), each by the star–mesh transform on its
     * list: pivot D_k = ground_k + Σ c_kj, ground_i += c_ki·ground_k/D_k, and c_ij += c_ki·c_kj/D_k
     * for every pair of its neighbours (the product taken in the same order for (i, j) and (j, i),
     * so the lists stay symmetric bit for bit). Only non-negative numbers are added, as in the dense
     * form. A node's list is frozen when it is eliminated: it is its row for
     * {@link #backSubstitute}. O(Σ_k deg_k²) time, O(m + links + fill) memory.
     */
    private double eliminateSparse(int m) {
        int source = m - 1;
        heapSize = 0;
        for (int i = 0; i < source; i++) {
            push(((long) degree[i] << 32) | i);
        }
        int count = 0;
        while (heapSize > 0) {
            long key = pop();
            int k = (int) key;
            if (eliminated[k] || (int) (key >>> 32) != degree[k]) {
                continue; // a stale entry
            }
            scatter(k);
            unscatter(k);
            eliminated[k] = true;
            order[count++] = k;
            int[] nk = adjNode[k];
            double[] ck = adjConductance[k];
            int dk = degree[k];
            double d = ground[k];
            for (int q = 0; q < dk; q++) {
                d += ck[q];
            }
            pivot[k] = d;
            if (d == 0) {
                continue;
            }
            double inv = 1.0 / d;
            double gk = ground[k];
            for (int q = 0; q < dk; q++) {
                int i = nk[q];
                double cik = ck[q];
                ground[i] += cik * inv * gk;
                scatter(i);
                for (int r = 0; r < dk; r++) {
                    int j = nk[r];
                    if (j == i) {
                        continue;
                    }
                    // c_ki·c_kj/D_k with the smaller node's conductance first, as the dense form does
                    double add = i < j ? cik * inv * ck[r] : ck[r] * inv * cik;
                    int at = position[j];
                    if (at >= 0) {
                        adjConductance[i][at] += add;
                    } else {
                        append(i, j, add);
                        position[j] = degree[i] - 1;
                    }
                }
                unscatter(i);
                if (i != source) {
                    push(((long) degree[i] << 32) | i);
                }
            }
        }
        pivot[source] = ground[source];
        return ground[source];
    }

    /**
     * After {@link #eliminate}: node potentials for a unit current into the source (node m−1),
     * ground at 0: φ_{m−1} = 1/g, then φ_k = Σ_{j&gt;k} c_kj φ_j / D_k. Positive sums only.
     */
    private double[] backSubstitute(int m) {
        double[] phi = new double[m];
        phi[m - 1] = 1.0 / pivot[m - 1];
        if (sparse) {
            for (int r = m - 2; r >= 0; r--) {
                int k = order[r];
                if (pivot[k] == 0) {
                    continue;
                }
                int[] nb = adjNode[k];
                double[] cond = adjConductance[k];
                double sum = 0;
                for (int q = 0; q < degree[k]; q++) {
                    sum += cond[q] * phi[nb[q]];
                }
                phi[k] = sum / pivot[k];
            }
            return phi;
        }
        for (int k = m - 2; k >= 0; k--) {
            if (pivot[k] == 0) {
                continue;
            }
            double sum = 0;
            for (int j = k + 1; j < m; j++) {
                sum += matrix[j * m + k] * phi[j];
            }
            phi[k] = sum / pivot[k];
        }
        return phi;
    }

    // ------------------------------------------------------------- witnesses

    /**
     * The full witness of one input: for a positive input the unit s→t electrical current on every
     * present edge (oriented u→v), its energy w_e·i_e² (summing to R), and vertex potentials with
     * φ(t) = 0 and φ(s) = R (vertices outside s's component have NaN potential); for a negative input the optimal potential with
     * p = 1 on s's side and 0 on t's side, constant on components of G(x), and the energy
     * (p_u − p_v)²/w_e on every absent edge. Allocates the returned record: O(|V| + |E|) plus the
     * elimination's cost (see the class javadoc).
     */
    public Witness witness(boolean[] present) {
        int m = build(present);
        double[] pot = new double[vertexCount];
        double[] current = new double[edgeCount];
        double[] energy = new double[edgeCount];
        if (positiveCase) {
            eliminate(m);
            double[] phi = backSubstitute(m);
            for (int i = 0; i < vertexCount; i++) {
                pot[i] = i == t ? 0.0 : (local[i] >= 0 ? phi[local[i]] : Double.NaN);
            }
            for (int e = 0; e < edgeCount; e++) {
                current[e] = present[e] && eu[e] != ev[e] && find(parent, eu[e]) == rootS
                        ? (pot[eu[e]] - pot[ev[e]]) * conductance[e] : 0.0;
                energy[e] = resistance[e] * current[e] * current[e];
            }
            return new Witness(true, pot[s], pot, current, energy);
        }
        double[] classPot = new double[vertexCount];
        double capacitance = 0.0;
        if (m < 0) {
            int cs = find(parent2, rootS);
            for (int i = 0; i < vertexCount; i++) {
                classPot[i] = find(parent2, i) == cs ? 1.0 : 0.0;
            }
        } else {
            capacitance = eliminate(m);
            double[] phi = backSubstitute(m);
            double scale = phi[m - 1];
            for (int i = 0; i < vertexCount; i++) {
                // classes outside the s–t part of the absent-edge network carry no energy: p = 0
                classPot[i] = i == rootS ? 1.0 : (local[i] >= 0 ? phi[local[i]] / scale : 0.0);
            }
        }
        for (int i = 0; i < vertexCount; i++) {
            pot[i] = classPot[find(parent, i)];
        }
        for (int e = 0; e < edgeCount; e++) {
            if (!present[e]) {
                double d = pot[eu[e]] - pot[ev[e]];
                energy[e] = d * d * conductance[e];
            }
        }
        // the value is the elimination's, as in evaluate (bit for bit); the energies sum to it
        // up to rounding (Σ energy is the certificate, Thomson/Dirichlet)
        return new Witness(false, capacitance, pot, current, energy);
    }

    /**
     * Replaces the edge weights (resistances, each finite and &gt; 0) in place, keeping the work
     * arrays: for optimisers that evaluate many weightings of one graph.
     */
    public void setWeights(double[] weight) {
        if (weight.length != edgeCount) {
            throw new IllegalArgumentException("expected " + edgeCount + " weights, got " + weight.length);
        }
        for (int i = 0; i < edgeCount; i++) {
            checkWeight(i, weight[i]);
            resistance[i] = weight[i];
            conductance[i] = 1.0 / weight[i];
        }
    }

    /** Resistance of edge {@code e}. */
    public double weight(int e) {
        return resistance[e];
    }
}
