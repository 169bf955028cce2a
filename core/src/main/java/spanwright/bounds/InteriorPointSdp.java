package spanwright.bounds;

import java.util.ArrayList;
import java.util.List;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.decomposition.TriangularSolver_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.decomposition.CholeskyDecomposition_F64;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * A primal–dual interior-point method for the block SDP {@link SdpProblem}: infeasible start
 * X = ξI, Z = ηI, y = 0; the HKM search direction (Helmberg, Rendl, Vanderbei &amp; Wolkowicz,
 * SIAM J. Optimization 6(2), 1996; Kojima, Shindoh &amp; Hara, SIAM J. Optimization 7(1), 1997;
 * Monteiro, SIAM J. Optimization 7(3), 1997) with Mehrotra's predictor–corrector and the
 * step-length rule of SDPT3 (Toh, Todd &amp; Tütüncü, Optimization Methods and Software 11, 1999).
 *
 * <p>Each iteration forms the Schur complement M_kl = tr(A_k X A_l Z⁻¹) from the sparse A_k —
 * O(Σ_blocks (constraints in the block)² · entries²) — factors it by EJML's Cholesky (O(m³)) and
 * solves it twice; the block operations (Cholesky, inverse, products, the symmetric eigenvalues
 * that give the longest step keeping X and Z positive definite) are EJML's, O(Σ d³). For the
 * adversary SDP of n ≤ 6 variables m ≤ 1,088 and an iteration costs a fraction of a second.
 *
 * <p>Written here because neither dependency offers an SDP solver; EJML supplies every matrix
 * factorisation. The solver proves nothing by itself: {@link GeneralAdversary} turns its output
 * into certified bounds, so a poorly converged run gives a wider interval, never a wrong one.
 *
 * <p><b>Mutable and single-threaded</b>; one instance per problem; work matrices are allocated
 * once per block at construction and reused by every iteration.
 */
final class InteriorPointSdp {
    /** Outcome of {@link #solve}. */
    enum Status {
        /** Relative gap and infeasibilities below the tolerance. */
        CONVERGED,
        /** The iteration limit was reached first. */
        ITERATION_LIMIT,
        /** The Schur complement lost definiteness or the steps became too short to progress. */
        STALLED
    }

    private final SdpProblem p;
    private final int m;
    private final int nb;
    private final int[] size;
    private final int totalDim;
    // per block: constraints with entries there (slots), their directed entries
    private final int[][] slotConstraint;
    private final int[][] slotStart;
    private final int[][] entryRow;
    private final int[][] entryCol;
    private final double[][] entryValue;

    private final DMatrixRMaj[] x;
    private final DMatrixRMaj[] z;
    private final double[] y;
    private final DMatrixRMaj[] zInv;
    private final DMatrixRMaj[] lxInv;
    private final DMatrixRMaj[] lzInv;
    private final DMatrixRMaj[] rd;
    private final DMatrixRMaj[] cost;
    private final DMatrixRMaj[] dx;
    private final DMatrixRMaj[] dz;
    private final DMatrixRMaj[] dxa;
    private final DMatrixRMaj[] dza;
    private final DMatrixRMaj[] t1;
    private final DMatrixRMaj[] t2;
    private final DMatrixRMaj[] corr;
    private final CholeskyDecomposition_F64<DMatrixRMaj>[] chol;
    private final EigenDecomposition_F64<DMatrixRMaj>[] eig;
    /** The Schur complement (m×m, or orbits×orbits with {@link #constraintOrbits}); made by solve. */
    private DMatrixRMaj schur;
    /** Orbit of each constraint under a symmetry group of the problem, or null; see {@link #constraintOrbits}. */
    private int[] orbitOf;
    private int orbitCount;
    private final double[] rp;
    private final double[] rhs;
    private final double[] work;

    private int iterations;
    private Status status;

