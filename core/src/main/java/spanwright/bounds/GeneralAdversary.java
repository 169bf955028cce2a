package spanwright.bounds;

import java.util.ArrayList;
import java.util.List;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/**
 * The general (negative-weight) adversary bound ADV±(f) of f on its domain D, by semidefinite
 * programming, returned as a certified interval [lower, upper] with both certificates.
 *
 * <p><b>Formulation.</b> With Δ_i the D×D 0/1 matrix of pairs that differ in variable i and
 * F = {(x, y) : f(x) = 0, f(y) = 1}:
 * <pre>
 *  primal (adversary matrix):  ADV± = max ⟨Γ, J⟩  over symmetric Γ supported on F ∪ Fᵀ and α ≥ 0
 *                              with Σ_x α_x = 1 and diag(α) − Γ∘Δ_i ⪰ 0 for every i;
 *  dual (witness vectors):     ADV± = min t  over X_1..X_n ⪰ 0 with Σ_i X_i[x,x] = t for all x
 *                              and Σ_{i: x_i≠y_i} X_i[x,y] = 1 for all (x, y) ∈ F.
 * </pre>
 * The primal is the spectral form max ‖Γ'‖ / max_i ‖Γ'∘Δ_i‖ of Høyer, Lee &amp; Špalek ("Negative
 * weights make adversaries stronger", STOC 2007, arXiv:quant-ph/0611054) after the substitution
 * Γ = D_u Γ' D_u, u = √α; the dual is Reichardt's ("Span programs and quantum query complexity:
 * the general adversary bound is nearly tight for every boolean function", FOCS 2009,
 * arXiv:0904.2759), whose value is the least witness size of a span program for f; by
 * Reichardt ("Reflections for quantum query algorithms", SODA 2011, arXiv:1005.1601) the quantum
 * query complexity is Θ(ADV±). Every st-connectivity graph deciding f is such a span program,
 * so √(W₊W₋) ≥ ADV± for every graph and weighting.
 *
 * <p><b>Reduction.</b> The pairs of Δ_i split by x_i ⊕ f(x): the LMI of variable i is the direct
 * sum of two blocks, S_{i,c} = {x : x_i ⊕ f(x) = c}, c = 0, 1, each of about |D|/2 inputs. The
 * solver works on these 2n blocks (and a 1×1 block for t), with m = |F| + |D| constraints.
 *
 * <p><b>Certificates.</b> The lower bound is evaluated from the solver's (Γ, α) afresh by the
 * spectral form: G = D_α'^{-1/2} Γ D_α'^{-1/2} for α' = α⁺ + ε (a few ε tried) gives
 * ADV± ≥ σ_max(G) / max_B σ_max(G_B), and the feasible pair reported is rebuilt from G's top
 * singular vectors ({@link #certifyLower}); a violation δ of diag(α) − Γ∘Δ_i ⪰ 0 costs about
 * δ/α relative instead of |D|·δ. The upper bound is evaluated from the solver's X_i after
 * repairing the pair equations exactly: each residual 1 − Σ X_i[x,y] is shared by the blocks of
 * the differing variables and each block is shifted by its own −λ_min (EJML eigenvalues, with a
 * rounding margin), which keeps every X_i PSD; the largest diagonal sum is then ≥ ADV±. So the
 * reported interval contains ADV± whatever the solver did.
 *
 * <p><b>Symmetry.</b> The splitting method uses the signed variable permutations that fix f and D
 * ({@link InputSymmetry}): its iterates stay invariant, so only one block per orbit is
 * eigendecomposed (e.g. 3 of 14 for a read-once formula of 7 leaves whose leaves fall in
 * 3 orbits), the rest are copies.
 *
 * <p>Cost: one {@link InteriorPointSdp} run, ≈ 20–40 iterations of O(m³ + Σ_blocks ·) each. Size
 * limits: {@link #PAGE_MAX_VARIABLES} in the page, {@link #CLI_MAX_VARIABLES} in the CLI.
 */
public final class GeneralAdversary implements CertifiedBound {
    /** Largest number of variables the page solves the SDP for. */
    public static final int PAGE_MAX_VARIABLES = 6;
    /** Largest number of variables the command-line tool solves the SDP for. */
    public static final int CLI_MAX_VARIABLES = 8;
    /** Relative tolerance the interior-point method stops at. */
    public static final double TOLERANCE = 1e-9;
    /** Iteration limit of the interior-point method. */
    public static final int MAX_ITERATIONS = 100;

