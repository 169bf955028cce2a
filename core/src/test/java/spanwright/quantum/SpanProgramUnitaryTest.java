package spanwright.quantum;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.model.Edge;
import spanwright.model.Scenario;

class SpanProgramUnitaryTest {

    /** Ã written out from its definition (|0⟩ ↦ (|s⟩−|t⟩)/α, |e⟩ ↦ (|u⟩−|v⟩)/√w_e), self-loops left out. */
    private static DMatrixRMaj targetMapByHand(Scenario sc, double alpha2) {
        int m = 0;
        for (Edge e : sc.edges()) {
            if (!e.isSelfLoop()) {
                m++;
            }
        }
        DMatrixRMaj a = new DMatrixRMaj(sc.vertexCount(), m + 1);
        a.set(sc.s(), 0, 1 / Math.sqrt(alpha2));
        a.set(sc.t(), 0, -1 / Math.sqrt(alpha2));
        int j = 1;
        for (Edge e : sc.edges()) {
            if (!e.isSelfLoop()) {
                a.add(e.u(), j, 1 / Math.sqrt(e.weight()));
                a.add(e.v(), j, -1 / Math.sqrt(e.weight()));
                j++;
            }
        }
        return a;
    }

    @Test
    void unitaryIsRealOrthogonalOnEveryInput() {
        // Identity: a product of two reflections is orthogonal, UᵀU = I (common practice, no source).
        Random rnd = new Random(7);
        for (int trial = 0; trial < 6; trial++) {
            Scenario sc = QuantumNets.random(rnd, 4, 6 + trial, 9 + 2 * trial);
            SpanProgramUnitary u = new SpanProgramUnitary(sc, 0.5 + trial);
            for (long x = 0; x < 16; x++) {
                DMatrixRMaj ux = u.unitary(Analysis.presentEdges(sc, x));
                DMatrixRMaj g = new DMatrixRMaj(ux.numRows, ux.numRows);
                CommonOps_DDRM.multTransA(ux, ux, g);
                for (int i = 0; i < g.numRows; i++) {
                    g.add(i, i, -1);
                }
                assertTrue(CommonOps_DDRM.elementMaxAbs(g) < 1e-12, "trial " + trial + " x " + x);
            }
            assertTrue(u.orthogonalityDefect() < 1e-12);
        }
    }

    @Test
    void kernelReflectionMatchesAnIndependentPseudoInverse() {
        // Independent computation: Π_ker Ã = I − Ã⁺Ã with EJML's pseudo-inverse of Ã built by hand
        // from the definition; the production path uses the SVD's row space instead.
        Random rnd = new Random(11);
        for (int trial = 0; trial < 5; trial++) {
            Scenario sc = QuantumNets.random(rnd, 3, 5 + trial, 8 + trial);
            double alpha2 = 0.3 + 1.7 * trial;
            DMatrixRMaj a = targetMapByHand(sc, alpha2);
            DMatrixRMaj pinv = new DMatrixRMaj(a.numCols, a.numRows);
            CommonOps_DDRM.pinv(a, pinv);
            DMatrixRMaj proj = new DMatrixRMaj(a.numCols, a.numCols);
            CommonOps_DDRM.mult(pinv, a, proj);
            SpanProgramUnitary u = new SpanProgramUnitary(sc, alpha2);
            DMatrixRMaj r = u.kernelReflection();
            for (int i = 0; i < a.numCols; i++) {
                for (int j = 0; j < a.numCols; j++) {
                    double expected = 2 * ((i == j ? 1 : 0) - proj.get(i, j)) - (i == j ? 1 : 0);
                    assertEquals(expected, r.get(i, j), 1e-10, "trial " + trial + " (" + i + "," + j + ")");
                }
            }
            // and Ã is the map of the definition
            assertTrue(CommonOps_DDRM.elementMaxAbs(diff(a, u.targetMap())) < 1e-15);
            // reflection identities: R = Rᵀ, R² = I, ÃR = −Ã (R is −1 on the row space) — common practice
            DMatrixRMaj r2 = new DMatrixRMaj(r.numRows, r.numRows);
            CommonOps_DDRM.mult(r, r, r2);
            for (int i = 0; i < r.numRows; i++) {
                r2.add(i, i, -1);
            }
            assertTrue(CommonOps_DDRM.elementMaxAbs(r2) < 1e-12);
            DMatrixRMaj rt = r.copy();
            CommonOps_DDRM.transpose(rt);
            assertTrue(CommonOps_DDRM.elementMaxAbs(diff(r, rt)) < 1e-12);
            DMatrixRMaj ar = new DMatrixRMaj(a.numRows, a.numCols);
            CommonOps_DDRM.mult(a, r, ar);
            CommonOps_DDRM.addEquals(ar, a);
            assertTrue(CommonOps_DDRM.elementMaxAbs(ar) < 1e-12);
        }
    }

    @Test
    void queryReflectionFlipsExactlyTheAbsentEdges() {
        // Definition: 2Π_H̃(x) − I is +1 on |0⟩ and present edges, −1 on absent ones, so
        // U(x) = R·D(x) column by column.
        Scenario sc = QuantumNets.or(3, null);
        SpanProgramUnitary u = new SpanProgramUnitary(sc, 1);
        boolean[] present = Analysis.presentEdges(sc, 0b101);
        double[] d = u.querySigns(present);
        assertEquals(1, d[0]);
        assertEquals(1, d[1]);
        assertEquals(-1, d[2]);
        assertEquals(1, d[3]);
        DMatrixRMaj ux = u.unitary(present);
        DMatrixRMaj r = u.kernelReflection();
        for (int i = 0; i < 4; i++) {
            for (int j = 0; j < 4; j++) {
                assertEquals(r.get(i, j) * d[j], ux.get(i, j), 0.0);
            }
        }
        // OR_3: Ã has rank 1 (two vertices, one component), so dim ker Ã = 3 (derived)
        assertEquals(1, u.rank());
        assertEquals(4, u.dimension());
    }

    private static DMatrixRMaj diff(DMatrixRMaj a, DMatrixRMaj b) {
        DMatrixRMaj c = a.copy();
        CommonOps_DDRM.subtractEquals(c, b);
        return c;
    }
}
