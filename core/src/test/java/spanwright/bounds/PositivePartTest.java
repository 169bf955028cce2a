package spanwright.bounds;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.junit.jupiter.api.Test;

/**
 * P₊ of a symmetric matrix by {@link PositivePart} against two references: EJML's full symmetric
 * eigendecomposition (a general-purpose library: Σ_{λ&gt;0} λuuᵀ over every eigenpair), and the
 * Moreau decomposition of a symmetric matrix into PSD parts (J. J. Moreau 1962; e.g. Boyd &amp;
 * Vandenberghe, Convex Optimization, 2004, §8.1.1 for the projection on the PSD cone): V = Z − N,
 * Z ⪰ 0, N ⪰ 0, ZN = 0.
 */
class PositivePartTest {
    private static final double TOL = 1e-11;

    /** Q diag(values) Qᵀ with Q a random orthogonal matrix (QR of a Gaussian matrix). */
    private static DMatrixRMaj withSpectrum(double[] values, Random r) {
        int n = values.length;
        DMatrixRMaj g = new DMatrixRMaj(n, n);
        for (int i = 0; i < n * n; i++) {
            g.data[i] = r.nextGaussian();
        }
        var qr = DecompositionFactory_DDRM.qr(n, n);
        qr.decompose(g);
        DMatrixRMaj q = qr.getQ(null, false);
        DMatrixRMaj qd = q.copy();
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                qd.set(i, j, q.get(i, j) * values[j]);
            }
        }
        DMatrixRMaj v = new DMatrixRMaj(n, n);
        CommonOps_DDRM.multTransB(qd, q, v);
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                double m = 0.5 * (v.get(i, j) + v.get(j, i));
                v.set(i, j, m);
                v.set(j, i, m);
            }
        }
        return v;
    }

    private static DMatrixRMaj gaussian(int n, Random r) {
        DMatrixRMaj v = new DMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            for (int j = i; j < n; j++) {
                double x = r.nextGaussian();
                v.set(i, j, x);
                v.set(j, i, x);
            }
        }
        return v;
    }

    /** Checks one matrix against both references, to {@link #TOL} × ‖V‖_F. */
    private static void check(String what, DMatrixRMaj v) {
        int n = v.numRows;
        double scale = Math.max(NormOps_DDRM.normF(v), Double.MIN_NORMAL);
        PositivePart part = new PositivePart(n);
        DMatrixRMaj z = new DMatrixRMaj(n, n);
        DMatrixRMaj neg = new DMatrixRMaj(n, n);
        assertTrue(part.split(v, z, neg), what);
        DMatrixRMaj zRef = new DMatrixRMaj(n, n);
        DMatrixRMaj nRef = new DMatrixRMaj(n, n);
        assertTrue(new PositivePart(n).fullSplit(v, zRef, nRef), what);
        DMatrixRMaj diff = new DMatrixRMaj(n, n);
        CommonOps_DDRM.subtract(z, zRef, diff);
        double e1 = NormOps_DDRM.normF(diff) / scale;
        assertTrue(e1 <= TOL, what + ": Z differs from EJML's full decomposition by " + e1 + " relative");
        CommonOps_DDRM.subtract(neg, nRef, diff);
        double e2 = NormOps_DDRM.normF(diff) / scale;
        assertTrue(e2 <= TOL, what + ": N differs from EJML's full decomposition by " + e2 + " relative");
        // Moreau: V = Z − N, both PSD, ZN = 0
        CommonOps_DDRM.subtract(z, neg, diff);
        CommonOps_DDRM.subtractEquals(diff, v);
        assertTrue(NormOps_DDRM.normF(diff) <= TOL * scale, what + ": Z − N ≠ V");
        assertTrue(GeneralAdversary.minEigenvalue(z) >= -TOL * scale, what + ": Z not PSD");
        assertTrue(GeneralAdversary.minEigenvalue(neg) >= -TOL * scale, what + ": N not PSD");
        DMatrixRMaj zn = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(z, neg, zn);
        assertTrue(NormOps_DDRM.normF(zn) <= TOL * scale * scale, what + ": ZN ≠ 0");
    }

    @Test
    void agreesWithTheFullDecompositionOnRandomMatrices() {
        Random r = new Random(20261205);
        for (int n : new int[] {1, 2, 3, 5, 17, 64, 128}) {
            for (int t = 0; t < 3; t++) {
                check("Gaussian " + n + "x" + n + " #" + t, gaussian(n, r));
            }
        }
    }

    @Test
    void agreesOnRepeatedClusteredAndOneSidedSpectra() {
        Random r = new Random(7);
        int n = 40;
        double[] repeated = new double[n];
        double[] clustered = new double[n];
        double[] straddling = new double[n];
        double[] positive = new double[n];
        double[] negative = new double[n];
        double[] lowRank = new double[n];
        for (int i = 0; i < n; i++) {
            repeated[i] = i % 3 == 0 ? 2 : i % 3 == 1 ? -1 : 0;
            clustered[i] = (i < n / 2 ? 1 : -3) + 1e-9 * i;
            straddling[i] = (i - n / 2) * 1e-13 + (i % 7 == 0 ? 5 : 0);
            positive[i] = 1 + i;
            negative[i] = -1 - i * i;
            lowRank[i] = i < 2 ? 3 - 4 * i : 0;
        }
        check("eigenvalues 2, -1, 0 repeated", withSpectrum(repeated, r));
        check("two tight clusters", withSpectrum(clustered, r));
        check("a cluster straddling zero", withSpectrum(straddling, r));
        check("positive definite", withSpectrum(positive, r));
        check("negative definite", withSpectrum(negative, r));
        check("rank 2", withSpectrum(lowRank, r));
        check("zero", new DMatrixRMaj(n, n));
        DMatrixRMaj diagonal = new DMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            diagonal.set(i, i, i % 2 == 0 ? i : -1);
        }
        check("diagonal (already tridiagonal, with repeats)", diagonal);
        DMatrixRMaj big = withSpectrum(clustered, r);
        CommonOps_DDRM.scale(1e12, big);
        check("scaled by 1e12", big);
    }
}