    /** Largest m (pairs + inputs) solved by the interior-point method first; larger SDPs use splitting. */
    public static final int INTERIOR_POINT_MAX_CONSTRAINTS = 1200;
    /**
     * Beyond {@link #INTERIOR_POINT_MAX_CONSTRAINTS} the interior-point method runs when its Schur
     * system has at most this order: m, or the number of constraint orbits under f's symmetries
     * ({@link InteriorPointSdp#constraintOrbits}) — every 7-variable function on the whole cube
     * (m ≤ 4,224) and 8-variable functions with enough symmetry. A dense Schur system of order c
     * needs about 3·8c² bytes (0.4 GB at 4,224) and its Cholesky factorisation about c³/3 flops
     * per iteration (measured: about 3 s CPU at c = 4,200; random 7-variable functions take 16–17
     * iterations to a certified width of 1e-6 from the smaller start, 22–24 to a duality gap of
     * 1e-9 from SDPT3's), against the splitting method's 6,000 iterations for about 1e-5.
     */
    public static final int INTERIOR_POINT_FALLBACK_CONSTRAINTS = 4400;
    /** Relative tolerance of the splitting method. */
    public static final double SPLITTING_TOLERANCE = 1e-10;
    /** Iteration limit of the splitting method. */
    public static final int SPLITTING_MAX_ITERATIONS = 6000;
    /** The splitting method stops once upper − lower ≤ this × upper (checked every 50 iterations). */
    public static final double SPLITTING_RELATIVE_GAP = 1e-6;
    /**
     * Beyond {@link #INTERIOR_POINT_FALLBACK_CONSTRAINTS} (8 variables) the splitting method stops
     * at this relative width instead: measured on a random 8-variable function, 6,000 iterations
     * (about 400 s of CPU) reach 1.4e-6; 1e-5 is the precision aimed at for 8 variables, and the
     * status says which rule applied only through {@link #gap()}.
     */
    public static final double SPLITTING_RELATIVE_GAP_LARGE = 1e-5;
    private static final int SPLITTING_CHECK_INTERVAL = 100;
    /** Multiplier step of the splitting method (Glowinski's over-relaxation; 1.6 measured ≈ 1.5× fewer iterations). */
    private static final double SPLITTING_RELAXATION = 1.6;

    /** Which solver produced the interval. */
    public enum Method {
        /**
         * {@link InteriorPointSdp}: m ≤ {@link #INTERIOR_POINT_MAX_CONSTRAINTS}, or up to
         * {@link #INTERIOR_POINT_FALLBACK_CONSTRAINTS} (Schur order over constraint orbits).
         */
        INTERIOR_POINT,
        /** {@link SplittingSdp}: larger m (n = 7, 8 in the CLI). */
        SPLITTING,
        /** No solver: f constant. */
        NONE
    }

    /** How the interval was obtained. */
    public enum Status {
        /** The solver converged; the interval is as tight as the tolerance. */
        CONVERGED,
        /** The solver stopped early; the interval is valid but may be wide. */
        NOT_CONVERGED,
        /** f is constant on D: no pair to distinguish, ADV± = 0. */
        CONSTANT
    }

    private final TargetFunction function;
    private final double lower;
    private final double upper;
    private final Status status;
    private final Method method;
    private final int iterations;
    private final int constraints;
    private int eigenBlocks;
    private int schurOrder;
    private final int[] pairZero;
    private final int[] pairOne;
    private final double[] pairWeight;
    private final double[] inputWeight;
    private final int[][] blockInputs;
    private final int[] blockVariable;
    private final double[][] blockMatrices;

    private GeneralAdversary(TargetFunction function, double lower, double upper, Status status, Method method,
            int iterations,
            int constraints, int[] pairZero, int[] pairOne, double[] pairWeight, double[] inputWeight,
            int[][] blockInputs, int[] blockVariable, double[][] blockMatrices) {
        this.function = function;
        this.lower = lower;
        this.upper = upper;
        this.status = status;
        this.method = method;
        this.iterations = iterations;
        this.constraints = constraints;
        this.pairZero = pairZero;
        this.pairOne = pairOne;
        this.pairWeight = pairWeight;
        this.inputWeight = inputWeight;
        this.blockInputs = blockInputs;
        this.blockVariable = blockVariable;
        this.blockMatrices = blockMatrices;
    }

    /**
     * Solves the SDP for f. Preconditions: f is tabulated; the caller enforces the size limit
     * it wants ({@link #PAGE_MAX_VARIABLES} or {@link #CLI_MAX_VARIABLES}).
     */
    public static GeneralAdversary compute(TargetFunction f) {
        return compute(f, null);
    }

    /** The method used for an SDP with m constraints (or {@code forced} when not null). */
    static Method method(int constraints, Method forced) {
        if (forced != null) {
            return forced;
        }
        return constraints <= INTERIOR_POINT_MAX_CONSTRAINTS ? Method.INTERIOR_POINT : Method.SPLITTING;
    }

    /** As {@link #compute(TargetFunction)}, with the solver chosen by the caller (tests). */
    static GeneralAdversary compute(TargetFunction f, Method forced) {
        return compute(f, forced, false);
    }

    /**
     * The positive-weight adversary ADV(f) by the same SDP with Γ ≥ 0 entrywise, as a certified
     * interval carried by a {@code GeneralAdversary} (package use only, by
     * {@link PositiveAdversary}); null when the SDP is too large for the interior-point method
     * (m &gt; {@link #INTERIOR_POINT_MAX_CONSTRAINTS}, i.e. beyond six variables on the whole cube).
     * The symmetry plan of the splitting method applies unchanged: the slack blocks are their own
     * representatives, and pairs in one orbit have equal slacks.
     *
     * <p>Γ ≥ 0 makes each pair equation an inequality Σ_{i: x_i≠y_i} X_i[x,y] ≥ 1 (the witness
     * form of ADV, dual of the spectral form max ‖Γ‖ / max_i ‖Γ∘Δ_i‖ over non-negative Γ of
     * Barnum, Saks &amp; Szegedy, CCC 2003): one 1×1 slack block s_q ≥ 0 per pair, Σ X − s_q = 1,
     * whose dual slack is 2Γ_q. Certificates: the lower end is the spectral form of the solver's
     * Γ with negative entries set to 0 (any non-negative Γ gives a valid bound); the upper end
     * repairs only pairs with Σ X &lt; 1, then shifts each block to PSD as for ADV±.
     */
    static GeneralAdversary positiveWeights(TargetFunction f) {
        return positiveWeights(f, false);
    }