    @SuppressWarnings({"unchecked", "rawtypes"})
    InteriorPointSdp(SdpProblem problem) {
        this.p = problem;
        this.m = problem.constraintCount();
        this.nb = problem.blockCount();
        this.size = problem.blockSizes.clone();
        this.totalDim = problem.totalDimension();
        // group the entries by block, constraint by constraint
        List<List<Integer>> slotK = new ArrayList<>();
        List<List<Integer>> slotS = new ArrayList<>();
        List<List<int[]>> ent = new ArrayList<>();
        List<List<Double>> val = new ArrayList<>();
        for (int bl = 0; bl < nb; bl++) {
            slotK.add(new ArrayList<>());
            slotS.add(new ArrayList<>());
            ent.add(new ArrayList<>());
            val.add(new ArrayList<>());
        }
        for (int k = 0; k < m; k++) {
            for (int e = p.start[k]; e < p.start[k + 1]; e++) {
                int bl = p.block[e];
                List<Integer> ks = slotK.get(bl);
                if (ks.isEmpty() || ks.get(ks.size() - 1) != k) {
                    ks.add(k);
                    slotS.get(bl).add(ent.get(bl).size());
                }
                int r = p.row[e];
                int c = p.col[e];
                ent.get(bl).add(new int[] {r, c});
                val.get(bl).add(p.value[e]);
                if (r != c) {
                    ent.get(bl).add(new int[] {c, r});
                    val.get(bl).add(p.value[e]);
                }
            }
        }
        slotConstraint = new int[nb][];
        slotStart = new int[nb][];
        entryRow = new int[nb][];
        entryCol = new int[nb][];
        entryValue = new double[nb][];
        for (int bl = 0; bl < nb; bl++) {
            int s = slotK.get(bl).size();
            slotConstraint[bl] = new int[s];
            slotStart[bl] = new int[s + 1];
            for (int i = 0; i < s; i++) {
                slotConstraint[bl][i] = slotK.get(bl).get(i);
                slotStart[bl][i] = slotS.get(bl).get(i);
            }
            int ne = ent.get(bl).size();
            slotStart[bl][s] = ne;
            entryRow[bl] = new int[ne];
            entryCol[bl] = new int[ne];
            entryValue[bl] = new double[ne];
            for (int i = 0; i < ne; i++) {
                entryRow[bl][i] = ent.get(bl).get(i)[0];
                entryCol[bl][i] = ent.get(bl).get(i)[1];
                entryValue[bl][i] = val.get(bl).get(i);
            }
        }
        x = p.newBlocks();
        z = p.newBlocks();
        zInv = p.newBlocks();
        lxInv = p.newBlocks();
        lzInv = p.newBlocks();
        rd = p.newBlocks();
        cost = problem.costMatrices();
        dx = p.newBlocks();
        dz = p.newBlocks();
        dxa = p.newBlocks();
        dza = p.newBlocks();
        t1 = p.newBlocks();
        t2 = p.newBlocks();
        corr = p.newBlocks();
        chol = new CholeskyDecomposition_F64[nb];
        eig = new EigenDecomposition_F64[nb];
        for (int bl = 0; bl < nb; bl++) {
            chol[bl] = DecompositionFactory_DDRM.chol(size[bl], true);
            eig[bl] = DecompositionFactory_DDRM.eig(size[bl], false, true);
        }
        y = new double[m];
        rp = new double[m];
        rhs = new double[m];
        work = new double[m];
    }

    /**
     * Asked, once the relative duality gap is below {@link #MONITOR_FROM}, at the start of each
     * iteration whether the current iterate is good enough (e.g. its certified interval is narrow):
     * true stops the method with {@link Status#CONVERGED}. An iteration at m ≈ 4,000 costs seconds,
     * a certificate a fraction of one.
     */
    interface Monitor {
        boolean enough(InteriorPointSdp solver);
    }

    /**
     * Factors on SDPT3's starting X = ξI and Z = ηI for {@link #smallStart()}. On the adversary SDP
     * SDPT3's rule starts far outside the central path (the first four or five iterations only
     * restore feasibility); measured on seeded random 6-variable functions, the smaller start saves
     * about 2.5 of 20 iterations (6 to 7 of 24 at 7 variables with the certified stop), but it
     * fails to converge on tiny SDPs (OR of 1–6 variables), so it is an option.
     */
    private static final double SMALL_START_PRIMAL = 0.01;
    private static final double SMALL_START_DUAL = 0.1;

