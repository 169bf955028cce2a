package spanwright.bounds;

import java.util.Arrays;
import org.ejml.data.DMatrixRMaj;

/**
 * A semidefinite programme in block form, the input of {@link InteriorPointSdp}:
 * <pre>
 *   (P)  minimise ⟨C, X⟩  subject to ⟨A_k, X⟩ = b_k (k = 1..m),  X ⪰ 0
 *   (D)  maximise bᵀy     subject to Σ_k y_k A_k + Z = C,        Z ⪰ 0
 * </pre>
 * where X, Z, C and every A_k are symmetric and block-diagonal with the given block sizes, and C
 * and the A_k are sparse. An entry (block, r, c, v) with r ≠ c stands for v at both (r, c) and
 * (c, r). Weak duality: bᵀy ≤ ⟨C, X⟩ for every feasible pair. Immutable once built.
 */
final class SdpProblem {
    final int[] blockSizes;
    final double[] b;
    /** Entries of constraint k are {@code start[k] .. start[k+1]-1}. */
    final int[] start;
    final int[] block;
    final int[] row;
    final int[] col;
    final double[] value;
    final int[] costBlock;
    final int[] costRow;
    final int[] costCol;
    final double[] costValue;

    private SdpProblem(Builder bu) {
        blockSizes = Arrays.copyOf(bu.blockSizes, bu.blocks);
        b = Arrays.copyOf(bu.b, bu.constraints);
        start = Arrays.copyOf(bu.start, bu.constraints + 1);
        start[bu.constraints] = bu.entries.size;
        block = Arrays.copyOf(bu.entries.block, bu.entries.size);
        row = Arrays.copyOf(bu.entries.row, bu.entries.size);
        col = Arrays.copyOf(bu.entries.col, bu.entries.size);
        value = Arrays.copyOf(bu.entries.value, bu.entries.size);
        costBlock = Arrays.copyOf(bu.costs.block, bu.costs.size);
        costRow = Arrays.copyOf(bu.costs.row, bu.costs.size);
        costCol = Arrays.copyOf(bu.costs.col, bu.costs.size);
        costValue = Arrays.copyOf(bu.costs.value, bu.costs.size);
    }

    int constraintCount() {
        return b.length;
    }

    int blockCount() {
        return blockSizes.length;
    }

    /** Σ block sizes (the "n" of μ = ⟨X, Z⟩ / n). */
    int totalDimension() {
        int s = 0;
        for (int d : blockSizes) {
            s += d;
        }
        return s;
    }

    /** New zero matrices, one per block. */
    DMatrixRMaj[] newBlocks() {
        DMatrixRMaj[] a = new DMatrixRMaj[blockSizes.length];
        for (int bl = 0; bl < a.length; bl++) {
            a[bl] = new DMatrixRMaj(blockSizes[bl], blockSizes[bl]);
        }
        return a;
    }

    /** C as dense blocks. */
    DMatrixRMaj[] costMatrices() {
        DMatrixRMaj[] c = newBlocks();
        for (int e = 0; e < costValue.length; e++) {
            c[costBlock[e]].add(costRow[e], costCol[e], costValue[e]);
            if (costRow[e] != costCol[e]) {
                c[costBlock[e]].add(costCol[e], costRow[e], costValue[e]);
            }
        }
        return c;
    }

    /** out_k = ⟨A_k, G⟩ (G need not be symmetric: both triangles are read). O(nnz). */
    void apply(DMatrixRMaj[] g, double[] out) {
        for (int k = 0; k < b.length; k++) {
            double s = 0;
            for (int e = start[k]; e < start[k + 1]; e++) {
                DMatrixRMaj gb = g[block[e]];
                int r = row[e];
                int c = col[e];
                s += value[e] * (r == c ? gb.get(r, r) : gb.get(r, c) + gb.get(c, r));
            }
            out[k] = s;
        }
    }