    /**
     * As {@link #positiveWeights(TargetFunction)}; with {@code splitting} a larger SDP is solved by
     * the splitting method instead of returning null (command line, 7 and 8 variables).
     */
    static GeneralAdversary positiveWeights(TargetFunction f, boolean splitting) {
        if (f.isConstant()) {
            return compute(f, Method.INTERIOR_POINT, true);
        }
        long pairs = (long) f.zerosCount() * f.onesCount();
        if (pairs + f.size() > INTERIOR_POINT_MAX_CONSTRAINTS) {
            return splitting ? compute(f, null, true) : null;
        }
        return compute(f, Method.INTERIOR_POINT, true);
    }

    private static GeneralAdversary compute(TargetFunction f, Method forced, boolean nonNegative) {
        int n = f.variableCount();
        int size = f.size();
        if (f.isConstant()) {
            return new GeneralAdversary(f, 0, 0, Status.CONSTANT, Method.NONE, 0, 0, new int[0], new int[0], new double[0],
                    new double[size], new int[0][], new int[0], new double[0][]);
        }
        // pairs (x, y) with f(x) = 0, f(y) = 1, by domain ordinal
        List<Integer> zeros = new ArrayList<>();
        List<Integer> ones = new ArrayList<>();
        for (int k = 0; k < size; k++) {
            (f.value(k) ? ones : zeros).add(k);
        }
        int pairs = zeros.size() * ones.size();
        int[] pz = new int[pairs];
        int[] po = new int[pairs];
        int q = 0;
        for (int a : zeros) {
            for (int b : ones) {
                pz[q] = a;
                po[q] = b;
                q++;
            }
        }
        // blocks (i, c): inputs with x_i xor f(x) = c; keep those holding a pair
        boolean[] used = new boolean[2 * n];
        for (int p = 0; p < pairs; p++) {
            long diff = f.input(pz[p]) ^ f.input(po[p]);
            for (int i = 0; i < n; i++) {
                if ((diff & f.variableMask(i)) != 0) {
                    used[blockOf(f, pz[p], i)] = true;
                }
            }
        }
        int[] blockId = new int[2 * n];
        int[][] local = new int[2 * n][];
        List<int[]> members = new ArrayList<>();
        List<Integer> variableOfBlock = new ArrayList<>();
        SdpProblem.Builder sdp = new SdpProblem.Builder();
        for (int bc = 0; bc < 2 * n; bc++) {
            blockId[bc] = -1;
            if (!used[bc]) {
                continue;
            }
            local[bc] = new int[size];
            List<Integer> in = new ArrayList<>();
            for (int k = 0; k < size; k++) {
                local[bc][k] = -1;
                if (blockOf(f, k, bc / 2) == bc) {
                    local[bc][k] = in.size();
                    in.add(k);
                }
            }
            blockId[bc] = sdp.addBlock(in.size());
            int[] arr = new int[in.size()];
            for (int i = 0; i < arr.length; i++) {
                arr[i] = in.get(i);
            }
            members.add(arr);
            variableOfBlock.add(bc / 2);
        }
        int tBlock = sdp.addBlock(1);
        sdp.cost(tBlock, 0, 0, 1);
        int[] slackBlock = new int[nonNegative ? pairs : 0];
        for (int p = 0; p < slackBlock.length; p++) {
            slackBlock[p] = sdp.addBlock(1);
        }
        for (int p = 0; p < pairs; p++) {
            sdp.addConstraint(2);
            if (nonNegative) {
                // 2 Σ X[x,y] − 2 s_q = 2 with s_q ≥ 0; the dual slack of this block is 2Γ_q ≥ 0
                sdp.entry(slackBlock[p], 0, 0, -2);
            }
            long diff = f.input(pz[p]) ^ f.input(po[p]);
            for (int i = 0; i < n; i++) {
                if ((diff & f.variableMask(i)) != 0) {
                    int bc = blockOf(f, pz[p], i);
                    sdp.entry(blockId[bc], local[bc][pz[p]], local[bc][po[p]], 1);
                }
            }
        }
        for (int k = 0; k < size; k++) {
            sdp.addConstraint(0);
            for (int i = 0; i < n; i++) {
                int bc = blockOf(f, k, i);
                if (blockId[bc] >= 0) {
                    sdp.entry(blockId[bc], local[bc][k], local[bc][k], -1);
                }
            }
            sdp.entry(tBlock, 0, 0, 1);
        }
        SdpProblem problem = sdp.build();
        Method method = method(problem.constraintCount(), forced);
        DMatrixRMaj[] xBlocks = new DMatrixRMaj[members.size()];
        int nb = members.size();
        int[][] blockInputs = members.toArray(new int[0][]);
        int[] blockVar = new int[nb];
        for (int bl = 0; bl < nb; bl++) {
            blockVar[bl] = variableOfBlock.get(bl);
        }
        Layout layout = new Layout(f, pz, po, blockId, local, blockInputs, nonNegative);
        Certified lo;
        int symmetries = 0;
        int schurOrder = problem.constraintCount();
        double[][] repaired = new double[nb][];
        double up;
        boolean converged;
        int iterations;
        if (method == Method.INTERIOR_POINT) {
            InteriorPointSdp solver = new InteriorPointSdp(problem);
            converged = solver.solve(TOLERANCE, MAX_ITERATIONS) == InteriorPointSdp.Status.CONVERGED;
            iterations = solver.iterations();
            for (int bl = 0; bl < nb; bl++) {
                xBlocks[bl] = solver.primal(bl).copy();
            }
            lo = certifyLower(layout, solver.dual());
            up = certifyUpper(layout, xBlocks, repaired);
        } else {
            // Beyond INTERIOR_POINT_MAX_CONSTRAINTS: the interior-point method first when its Schur
            // system, over the orbits of the constraints under f's symmetries, has at most
            // INTERIOR_POINT_FALLBACK_CONSTRAINTS rows (every 7-variable function; symmetric
            // 8-variable ones); the splitting method otherwise, or when that fails
            SymmetryPlan plan = symmetryPlan(layout, zeros.size(), ones.size(), problem.blockCount());
            symmetries = plan == null ? nb : plan.blockOrbits;
            schurOrder = plan == null ? problem.constraintCount() : plan.constraintOrbits;
            lo = null;
            up = Double.POSITIVE_INFINITY;
            converged = false;
            iterations = 0;
            double[][] ipmRepaired = null;
            if (forced == null && schurOrder <= INTERIOR_POINT_FALLBACK_CONSTRAINTS) {
                // the splitting method's rule at these sizes: a certified width of 1e-6 is converged,
                // checked on the iterate once the duality gap is small (each iteration costs about
                // 3 s at a Schur order of 4,200; with the smaller start a random 7-variable function
                // stops after 16–17 iterations instead of 24, and a promise can leave the method
                // stalled short of 1e-9, e.g. mine-rescue); if the smaller start fails, SDPT3's
                InteriorPointSdp.Monitor narrow = s -> {
                    DMatrixRMaj[] xs = new DMatrixRMaj[nb];
                    for (int bl = 0; bl < nb; bl++) {
                        xs[bl] = s.primal(bl).copy();
                    }
                    double u = certifyUpper(layout, xs, new double[nb][]);
                    return u - certifyLower(layout, s.dual()).value <= SPLITTING_RELATIVE_GAP * u;
                };
                InteriorPointSdp ipm = withOrbits(new InteriorPointSdp(problem).smallStart(), plan);
                converged = ipm.solve(TOLERANCE, MAX_ITERATIONS, narrow) == InteriorPointSdp.Status.CONVERGED;
                iterations = ipm.iterations();
                if (!converged && !narrow.enough(ipm)) {
                    ipm = withOrbits(new InteriorPointSdp(problem), plan);
                    converged = ipm.solve(TOLERANCE, MAX_ITERATIONS, narrow) == InteriorPointSdp.Status.CONVERGED;
                    iterations += ipm.iterations();
                }
                for (int bl = 0; bl < nb; bl++) {
                    xBlocks[bl] = ipm.primal(bl).copy();
                }
                lo = certifyLower(layout, ipm.dual());
                up = certifyUpper(layout, xBlocks, repaired);
                method = Method.INTERIOR_POINT;
                converged |= up - lo.value <= SPLITTING_RELATIVE_GAP * up;
                ipmRepaired = repaired.clone();
            }
            if (!converged) {
                // splitting converges slowly near the end: stop once the certified interval is narrow
                Certified ipmLo = lo;
                double ipmUp = up;
                int ipmIterations = iterations;
                SplittingSdp solver = new SplittingSdp(problem);
                solver.relaxation = SPLITTING_RELAXATION;
                if (plan != null) {
                    solver.symmetry(plan.rep, plan.perm, plan.orbit);
                }
                double stopGap = problem.constraintCount() > INTERIOR_POINT_FALLBACK_CONSTRAINTS
                        ? SPLITTING_RELATIVE_GAP_LARGE : SPLITTING_RELATIVE_GAP;
                while (solver.iterations() < SPLITTING_MAX_ITERATIONS) {
                    boolean done = solver.solve(SPLITTING_TOLERANCE,
                            Math.min(SPLITTING_CHECK_INTERVAL, SPLITTING_MAX_ITERATIONS - solver.iterations()));
                    for (int bl = 0; bl < nb; bl++) {
                        xBlocks[bl] = solver.primal(bl).copy();
                    }
                    lo = certifyLower(layout, solver.dual());
                    up = certifyUpper(layout, xBlocks, repaired);
                    converged = done || up - lo.value <= stopGap * up;
                    if (converged) {
                        break;
                    }
                }
                method = Method.SPLITTING;
                iterations = solver.iterations();
                if (ipmLo != null && ipmUp - ipmLo.value < up - lo.value) {
                    // the failed interior-point run left the narrower interval: keep it
                    lo = ipmLo;
                    up = ipmUp;
                    System.arraycopy(ipmRepaired, 0, repaired, 0, nb);
                    method = Method.INTERIOR_POINT;
                    iterations = ipmIterations;
                }
            }
        }
        Status status = converged ? Status.CONVERGED : Status.NOT_CONVERGED;
        GeneralAdversary result = new GeneralAdversary(f, lo.value, up, status, method, iterations, problem.constraintCount(),
                pz, po, lo.pairWeight, lo.inputWeight, blockInputs, blockVar, repaired);
        result.eigenBlocks = method == Method.SPLITTING ? symmetries : nb;
        result.schurOrder = method == Method.INTERIOR_POINT ? schurOrder : 0;
        return result;
    }

