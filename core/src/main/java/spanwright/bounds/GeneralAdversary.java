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
 * <p><b>Certificates.</b> The lower bound is evaluated from the solver's (Γ, α) afresh: with
 * s = max(0, −min_i λ_min(diag(α) − Γ∘Δ_i)) (EJML eigenvalues), α + s is feasible, so
 * 2Σ_F Γ / Σ(α + s) ≤ ADV±. The upper bound is evaluated from the solver's X_i after repairing
 * the pair equations exactly: each residual 1 − Σ X_i[x,y] is added to the block of the first
 * differing variable together with ρ·I, ρ ≥ the spectral norm of the residual block (its
 * Frobenius norm) plus any negative eigenvalue of X_i, which keeps every X_i PSD; the largest
 * diagonal sum is then ≥ ADV±. So the reported interval contains ADV± whatever the solver did.
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

    /** Largest m (pairs + inputs) solved by the interior-point method; larger SDPs use splitting. */
    public static final int INTERIOR_POINT_MAX_CONSTRAINTS = 1200;
    /** Relative tolerance of the splitting method. */
    public static final double SPLITTING_TOLERANCE = 1e-6;
    /** Iteration limit of the splitting method. */
    public static final int SPLITTING_MAX_ITERATIONS = 3000;
    /** The splitting method stops once upper − lower ≤ this × upper (checked every 50 iterations). */
    public static final double SPLITTING_RELATIVE_GAP = 1e-4;
    private static final int SPLITTING_CHECK_INTERVAL = 50;
    /** Multiplier step of the splitting method (Glowinski's over-relaxation; 1.6 measured ≈ 1.5× fewer iterations). */
    private static final double SPLITTING_RELAXATION = 1.6;

    /** Which solver produced the interval. */
    public enum Method {
        /** {@link InteriorPointSdp}: m ≤ {@link #INTERIOR_POINT_MAX_CONSTRAINTS}. */
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
        for (int p = 0; p < pairs; p++) {
            sdp.addConstraint(2);
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
        Layout layout = new Layout(f, pz, po, blockId, local, blockInputs);
        Certified lo;
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
            // splitting converges slowly near the end: stop once the certified interval is narrow
            SplittingSdp solver = new SplittingSdp(problem);
            solver.relaxation = SPLITTING_RELAXATION;
            while (true) {
                boolean done = solver.solve(SPLITTING_TOLERANCE,
                        Math.min(SPLITTING_CHECK_INTERVAL, SPLITTING_MAX_ITERATIONS - solver.iterations()));
                for (int bl = 0; bl < nb; bl++) {
                    xBlocks[bl] = solver.primal(bl).copy();
                }
                lo = certifyLower(layout, solver.dual());
                up = certifyUpper(layout, xBlocks, repaired);
                converged = done || up - lo.value <= SPLITTING_RELATIVE_GAP * up;
                if (converged || solver.iterations() >= SPLITTING_MAX_ITERATIONS) {
                    break;
                }
            }
            iterations = solver.iterations();
        }
        Status status = converged ? Status.CONVERGED : Status.NOT_CONVERGED;
        return new GeneralAdversary(f, lo.value, up, status, method, iterations, problem.constraintCount(),
                pz, po, lo.pairWeight, lo.inputWeight, blockInputs, blockVar, repaired);
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

        Layout(TargetFunction f, int[] pairZero, int[] pairOne, int[] blockId, int[][] local, int[][] blockInputs) {
            this.f = f;
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

    private static Certified certifyLower(Layout lay, double[] y) {
        TargetFunction f = lay.f;
        int[] pz = lay.pairZero;
        int[] po = lay.pairOne;
        int[] blockIndexOf = lay.blockId;
        double[] gamma = java.util.Arrays.copyOfRange(y, 0, pz.length);
        double[] alpha = java.util.Arrays.copyOfRange(y, pz.length, pz.length + f.size());
        int n = f.variableCount();
        int nb = lay.blockInputs.length;
        DMatrixRMaj[] zb = new DMatrixRMaj[nb];
        for (int bl = 0; bl < nb; bl++) {
            zb[bl] = new DMatrixRMaj(lay.blockInputs[bl].length, lay.blockInputs[bl].length);
        }
        for (int bc = 0; bc < 2 * n; bc++) {
            int bl = blockIndexOf[bc];
            if (bl < 0) {
                continue;
            }
            for (int k : lay.blockInputs[bl]) {
                zb[bl].set(lay.local[bc][k], lay.local[bc][k], alpha[k]);
            }
        }
        for (int p = 0; p < pz.length; p++) {
            long diff = f.input(pz[p]) ^ f.input(po[p]);
            for (int i = 0; i < n; i++) {
                if ((diff & f.variableMask(i)) != 0) {
                    int bc = blockOf(f, pz[p], i);
                    int bl = blockIndexOf[bc];
                    int a = lay.local[bc][pz[p]];
                    int b = lay.local[bc][po[p]];
                    zb[bl].set(a, b, -gamma[p]);
                    zb[bl].set(b, a, -gamma[p]);
                }
            }
        }
        double shift = 0;
        for (int bl = 0; bl < nb; bl++) {
            shift = Math.max(shift, -minEigenvalue(zb[bl]));
        }
        double total = 0;
        double[] a2 = new double[alpha.length];
        for (int k = 0; k < alpha.length; k++) {
            a2[k] = alpha[k] + shift;
            total += a2[k];
        }
        double objective = 0;
        for (double g : gamma) {
            objective += 2 * g;
        }
        if (!(total > 0) || !(objective > 0)) {
            return new Certified(0, new double[gamma.length], new double[alpha.length]);
        }
        double[] gw = new double[gamma.length];
        for (int p = 0; p < gamma.length; p++) {
            gw[p] = gamma[p] / total;
        }
        for (int k = 0; k < a2.length; k++) {
            a2[k] /= total;
        }
        return new Certified(objective / total, gw, a2);
    }

    private static double certifyUpper(Layout lay, DMatrixRMaj[] xBlocks, double[][] repairedOut) {
        TargetFunction f = lay.f;
        int[] pz = lay.pairZero;
        int[] po = lay.pairOne;
        int[] blockIndexOf = lay.blockId;
        int n = f.variableCount();
        int nb = lay.blockInputs.length;
        double[] residualSquares = new double[nb];
        double[] residual = new double[pz.length];
        int[] firstBlock = new int[pz.length];
        for (int p = 0; p < pz.length; p++) {
            long diff = f.input(pz[p]) ^ f.input(po[p]);
            double sum = 0;
            firstBlock[p] = -1;
            for (int i = 0; i < n; i++) {
                if ((diff & f.variableMask(i)) != 0) {
                    int bc = blockOf(f, pz[p], i);
                    int bl = blockIndexOf[bc];
                    sum += xBlocks[bl].get(lay.local[bc][pz[p]], lay.local[bc][po[p]]);
                    if (firstBlock[p] < 0) {
                        firstBlock[p] = bc;
                    }
                }
            }
            residual[p] = 1 - sum;
            residualSquares[blockIndexOf[firstBlock[p]]] += residual[p] * residual[p];
        }
        for (int p = 0; p < pz.length; p++) {
            int bc = firstBlock[p];
            DMatrixRMaj xb = xBlocks[blockIndexOf[bc]];
            int a = lay.local[bc][pz[p]];
            int b = lay.local[bc][po[p]];
            xb.add(a, b, residual[p]);
            xb.add(b, a, residual[p]);
        }
        double[] diagonalSum = new double[f.size()];
        for (int bl = 0; bl < nb; bl++) {
            DMatrixRMaj xb = xBlocks[bl];
            // the residual block R has spectral norm ≤ its Frobenius norm; X was PSD up to rounding
            double rho = Math.sqrt(residualSquares[bl]);
            DMatrixRMaj before = xb.copy();
            for (int i = 0; i < xb.numRows; i++) {
                before.add(i, i, rho);
            }
            double neg = Math.max(0, -minEigenvalue(before));
            double add = rho + (neg > 0 ? 2 * neg : 0);
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