    private boolean smallStart;

    /** Starts from SDPT3's X and Z scaled by 0.01 and 0.1 (see {@link #SMALL_START_PRIMAL}). */
    InteriorPointSdp smallStart() {
        smallStart = true;
        return this;
    }

    /** Relative duality gap below which a {@link Monitor} is consulted. */
    static final double MONITOR_FROM = 1e-4;

    /**
     * Runs the method until the relative duality gap and the relative primal and dual
     * infeasibilities are all below {@code tolerance}, or {@code maxIterations} pass.
     */
    Status solve(double tolerance, int maxIterations) {
        return solve(tolerance, maxIterations, null);
    }

    /** As {@link #solve(double, int)}, also stopping when {@code monitor} (may be null) says so. */
    Status solve(double tolerance, int maxIterations, Monitor monitor) {
        initialise();
        int reduced = schurSize();
        schur = new DMatrixRMaj(reduced, reduced);
        double bNorm = Math.sqrt(SdpProblem.dot(p.b, p.b));
        double cNorm = SdpProblem.frobenius(cost);
        iterations = 0;
        status = Status.ITERATION_LIMIT;
        LinearSolverDense<DMatrixRMaj> solver = LinearSolverFactory_DDRM.symmPosDef(reduced);
        for (int it = 0; it < maxIterations; it++) {
            // residuals and measures
            p.apply(x, work);
            for (int k = 0; k < m; k++) {
                rp[k] = p.b[k] - work[k];
            }
            p.adjoint(y, rd);
            for (int bl = 0; bl < nb; bl++) {
                CommonOps_DDRM.subtract(cost[bl], rd[bl], rd[bl]);
                CommonOps_DDRM.subtractEquals(rd[bl], z[bl]);
            }
            double mu = SdpProblem.inner(x, z) / totalDim;
            double pobj = SdpProblem.inner(cost, x);
            double dobj = SdpProblem.dot(p.b, y);
            double gap = Math.abs(pobj - dobj) / (1 + Math.abs(pobj) + Math.abs(dobj));
            double pinf = Math.sqrt(SdpProblem.dot(rp, rp)) / (1 + bNorm);
            double dinf = SdpProblem.frobenius(rd) / (1 + cNorm);
            if (gap < tolerance && pinf < tolerance && dinf < tolerance) {
                status = Status.CONVERGED;
                break;
            }
            if (monitor != null && gap < MONITOR_FROM && monitor.enough(this)) {
                status = Status.CONVERGED;
                break;
            }
            iterations++;
            // factor-dependent quantities
            for (int bl = 0; bl < nb; bl++) {
                if (!inverseFactor(bl, x[bl], lxInv[bl]) || !inverseFactor(bl, z[bl], lzInv[bl])) {
                    status = Status.STALLED;
                    return status;
                }
                CommonOps_DDRM.multTransA(lzInv[bl], lzInv[bl], zInv[bl]);
            }
            buildSchur();
            if (!factor(solver)) {
                status = Status.STALLED;
                return status;
            }
            // predictor: M Δy = b + A(X Rd Z⁻¹)
            for (int bl = 0; bl < nb; bl++) {
                CommonOps_DDRM.mult(x[bl], rd[bl], t1[bl]);
                CommonOps_DDRM.mult(t1[bl], zInv[bl], t2[bl]);
            }
            p.apply(t2, rhs);
            for (int k = 0; k < m; k++) {
                rhs[k] += p.b[k];
            }
            double[] base = rhs.clone();
            direction(solver, rhs, 0, false);
            double ap = Math.min(1, maxStep(lxInv, dx));
            double ad = Math.min(1, maxStep(lzInv, dz));
            double muAff = 0;
            for (int bl = 0; bl < nb; bl++) {
                muAff += innerStep(x[bl], dx[bl], ap, z[bl], dz[bl], ad);
            }
            muAff /= totalDim;
            double sigma = Math.min(1, Math.pow(Math.max(0, muAff) / mu, 3));
            double tau = 0.9 + 0.09 * Math.min(ap, ad);
            // corrector: M Δy = b + A(X Rd Z⁻¹) − σμ A(Z⁻¹) + A(ΔXa ΔZa Z⁻¹)
            for (int bl = 0; bl < nb; bl++) {
                dxa[bl].setTo(dx[bl]);
                dza[bl].setTo(dz[bl]);
                CommonOps_DDRM.mult(dxa[bl], dza[bl], t1[bl]);
                CommonOps_DDRM.mult(t1[bl], zInv[bl], corr[bl]);
            }
            p.apply(zInv, work);
            p.apply(corr, rhs);
            for (int k = 0; k < m; k++) {
                rhs[k] = base[k] - sigma * mu * work[k] + rhs[k];
            }
            direction(solver, rhs, sigma * mu, true);
            ap = Math.min(1, tau * maxStep(lxInv, dx));
            ad = Math.min(1, tau * maxStep(lzInv, dz));
            if (ap < 1e-12 && ad < 1e-12) {
                status = Status.STALLED;
                break;
            }
            for (int bl = 0; bl < nb; bl++) {
                CommonOps_DDRM.addEquals(x[bl], ap, dx[bl]);
                CommonOps_DDRM.addEquals(z[bl], ad, dz[bl]);
            }
            for (int k = 0; k < m; k++) {
                y[k] += ad * work[k];
            }
        }
        return status;
    }