    /** The solver with f's constraint orbits declared (none when {@code plan} is null). */
    private static InteriorPointSdp withOrbits(InteriorPointSdp ipm, SymmetryPlan plan) {
        return plan == null ? ipm : ipm.constraintOrbits(plan.orbit);
    }

    /**
     * Finds the symmetries of f ({@link InputSymmetry}) and hands the splitting solver the orbits
     * they generate on its blocks and constraints; returns the number of blocks that need an
     * eigendecomposition per iteration (all of them when f has no symmetry found). O(|G|·(m + Σd)).
     */
    private static SymmetryPlan symmetryPlan(Layout lay, int zeroCount, int oneCount, int sdpBlocks) {
        TargetFunction f = lay.f;
        List<InputSymmetry.Generator> gens = InputSymmetry.generators(f);
        int nb = lay.blockInputs.length;
        if (gens.isEmpty()) {
            return null;
        }
        int size = f.size();
        int pairs = lay.pairZero.length;
        // block of (variable i, side c) -> SDP block index and back
        int[] bcOf = new int[nb];
        for (int bc = 0; bc < lay.blockId.length; bc++) {
            if (lay.blockId[bc] >= 0) {
                bcOf[lay.blockId[bc]] = bc;
            }
        }
        // breadth-first search over blocks: the map from each block's representative
        int[] rep = new int[sdpBlocks];
        int[][] fromRep = new int[nb][];
        java.util.Arrays.fill(rep, -1);
        int reps = 0;
        int[] queue = new int[nb];
        for (int start = 0; start < nb; start++) {
            if (rep[start] >= 0) {
                continue;
            }
            reps++;
            rep[start] = start;
            int[] id = new int[size];
            for (int k = 0; k < size; k++) {
                id[k] = k;
            }
            fromRep[start] = id;
            int head = 0;
            int tail = 0;
            queue[tail++] = start;
            while (head < tail) {
                int bl = queue[head++];
                int bc = bcOf[bl];
                int member = lay.blockInputs[bl][0];
                for (InputSymmetry.Generator g : gens) {
                    int imageBc = blockOf(f, g.inputMap[member], g.image[bc / 2]);
                    int image = lay.blockId[imageBc];
                    if (rep[image] >= 0) {
                        continue;
                    }
                    rep[image] = start;
                    int[] map = new int[size];
                    for (int k = 0; k < size; k++) {
                        map[k] = g.inputMap[fromRep[bl][k]];
                    }
                    fromRep[image] = map;
                    queue[tail++] = image;
                }
            }
        }
        for (int bl = nb; bl < sdpBlocks; bl++) {
            rep[bl] = bl;
        }
        int[][] perm = new int[sdpBlocks][];
        for (int bl = 0; bl < nb; bl++) {
            if (rep[bl] == bl) {
                continue;
            }
            int[] in = lay.blockInputs[rep[bl]];
            int bc = bcOf[bl];
            perm[bl] = new int[in.length];
            for (int a = 0; a < in.length; a++) {
                perm[bl][a] = lay.local[bc][fromRep[bl][in[a]]];
            }
        }
        // constraint orbits: pairs first (index zeroIndex · ones + oneIndex), then inputs
        int[] index = new int[size];
        int z = 0;
        int o = 0;
        for (int k = 0; k < size; k++) {
            index[k] = f.value(k) ? o++ : z++;
        }
        int[] parent = new int[pairs + size];
        for (int k = 0; k < parent.length; k++) {
            parent[k] = k;
        }
        for (InputSymmetry.Generator g : gens) {
            for (int p = 0; p < pairs; p++) {
                int q = index[g.inputMap[lay.pairZero[p]]] * oneCount + index[g.inputMap[lay.pairOne[p]]];
                union(parent, p, q);
            }
            for (int k = 0; k < size; k++) {
                union(parent, pairs + k, pairs + g.inputMap[k]);
            }
        }
        int[] orbit = new int[parent.length];
        int[] label = new int[parent.length];
        java.util.Arrays.fill(label, -1);
        int count = 0;
        for (int k = 0; k < parent.length; k++) {
            int r = find(parent, k);
            if (label[r] < 0) {
                label[r] = count++;
            }
            orbit[k] = label[r];
        }
        return new SymmetryPlan(rep, perm, orbit, reps);
    }