    /** out = Σ_k v_k A_k. O(nnz + Σ d²). */
    void adjoint(double[] v, DMatrixRMaj[] out) {
        for (DMatrixRMaj o : out) {
            o.zero();
        }
        for (int k = 0; k < b.length; k++) {
            double vk = v[k];
            if (vk == 0) {
                continue;
            }
            for (int e = start[k]; e < start[k + 1]; e++) {
                DMatrixRMaj ob = out[block[e]];
                ob.add(row[e], col[e], vk * value[e]);
                if (row[e] != col[e]) {
                    ob.add(col[e], row[e], vk * value[e]);
                }
            }
        }
    }

    /** ‖A_k‖_F². */
    double constraintNormSquared(int k) {
        double s = 0;
        for (int e = start[k]; e < start[k + 1]; e++) {
            s += (row[e] == col[e] ? 1 : 2) * value[e] * value[e];
        }
        return s;
    }

    /** Σ_blocks ⟨A, B⟩. */
    static double inner(DMatrixRMaj[] a, DMatrixRMaj[] bm) {
        double s = 0;
        for (int bl = 0; bl < a.length; bl++) {
            double[] ad = a[bl].data;
            double[] bd = bm[bl].data;
            for (int i = 0; i < a[bl].getNumElements(); i++) {
                s += ad[i] * bd[i];
            }
        }
        return s;
    }

    /** Frobenius norm over all blocks. */
    static double frobenius(DMatrixRMaj[] a) {
        return Math.sqrt(inner(a, a));
    }

    static double dot(double[] u, double[] w) {
        double s = 0;
        for (int i = 0; i < u.length; i++) {
            s += u[i] * w[i];
        }
        return s;
    }

    /** Symmetric sparse entries (block, row ≤ col, value) in arrays that grow; not thread-safe. */
    private static final class Entries {
        int[] block = new int[64];
        int[] row = new int[64];
        int[] col = new int[64];
        double[] value = new double[64];
        int size;

        void add(int blk, int r, int c, double v) {
            if (size == block.length) {
                int len = 2 * size;
                block = Arrays.copyOf(block, len);
                row = Arrays.copyOf(row, len);
                col = Arrays.copyOf(col, len);
                value = Arrays.copyOf(value, len);
            }
            block[size] = blk;
            row[size] = Math.min(r, c);
            col[size] = Math.max(r, c);
            value[size] = v;
            size++;
        }
    }

    /** Collects blocks, constraints and entries; not thread-safe. */
    static final class Builder {
        private int[] blockSizes = new int[8];
        private int blocks;
        private double[] b = new double[64];
        private int[] start = new int[65];
        private int constraints;
        private final Entries entries = new Entries();
        private final Entries costs = new Entries();

        /** Adds a PSD block of this size; returns its index. */
        int addBlock(int size) {
            if (size <= 0) {
                throw new IllegalArgumentException("block size must be positive");
            }
            if (blocks == blockSizes.length) {
                blockSizes = Arrays.copyOf(blockSizes, 2 * blocks);
            }
            blockSizes[blocks] = size;
            return blocks++;
        }

        /** Starts constraint k (the next index) with right-hand side {@code rhs}; returns k. */
        int addConstraint(double rhs) {
            if (constraints == b.length) {
                b = Arrays.copyOf(b, 2 * constraints);
                start = Arrays.copyOf(start, 2 * constraints + 1);
            }
            b[constraints] = rhs;
            start[constraints] = entries.size;
            return constraints++;
        }

        /** Adds an entry to the constraint started last. */
        void entry(int blk, int r, int c, double v) {
            if (constraints == 0) {
                throw new IllegalStateException("no constraint started");
            }
            check(blk, r, c);
            entries.add(blk, r, c, v);
        }

        /** Adds an entry of C. */
        void cost(int blk, int r, int c, double v) {
            check(blk, r, c);
            costs.add(blk, r, c, v);
        }

        private void check(int blk, int r, int c) {
            if (blk < 0 || blk >= blocks || r < 0 || c < 0 || r >= blockSizes[blk] || c >= blockSizes[blk]) {
                throw new IllegalArgumentException("entry (" + blk + ", " + r + ", " + c + ") outside the blocks");
            }
        }

        SdpProblem build() {
            return new SdpProblem(this);
        }
    }
}