    /** Δy into {@link #work}, then ΔZ and ΔX; the corrector adds the second-order term. */
    private void direction(LinearSolverDense<DMatrixRMaj> solver, double[] right, double sigmaMu, boolean corrector) {
        if (orbitOf == null) {
            DMatrixRMaj bvec = DMatrixRMaj.wrap(m, 1, right.clone());
            DMatrixRMaj sol = new DMatrixRMaj(m, 1);
            solver.solve(bvec, sol);
            System.arraycopy(sol.data, 0, work, 0, m);
        } else {
            // Pᵀ M P ỹ = Pᵀ r with P the constraint-to-orbit indicator; Δy = P ỹ
            DMatrixRMaj bvec = new DMatrixRMaj(orbitCount, 1);
            for (int k = 0; k < m; k++) {
                bvec.data[orbitOf[k]] += right[k];
            }
            DMatrixRMaj sol = new DMatrixRMaj(orbitCount, 1);
            solver.solve(bvec, sol);
            for (int k = 0; k < m; k++) {
                work[k] = sol.data[orbitOf[k]];
            }
        }
        p.adjoint(work, dz);
        for (int bl = 0; bl < nb; bl++) {
            CommonOps_DDRM.subtract(rd[bl], dz[bl], dz[bl]);
            // ΔX = σμ Z⁻¹ − X − X ΔZ Z⁻¹ (− ΔXa ΔZa Z⁻¹), symmetrised
            CommonOps_DDRM.mult(x[bl], dz[bl], t1[bl]);
            CommonOps_DDRM.mult(t1[bl], zInv[bl], t2[bl]);
            int s = size[bl];
            double[] d = dx[bl].data;
            double[] zi = zInv[bl].data;
            double[] xd = x[bl].data;
            double[] t = t2[bl].data;
            double[] cr = corr[bl].data;
            for (int i = 0; i < s * s; i++) {
                d[i] = sigmaMu * zi[i] - xd[i] - t[i] - (corrector ? cr[i] : 0);
            }
            for (int i = 0; i < s; i++) {
                for (int j = i + 1; j < s; j++) {
                    double v = 0.5 * (d[i * s + j] + d[j * s + i]);
                    d[i * s + j] = v;
                    d[j * s + i] = v;
                }
            }
        }
    }