    /** What {@link #symmetryPlan} found: block representatives and maps, constraint orbits. */
    private static final class SymmetryPlan {
        final int[] rep;
        final int[][] perm;
        final int[] orbit;
        /** Blocks eigendecomposed per splitting iteration (one per orbit of blocks). */
        final int blockOrbits;
        final int constraintOrbits;

        SymmetryPlan(int[] rep, int[][] perm, int[] orbit, int blockOrbits) {
            this.rep = rep;
            this.perm = perm;
            this.orbit = orbit;
            this.blockOrbits = blockOrbits;
            int c = 0;
            for (int o : orbit) {
                c = Math.max(c, o + 1);
            }
            this.constraintOrbits = c;
        }
    }

    private static int find(int[] parent, int k) {
        while (parent[k] != k) {
            parent[k] = parent[parent[k]];
            k = parent[k];
        }
        return k;
    }

    private static void union(int[] parent, int a, int b) {
        int ra = find(parent, a);
        int rb = find(parent, b);
        if (ra != rb) {
            parent[Math.max(ra, rb)] = Math.min(ra, rb);
        }
    }

    /** Where each pair and input sits in the blocks of the SDP. */
    private static final class Layout {
        final TargetFunction f;
        final int[] pairZero;
        final int[] pairOne;
        /** SDP block of (variable i, side c) at 2i + c, or −1 when dropped. */
        final int[] blockId;
        /** Local index of each input ordinal in block 2i + c, or −1. */
        final int[][] local;
        final int[][] blockInputs;
        /** The positive-weight version: Γ ≥ 0, pair constraints Σ X ≥ 1. */
        final boolean nonNegative;

