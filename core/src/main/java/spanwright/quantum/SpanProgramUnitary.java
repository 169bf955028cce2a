package spanwright.quantum;

import java.util.ArrayList;
import java.util.List;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.SingularValueDecomposition_F64;
import spanwright.model.Edge;
import spanwright.model.Scenario;

/**
 * The span-program unitary for st-connectivity, U(x) = (2Π_{ker Ã} − I)(2Π_{H̃(x)} − I), for one
 * scenario and one scale α.
 *
 * <p>Space H = span{|0⟩} ⊕ span{|e⟩ : e ∈ E} (self-loops left out, as in the analysis), dimension
 * |E| + 1; coordinate 0 is |0⟩, coordinate j ≥ 1 the j-th non-loop edge in file order
 * ({@link #edgeIndex(int)}). Ã : H → ℝ^V maps |0⟩ ↦ (|s⟩ − |t⟩)/α and |e⟩ ↦ (|u⟩ − |v⟩)/√w_e
 * (weight = resistance). H̃(x) = span{|0⟩} ⊕ span{|e⟩ : e present in G(x)}, so 2Π_{H̃(x)} − I is
 * the diagonal D(x) with +1 on |0⟩ and present edges, −1 on absent edges — the one query per
 * application. The reflection 2Π_{ker Ã} − I = I − 2QQᵀ, Q an orthonormal basis of the row space
 * of Ã, does not depend on x and is computed once here.
 * Sources: Belovs &amp; Reichardt, "Span programs and quantum algorithms for st-connectivity and
 * claw detection", ESA 2012, arXiv:1203.2603; Ito &amp; Jeffery, "Approximate span programs",
 * Algorithmica 81 (2019), arXiv:1507.00432.
 *
 * <p>Method: the row space comes from EJML's SVD of Ã (rank by the usual tolerance
 * max(|V|, |E|+1) · 2⁻⁵² · σ_max). Cost O(|V| (|E|+1)²) once; {@link #unitary} is O((|E|+1)²).
 * Immutable after construction.
 */
public final class SpanProgramUnitary {
    /** 2^-52, the spacing of doubles at 1 (Math.ulp(1.0) on a correct JVM). */
    static final double MACHINE_EPSILON = 2.220446049250313e-16;

    private final Scenario scenario;
    private final double alpha2;
    private final int dim;
    private final int[] edgeIndex;
    private final DMatrixRMaj targetMap;
    private final DMatrixRMaj reflection;
    private final int rank;

    /**
     * @param alpha2 α² &gt; 0, finite
     */
    public SpanProgramUnitary(Scenario scenario, double alpha2) {
        if (!(alpha2 > 0) || Double.isInfinite(alpha2)) {
            throw new IllegalArgumentException("alpha² must be finite and > 0, got " + alpha2);
        }
        this.scenario = scenario;
        this.alpha2 = alpha2;
        List<Integer> kept = new ArrayList<>();
        for (int i = 0; i < scenario.edges().size(); i++) {
            if (!scenario.edges().get(i).isSelfLoop()) {
                kept.add(i);
            }
        }
        edgeIndex = new int[kept.size()];
        for (int j = 0; j < edgeIndex.length; j++) {
            edgeIndex[j] = kept.get(j);
        }
        dim = edgeIndex.length + 1;
        targetMap = buildTargetMap();
        int nv = scenario.vertexCount();
        // row space of Ã = span of the right singular vectors with σ > tolerance
        SingularValueDecomposition_F64<DMatrixRMaj> svd =
                DecompositionFactory_DDRM.svd(nv, dim, false, true, true);
        if (!svd.decompose(targetMap.copy())) {
            throw new IllegalStateException("EJML SVD of the target map did not converge");
        }
        double[] sv = svd.getSingularValues();
        int count = svd.numberOfSingularValues();
        DMatrixRMaj v = svd.getV(null, false); // dim × count, columns = right singular vectors
        double max = 0;
        for (int k = 0; k < count; k++) {
            max = Math.max(max, sv[k]);
        }
        // 2^-52 written out: TeaVM 0.16's Math.ulp(double) returns a wrong value in the page
        double tol = Math.max(nv, dim) * MACHINE_EPSILON * max;
        reflection = new DMatrixRMaj(dim, dim);
        for (int i = 0; i < dim; i++) {
            reflection.set(i, i, 1.0);
        }
        int r = 0;
        for (int k = 0; k < count; k++) {
            if (sv[k] > tol) {
                r++;
                for (int i = 0; i < dim; i++) {
                    double vik = v.get(i, k);
                    if (vik == 0) {
                        continue;
                    }
                    for (int j = 0; j < dim; j++) {
                        reflection.add(i, j, -2 * vik * v.get(j, k));
                    }
                }
            }
        }
        rank = r;
    }