    private void initialise() {
        double xi = 10;
        double eta = 10;
        double sq = Math.sqrt(totalDim);
        xi = Math.max(xi, sq);
        eta = Math.max(eta, sq);
        for (int k = 0; k < m; k++) {
            double an = p.constraintNormSquared(k);
            an = Math.sqrt(an);
            xi = Math.max(xi, sq * (1 + Math.abs(p.b[k])) / (1 + an));
            eta = Math.max(eta, an);
        }
        eta = Math.max(eta, SdpProblem.frobenius(cost));
        if (smallStart) {
            xi *= SMALL_START_PRIMAL;
            eta *= SMALL_START_DUAL;
        }
        for (int bl = 0; bl < nb; bl++) {
            x[bl].zero();
            z[bl].zero();
            for (int i = 0; i < size[bl]; i++) {
                x[bl].set(i, i, xi);
                z[bl].set(i, i, eta);
            }
        }
        java.util.Arrays.fill(y, 0);
    }

    /** Lower Cholesky factor of {@code a}, inverted into {@code out}; false if not PD. */
    private boolean inverseFactor(int bl, DMatrixRMaj a, DMatrixRMaj out) {
        DMatrixRMaj c = a.copy();
        if (!chol[bl].decompose(c)) {
            return false;
        }
        DMatrixRMaj l = chol[bl].getT(null);
        int s = size[bl];
        for (int i = 0; i < s; i++) {
            for (int j = i + 1; j < s; j++) {
                l.set(i, j, 0);
            }
        }
        TriangularSolver_DDRM.invertLower(l.data, s);
        out.setTo(l);
        return true;
    }

    /**
     * Largest α with A + αΔ ⪰ 0 over all blocks, given L⁻¹ for A = LLᵀ: α = −1/λ_min(L⁻¹ΔL⁻ᵀ)
     * when that eigenvalue is negative (else unbounded, reported as 1e30).
     */
    private double maxStep(DMatrixRMaj[] lInv, DMatrixRMaj[] delta) {
        double alpha = 1e30;
        for (int bl = 0; bl < nb; bl++) {
            CommonOps_DDRM.mult(lInv[bl], delta[bl], t1[bl]);
            CommonOps_DDRM.multTransB(t1[bl], lInv[bl], t2[bl]);
            if (!eig[bl].decompose(t2[bl].copy())) {
                return 0;
            }
            double min = Double.POSITIVE_INFINITY;
            for (int i = 0; i < size[bl]; i++) {
                min = Math.min(min, eig[bl].getEigenvalue(i).real);
            }
            if (min < 0) {
                alpha = Math.min(alpha, -1 / min);
            }
        }
        return alpha;
    }

    private static double innerStep(DMatrixRMaj x, DMatrixRMaj dx, double ap, DMatrixRMaj z, DMatrixRMaj dz, double ad) {
        double s = 0;
        double[] xd = x.data;
        double[] dxd = dx.data;
        double[] zd = z.data;
        double[] dzd = dz.data;
        for (int i = 0; i < xd.length; i++) {
            s += (xd[i] + ap * dxd[i]) * (zd[i] + ad * dzd[i]);
        }
        return s;
    }

    /** M_kl = Σ_blocks tr(A_k X A_l Z⁻¹), assembled from the directed sparse entries. */
    private void buildSchur() {
        if (orbitOf != null) {
            buildReducedSchur();
            return;
        }
        schur.zero();
        double[] md = schur.data;
        for (int bl = 0; bl < nb; bl++) {
            int s = size[bl];
            double[] xd = x[bl].data;
            double[] zd = zInv[bl].data;
            int[] ks = slotConstraint[bl];
            int[] st = slotStart[bl];
            int[] er = entryRow[bl];
            int[] ec = entryCol[bl];
            double[] ev = entryValue[bl];
            for (int a = 0; a < ks.length; a++) {
                int k = ks[a];
                for (int b2 = a; b2 < ks.length; b2++) {
                    int l = ks[b2];
                    double sum = 0;
                    for (int e = st[a]; e < st[a + 1]; e++) {
                        int r = er[e];
                        int c = ec[e];
                        double v = ev[e];
                        for (int f = st[b2]; f < st[b2 + 1]; f++) {
                            sum += v * ev[f] * xd[c * s + er[f]] * zd[ec[f] * s + r];
                        }
                    }
                    md[k * m + l] += sum;
                }
            }
        }
        for (int k = 0; k < m; k++) {
            for (int l = k + 1; l < m; l++) {
                md[l * m + k] = md[k * m + l];
            }
        }
    }