        Layout(TargetFunction f, int[] pairZero, int[] pairOne, int[] blockId, int[][] local, int[][] blockInputs,
                boolean nonNegative) {
            this.f = f;
            this.nonNegative = nonNegative;
            this.pairZero = pairZero;
            this.pairOne = pairOne;
            this.blockId = blockId;
            this.local = local;
            this.blockInputs = blockInputs;
        }
    }

    /** Index 2i + (x_i xor f(x)) of the block of variable i holding input ordinal k. */
    private static int blockOf(TargetFunction f, int k, int i) {
        boolean bit = f.bit(f.input(k), i);
        return 2 * i + (bit != f.value(k) ? 1 : 0);
    }

    private static final class Certified {
        final double value;
        final double[] pairWeight;
        final double[] inputWeight;

        Certified(double value, double[] pairWeight, double[] inputWeight) {
            this.value = value;
            this.pairWeight = pairWeight;
            this.inputWeight = inputWeight;
        }
    }

    /**
     * The certified lower bound from a dual iterate y = (Γ, α), by the spectral form of Høyer,
     * Lee &amp; Špalek: for any α' &gt; 0, G = D_α'^{-1/2} Γ D_α'^{-1/2} (zeros × ones) gives
     * ADV± ≥ σ_max(G) / max_B σ_max(G[Z_B, O_B]), B over the blocks (every zero–one pair of block
     * (i, c) differs in i, so G∘Δ_i is the direct sum of these submatrices). The feasible pair
     * reported is rebuilt from G's top singular vectors u (zeros), v (ones), s = (u, v)/√2:
     * α'' = s², Γ'' = θ s_x G_xy s_y with θ = 1 / max_B σ_max(G_B); then diag(α'') − Γ''∘Δ_i =
     * S(I − θ G∘Δ_i)S ⪰ 0 and ⟨Γ'', J⟩ = θ σ_max(G). α' = max(α, 0) + ε·mean(α) is tried for a few
     * ε (zero entries of α leave G undefined), and so is α itself with the inputs where
     * α ≤ δ·mean(α) left out (their rows and columns of G zero: the spectral bound holds for any
     * G ≠ 0), for a few δ; the best is kept. Near an optimum that gives some inputs no weight the
     * splitting method's α hovers around zero there: on a random 8-variable function (seed 1) the
     * lower end stayed at 5.578794 from iteration 1,600 to 3,700 with the shifted α' alone, and
     * rose to 5.579046 by iteration 2,600 with inputs left out (the interval reached a relative
     * width of 1e-5 after 3,700 iterations instead of 4,600). Cost O(|D|³) per ε or δ (one SVD of
     * G, singular values of the 2n blocks).
     */
    private static Certified certifyLower(Layout lay, double[] y) {
        TargetFunction f = lay.f;
        int[] pz = lay.pairZero;
        int[] po = lay.pairOne;
        int size = f.size();
        double[] gamma = java.util.Arrays.copyOfRange(y, 0, pz.length);
        if (lay.nonNegative) {
            for (int p = 0; p < gamma.length; p++) {
                gamma[p] = Math.max(0, gamma[p]);
            }
        }
        double[] alpha = java.util.Arrays.copyOfRange(y, pz.length, pz.length + size);
        // zero and one indices (rows and columns of G)
        int[] index = new int[size];
        int zeros = 0;
        int ones = 0;
        for (int k = 0; k < size; k++) {
            index[k] = f.value(k) ? ones++ : zeros++;
        }
        double mean = 0;
        boolean allPositive = true;
        for (int k = 0; k < size; k++) {
            mean += Math.max(0, alpha[k]) / size;
            allPositive &= alpha[k] > 0;
        }
        if (!(mean > 0)) {
            mean = 1.0 / size;
        }
        Certified best = new Certified(0, new double[pz.length], new double[size]);
        double[] eps = {0, 1e-12, 1e-10, 1e-8, 1e-6, 1e-4, 1e-2};
        double[] drop = {0, 1e-10, 1e-8, 1e-6, 1e-4};
        for (int t = 0; t < eps.length + drop.length; t++) {
            boolean shifted = t < eps.length;
            double e = shifted ? eps[t] : drop[t - eps.length];
            if (shifted && e == 0 && !allPositive) {
                continue;
            }
            double[] scale = new double[size];
            for (int k = 0; k < size; k++) {
                if (shifted) {
                    scale[k] = 1 / Math.sqrt(Math.max(0, alpha[k]) + e * mean);
                } else {
                    // inputs the iterate gives (almost) no weight are left out of G
                    scale[k] = alpha[k] > e * mean ? 1 / Math.sqrt(alpha[k]) : 0;
                }
            }
            DMatrixRMaj g = new DMatrixRMaj(zeros, ones);
            for (int p = 0; p < pz.length; p++) {
                g.set(index[pz[p]], index[po[p]], gamma[p] * scale[pz[p]] * scale[po[p]]);
            }
            Certified c = spectralCertificate(lay, g, index, zeros, ones);
            if (c != null && c.value > best.value) {
                best = c;
            }
        }
        return best;
    }