    private DMatrixRMaj buildTargetMap() {
        int nv = scenario.vertexCount();
        DMatrixRMaj a = new DMatrixRMaj(nv, dim);
        double inv = 1 / Math.sqrt(alpha2);
        a.set(scenario.s(), 0, inv);
        a.set(scenario.t(), 0, -inv);
        for (int j = 0; j < edgeIndex.length; j++) {
            Edge e = scenario.edges().get(edgeIndex[j]);
            double c = 1 / Math.sqrt(e.weight());
            a.add(e.u(), j + 1, c);
            a.add(e.v(), j + 1, -c);
        }
        return a;
    }

    public Scenario scenario() {
        return scenario;
    }

    /** α². */
    public double alpha2() {
        return alpha2;
    }

    /** Dimension |E| + 1 of the space (self-loops not counted). */
    public int dimension() {
        return dim;
    }

    /** Number of edges in the space (non-loop edges). */
    public int edgeCount() {
        return edgeIndex.length;
    }

    /** Index into {@code scenario.edges()} of coordinate {@code j + 1}. */
    public int edgeIndex(int j) {
        return edgeIndex[j];
    }

    /** Rank of Ã (so dim ker Ã = dimension − rank). */
    public int rank() {
        return rank;
    }

    /** A copy of Ã, |V| × (|E| + 1). */
    public DMatrixRMaj targetMap() {
        return targetMap.copy();
    }

    /** A copy of 2Π_{ker Ã} − I. */
    public DMatrixRMaj kernelReflection() {
        return reflection.copy();
    }

    /** Entry (i, j) of 2Π_{ker Ã} − I (no copy). */
    double reflectionEntry(int i, int j) {
        return reflection.get(i, j);
    }

    /**
     * The signs of D(x) = 2Π_{H̃(x)} − I: +1 for |0⟩ and present edges, −1 for absent ones.
     *
     * @param present presence of every edge of the scenario, in file order
     */
    public double[] querySigns(boolean[] present) {
        double[] d = new double[dim];
        d[0] = 1;
        for (int j = 0; j < edgeIndex.length; j++) {
            d[j + 1] = present[edgeIndex[j]] ? 1 : -1;
        }
        return d;
    }

    /** U(x) = (2Π_{ker Ã} − I) D(x) as a new matrix. O((|E|+1)²). */
    public DMatrixRMaj unitary(boolean[] present) {
        double[] d = querySigns(present);
        DMatrixRMaj u = new DMatrixRMaj(dim, dim);
        for (int i = 0; i < dim; i++) {
            for (int j = 0; j < dim; j++) {
                u.set(i, j, reflection.get(i, j) * d[j]);
            }
        }
        return u;
    }

    /**
     * max |(RᵀR − I)_{ij}| for R = 2Π_{ker Ã} − I. Since D(x) is a diagonal of ±1 (exact in
     * floating point), U(x)ᵀU(x) − I = D(RᵀR − I)D has the same entries up to sign: this is the
     * orthogonality defect of every U(x). O((|E|+1)³).
     */
    public double orthogonalityDefect() {
        DMatrixRMaj g = new DMatrixRMaj(dim, dim);
        CommonOps_DDRM.multTransA(reflection, reflection, g);
        for (int i = 0; i < dim; i++) {
            g.add(i, i, -1.0);
        }
        return CommonOps_DDRM.elementMaxAbs(g);
    }
}