    /**
     * S = Pᵀ M P over constraint orbits (P the constraint-to-orbit indicator), S_KL = Σ_{k∈K, l∈L}
     * M_kl from every row of M: with X and Z exactly invariant one row per orbit would do, but
     * their rounding drift then spoils the direction (measured: 58 iterations instead of 13 on a
     * 7-leaf read-once formula), while the projection stays the exact Newton system restricted to
     * invariant Δy. Costs what {@link #buildSchur} costs; the factorisation is c×c.
     */
    private void buildReducedSchur() {
        schur.zero();
        int c = orbitCount;
        double[] sd = schur.data;
        for (int bl = 0; bl < nb; bl++) {
            int s = size[bl];
            double[] xd = x[bl].data;
            double[] zd = zInv[bl].data;
            int[] ks = slotConstraint[bl];
            int[] st = slotStart[bl];
            int[] er = entryRow[bl];
            int[] ec = entryCol[bl];
            double[] ev = entryValue[bl];
            for (int a = 0; a < ks.length; a++) {
                int kk = orbitOf[ks[a]];
                for (int b2 = 0; b2 < ks.length; b2++) {
                    double sum = 0;
                    for (int e = st[a]; e < st[a + 1]; e++) {
                        int r = er[e];
                        int col = ec[e];
                        double v = ev[e];
                        for (int f = st[b2]; f < st[b2 + 1]; f++) {
                            sum += v * ev[f] * xd[col * s + er[f]] * zd[ec[f] * s + r];
                        }
                    }
                    sd[kk * c + orbitOf[ks[b2]]] += sum;
                }
            }
        }
        // symmetric up to the order of summation
        for (int k = 0; k < c; k++) {
            for (int l = k + 1; l < c; l++) {
                double v = 0.5 * (sd[k * c + l] + sd[l * c + k]);
                sd[k * c + l] = v;
                sd[l * c + k] = v;
            }
        }
    }

    /**
     * Declares orbits of the constraints under a group of symmetries of the problem (signed
     * permutations of the blocks that map constraints to constraints, b and C invariant). The
     * start and every direction are then invariant, so y is constant on each orbit and the Schur
     * system is solved over orbits: a c×c Cholesky factorisation (c = number of orbits) instead of
     * m×m. Call before {@link #solve}.
     */
    InteriorPointSdp constraintOrbits(int[] orbit) {
        int c = 0;
        for (int o : orbit) {
            c = Math.max(c, o + 1);
        }
        orbitOf = orbit.clone();
        orbitCount = c;
        return this;
    }

    /** Order of the Schur system: m, or the number of constraint orbits. */
    int schurSize() {
        return orbitOf == null ? m : orbitCount;
    }

    /** Cholesky of the Schur complement, with a growing diagonal shift if it is not numerically PD. */
    private boolean factor(LinearSolverDense<DMatrixRMaj> solver) {
        double maxDiag = 0;
        int order = schur.numRows;
        for (int k = 0; k < order; k++) {
            maxDiag = Math.max(maxDiag, schur.get(k, k));
        }
        double shift = 0;
        for (int attempt = 0; attempt < 6; attempt++) {
            DMatrixRMaj a = schur.copy();
            for (int k = 0; k < order; k++) {
                a.add(k, k, shift);
            }
            if (solver.setA(a)) {
                return true;
            }
            shift = shift == 0 ? 1e-14 * Math.max(1, maxDiag) : shift * 100;
        }
        return false;
    }

    // ----------------------------------------------------------------- results

    int iterations() {
        return iterations;
    }

    Status status() {
        return status;
    }

    /** The primal iterate X (block {@code bl}); caller must not modify it. */
    DMatrixRMaj primal(int bl) {
        return x[bl];
    }

    /** The dual iterate y. */
    double[] dual() {
        return y.clone();
    }

    /** ⟨C, X⟩ of the current iterate. */
    double primalObjective() {
        return SdpProblem.inner(cost, x);
    }

    /** bᵀy of the current iterate. */
    double dualObjective() {
        return SdpProblem.dot(p.b, y);
    }
}