    /** The certificate of {@link #certifyLower} for one G; null when G is zero or the SVD fails. */
    private static Certified spectralCertificate(Layout lay, DMatrixRMaj g, int[] index, int zeros, int ones) {
        TargetFunction f = lay.f;
        int size = f.size();
        double worst = 0;
        for (int bl = 0; bl < lay.blockInputs.length; bl++) {
            int[] in = lay.blockInputs[bl];
            int bz = 0;
            int bo = 0;
            for (int k : in) {
                if (f.value(k)) {
                    bo++;
                } else {
                    bz++;
                }
            }
            if (bz == 0 || bo == 0) {
                continue;
            }
            DMatrixRMaj sub = new DMatrixRMaj(bz, bo);
            int r = 0;
            for (int a : in) {
                if (f.value(a)) {
                    continue;
                }
                int c = 0;
                for (int b : in) {
                    if (f.value(b)) {
                        sub.set(r, c++, g.get(index[a], index[b]));
                    }
                }
                r++;
            }
            worst = Math.max(worst, largestSingularValue(sub));
        }
        org.ejml.interfaces.decomposition.SingularValueDecomposition_F64<DMatrixRMaj> svd =
                DecompositionFactory_DDRM.svd(zeros, ones, true, true, false);
        if (!(worst > 0) || !svd.decompose(g.copy())) {
            return null;
        }
        double[] sv = svd.getSingularValues();
        int top = 0;
        for (int i = 1; i < sv.length; i++) {
            if (sv[i] > sv[top]) {
                top = i;
            }
        }
        DMatrixRMaj u = svd.getU(null, false);
        DMatrixRMaj v = svd.getV(null, false);
        double[] s = new double[size];
        for (int k = 0; k < size; k++) {
            s[k] = (f.value(k) ? v.get(index[k], top) : u.get(index[k], top)) / Math.sqrt(2);
            if (lay.nonNegative) {
                // G ≥ 0: |u|ᵀG|v| ≥ uᵀGv = σ_max, so the absolute values are top singular vectors
                // too, and Γ stays non-negative
                s[k] = Math.abs(s[k]);
            }
        }
        // θ with a margin for the rounding of the singular values
        double theta = 1 / (worst * (1 + 1e-12));
        double[] pw = new double[lay.pairZero.length];
        double objective = 0;
        for (int p = 0; p < pw.length; p++) {
            int a = lay.pairZero[p];
            int b = lay.pairOne[p];
            pw[p] = theta * s[a] * g.get(index[a], index[b]) * s[b];
            objective += 2 * pw[p];
        }
        double[] iw = new double[size];
        double total = 0;
        for (int k = 0; k < size; k++) {
            iw[k] = s[k] * s[k];
            total += iw[k];
        }
        for (int k = 0; k < size; k++) {
            iw[k] /= total;
        }
        for (int p = 0; p < pw.length; p++) {
            pw[p] /= total;
        }
        return objective > 0 ? new Certified(objective / total, pw, iw) : null;
    }

    /** σ_max of a dense matrix: √ of the largest eigenvalue of the smaller Gram matrix (EJML). */
    static double largestSingularValue(DMatrixRMaj a) {
        DMatrixRMaj gram = a.numRows <= a.numCols ? new DMatrixRMaj(a.numRows, a.numRows) : new DMatrixRMaj(a.numCols, a.numCols);
        if (a.numRows <= a.numCols) {
            org.ejml.dense.row.CommonOps_DDRM.multTransB(a, a, gram);
        } else {
            org.ejml.dense.row.CommonOps_DDRM.multTransA(a, a, gram);
        }
        EigenDecomposition_F64<DMatrixRMaj> e = DecompositionFactory_DDRM.eig(gram.numRows, false, true);
        if (!e.decompose(gram)) {
            return Double.POSITIVE_INFINITY;
        }
        double max = 0;
        for (int i = 0; i < gram.numRows; i++) {
            max = Math.max(max, e.getEigenvalue(i).real);
        }
        return Math.sqrt(max);
    }

    /**
     * The certified upper bound from witness blocks X_B (PSD up to the solver's accuracy, pair
     * equations up to its residual): each residual 1 − Σ X_i[x,y] is shared equally by the blocks
     * of the differing variables, and each block is then shifted by λ·I, λ = −λ_min of the
     * repaired block (EJML eigenvalues) with a margin for rounding, so every X_i is PSD and every
     * pair equation holds; the largest diagonal sum is ≥ ADV±. Cost O(Σ_B d_B³).
     */
    private static double certifyUpper(Layout lay, DMatrixRMaj[] xBlocks, double[][] repairedOut) {
        TargetFunction f = lay.f;
        int[] pz = lay.pairZero;
        int[] po = lay.pairOne;
        int[] blockIndexOf = lay.blockId;
        int n = f.variableCount();
        int nb = lay.blockInputs.length;
        for (int p = 0; p < pz.length; p++) {
            long diff = f.input(pz[p]) ^ f.input(po[p]);
            double sum = 0;
            int count = 0;
            for (int i = 0; i < n; i++) {
                if ((diff & f.variableMask(i)) != 0) {
                    int bc = blockOf(f, pz[p], i);
                    sum += xBlocks[blockIndexOf[bc]].get(lay.local[bc][pz[p]], lay.local[bc][po[p]]);
                    count++;
                }
            }
            double share = (lay.nonNegative ? Math.max(0, 1 - sum) : 1 - sum) / count;
            for (int i = 0; i < n; i++) {
                if ((diff & f.variableMask(i)) != 0) {
                    int bc = blockOf(f, pz[p], i);
                    DMatrixRMaj xb = xBlocks[blockIndexOf[bc]];
                    int a = lay.local[bc][pz[p]];
                    int b = lay.local[bc][po[p]];
                    xb.add(a, b, share);
                    xb.add(b, a, share);
                }
            }
        }
        double[] diagonalSum = new double[f.size()];
        for (int bl = 0; bl < nb; bl++) {
            DMatrixRMaj xb = xBlocks[bl];
            double scale = 0;
            for (double d : xb.data) {
                scale = Math.max(scale, Math.abs(d));
            }
            double neg = Math.max(0, -minEigenvalue(xb));
            // margin: EJML's eigenvalues are backward stable, error ≲ d·ε·max|X|
            double add = neg * (1 + 1e-9) + 1e-13 * xb.numRows * scale;
            for (int i = 0; i < xb.numRows; i++) {
                xb.add(i, i, add);
                diagonalSum[lay.blockInputs[bl][i]] += xb.get(i, i);
            }
            repairedOut[bl] = xb.data.clone();
        }
        double max = 0;
        for (double d : diagonalSum) {
            max = Math.max(max, d);
        }
        return max;
    }

    /** Smallest eigenvalue of a symmetric matrix (EJML symmetric QR algorithm). */
    static double minEigenvalue(DMatrixRMaj a) {
        EigenDecomposition_F64<DMatrixRMaj> e = DecompositionFactory_DDRM.eig(a.numRows, false, true);
        if (!e.decompose(a.copy())) {
            return Double.NEGATIVE_INFINITY;
        }
        double min = Double.POSITIVE_INFINITY;
        for (int i = 0; i < a.numRows; i++) {
            min = Math.min(min, e.getEigenvalue(i).real);
        }
        return min;
    }

    // ------------------------------------------------------------------ results

    @Override
    public TargetFunction function() {
        return function;
    }

    /** Certified lower bound on ADV± (the primal value, from the adversary matrix). */
    @Override
    public double lower() {
        return lower;
    }

    /** Certified upper bound on ADV± (the dual value, from the witness matrices). */
    @Override
    public double upper() {
        return upper;
    }

    public Status status() {
        return status;
    }

    /** The solver used. */
    public Method method() {
        return method;
    }

    /** Solver iterations used. */
    public int iterations() {
        return iterations;
    }

    /**
     * Blocks the solver decomposed per iteration: 2n at most; fewer when the splitting method used
     * symmetries of f ({@link InputSymmetry}), one block per orbit.
     */
    public int eigenBlocks() {
        return eigenBlocks;
    }

    /**
     * Order of the interior-point method's Schur system: m, or the number of constraint orbits
     * under f's symmetries beyond six variables; 0 when the splitting method gave the result.
     */
    public int schurOrder() {
        return schurOrder;
    }

    /** m, the number of SDP constraints (pairs + inputs). */
    public int constraintCount() {
        return constraints;
    }

    /** Number of pairs (x, y) with f(x) = 0, f(y) = 1. */
    public int pairCount() {
        return pairZero.length;
    }

    /** Domain ordinal of the 0-input of pair p. */
    public int pairZero(int p) {
        return pairZero[p];
    }

    /** Domain ordinal of the 1-input of pair p. */
    public int pairOne(int p) {
        return pairOne[p];
    }

    /** Γ of pair p in the certified, normalised primal solution (Σ α = 1). */
    public double pairWeight(int p) {
        return pairWeight[p];
    }

    /** α of the input with this ordinal in the certified primal solution (≥ 0, sum 1). */
    public double inputWeight(int k) {
        return inputWeight[k];
    }

    /** The certified adversary matrix Γ on D×D (symmetric, zero where f agrees). O(|D|²). */
    public double[][] adversaryMatrix() {
        int size = function.size();
        double[][] g = new double[size][size];
        for (int p = 0; p < pairZero.length; p++) {
            g[pairZero[p]][pairOne[p]] = pairWeight[p];
            g[pairOne[p]][pairZero[p]] = pairWeight[p];
        }
        return g;
    }

    /**
     * The certified witness matrix X_i on D×D of variable i (PSD; zero between the two blocks of
     * i and on inputs of a block without pairs). O(|D|²).
     */
    public double[][] witnessMatrix(int variable) {
        int size = function.size();
        double[][] x = new double[size][size];
        for (int bl = 0; bl < blockInputs.length; bl++) {
            if (blockVariable[bl] != variable) {
                continue;
            }
            int[] in = blockInputs[bl];
            for (int a = 0; a < in.length; a++) {
                for (int b = 0; b < in.length; b++) {
                    x[in[a]][in[b]] = blockMatrices[bl][a * in.length + b];
                }
            }
        }
        return x;
    }
}
