package spanwright.structure;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import spanwright.model.Deadline;

/**
 * Frontier-based search over the edges of a {@link Component} in a {@link FrontierPlan} order:
 * Knuth's "simpath" (D. E. Knuth, The Art of Computer Programming, Vol. 4A, §7.1.4, 2011), after
 * Sekine, Imai &amp; Tani, "Computing the Tutte polynomial of a graph of moderate size" (ISAAC
 * 1995), in the general form of Kawahara, Inoue, Iwashita &amp; Minato, "Frontier-based search
 * for enumerating all constrained subgraphs with compressed representation", IEICE Trans.
 * Fundamentals E100-A(9), 2017. Each level keeps the distinct states of the frontier vertices with
 * a max-plus value, a count and a back-pointer, so one pass gives the maximum, the number of
 * objects and a maximiser.
 *
 * <p>Paths: a frontier vertex is 0 (no chosen edge), 1 (full: degree 2, or s/t with its one
 * edge), or an open end of a path fragment labelled S (fragment holds s), T (holds t) or a
 * canonical label shared by the fragment's two ends. Bonds: each vertex gets a side when it enters
 * (s-side, t-side); a frontier vertex carries its side and its component among the decided edges
 * inside its side (the components of s and t are marked); a component that leaves the frontier
 * without holding s or t can never join them, so its state is dropped.
 *
 * <p>Cost O(Σ_i states_i · w) time for frontier width w, states ≤ {@code maxStates} per level;
 * memory: the two live levels' packed states plus 5 bytes per state over all levels for the
 * back-pointers (at most 64·maxStates of them). <b>Mutable, single-threaded</b>: one search object
 * per call, its work arrays reused across levels.
 */
final class FrontierSearch {
    private static final int FULL = 1;
    private static final int S_END = 2;
    private static final int T_END = 3;
    private static final int FIRST_LABEL = 4;
    /** Largest per-level budget honoured (keeps the arrays' indices in range). */
    static final long MAX_BUDGET = 1L << 28;
    private static final int ROOT_S = 0;
    private static final int ROOT_T = 1;

    private final Component c;
    private final FrontierPlan plan;
    private final Deadline deadline;
    private final long maxStates;
    private final int bits;
    private final int perWord;
    private final int words;
    private final long[] key;
    private final int[] a;
    private final int[] b;
    private final int[] side;
    private final int[] comp;
    private final int[] relabel;
    private final int[] seenStamp;
    private int stamp;
    private final List<int[]> parents = new ArrayList<>();
    private final List<byte[]> decisions = new ArrayList<>();
    private long stored;
    private long peak;
    private final boolean bond;
    /** Temporary labels, above every canonical one (those are below 4 + width). */
    private final int freshU;
    private final int freshV;
    private final int newLabel;

    FrontierSearch(Component c, FrontierPlan plan, long maxStates, boolean bond) {
        this(c, plan, maxStates, bond, Deadline.none());
    }

    /**
     * With a time budget, checked before each edge's level and every 1024 states inside it (one
     * step: at most 1024 state transitions); {@link Deadline.Expired} when it runs out.
     */
    FrontierSearch(Component c, FrontierPlan plan, long maxStates, boolean bond, Deadline deadline) {
        this.deadline = deadline;
        this.c = c;
        this.plan = plan;
        this.maxStates = Math.min(maxStates, MAX_BUDGET);
        this.bond = bond;
        int w = Math.max(1, plan.width);
        freshU = FIRST_LABEL + w + 1;
        freshV = freshU + 1;
        newLabel = freshU + 2;
        int maxCode = bond ? 2 * w + 1 : FIRST_LABEL + w / 2;
        int bt = 1;
        while ((1 << bt) <= maxCode) {
            bt++;
        }
        bits = bt;
        perWord = 64 / bits;
        words = (w + perWord - 1) / perWord;
        key = new long[words];
        a = new int[w];
        b = new int[w];
        side = new int[w];
        comp = new int[w];
        relabel = new int[newLabel + 1];
        seenStamp = new int[newLabel + 1];
    }

    private void decode(StateSet set, int idx, int len, int[] out) {
        int off = idx * words;
        long mask = (1L << bits) - 1;
        for (int x = 0; x < len; x++) {
            out[x] = (int) ((set.keys[off + x / perWord] >>> ((x % perWord) * bits)) & mask);
        }
    }

    private void encode(int[] codes, int len) {
        for (int i = 0; i < words; i++) {
            key[i] = 0;
        }
        for (int x = 0; x < len; x++) {
            key[x / perWord] |= ((long) codes[x]) << ((x % perWord) * bits);
        }
    }

    private TooWideException tooWide(int level, String what) {
        return new TooWideException(plan.width, maxStates, "frontier search for the heaviest " + what
                + " needs more than " + maxStates + " states at edge " + (level + 1) + " of " + plan.m
                + " (widest frontier " + plan.width + " vertices, order: " + plan.ordering
                + "); raise the state budget, use the vertex-subset method if the graph has at most about 22"
                + " vertices, or use enumeration or branch and bound");
    }

    private void keepLevel(StateSet next, int level, String what) {
        int[] p = new int[next.size];
        byte[] d = new byte[next.size];
        System.arraycopy(next.parent, 0, p, 0, next.size);
        System.arraycopy(next.decision, 0, d, 0, next.size);
        parents.add(p);
        decisions.add(d);
        stored += next.size;
        peak = Math.max(peak, next.size);
        if (stored > 64 * maxStates) { // maxStates ≤ 2^28, no overflow
            throw new TooWideException(plan.width, maxStates, "frontier search for the heaviest " + what
                    + " keeps more than " + (64 * maxStates) + " back-pointers over all levels by edge "
                    + (level + 1) + " of " + plan.m + " (widest frontier " + plan.width
                    + "); raise the state budget or use another method");
        }
    }

    private void checkTime(int level, int state, int states) {
        deadline.check("frontier search for the heaviest " + (bond ? "bond" : "path") + ", at edge " + (level + 1)
                + " of " + plan.m + " (state " + state + " of " + states + ")");
    }

    private String describe(String extra) {
        return "frontier search over " + plan.m + " edges (" + plan.ordering + "), widest frontier "
                + plan.width + ", " + stored + " states in all, largest level " + peak + extra;
    }

    /** The level before the first edge: the empty frontier, value 0, count 1. */
    private StateSet start() {
        StateSet set = new StateSet(words, maxStates);
        encode(a, 0);
        int root = set.add(key);
        set.value[root] = 0;
        set.count.set(root, 1);
        return set;
    }

    // ------------------------------------------------------------------ paths

    /** Heaviest simple s–t path with the number of simple s–t paths. */
    Extreme heaviestPath() {
        StateSet cur = start();
        StateSet next = new StateSet(words, maxStates);
        Counts accepted = new Counts(1);
        double best = Double.NEGATIVE_INFINITY;
        int bestLevel = -1;
        int bestState = -1;
        for (int i = 0; i < plan.m; i++) {
            int e = plan.order[i];
            int u = c.eu[e];
            int v = c.ev[e];
            double w = c.ew[e];
            int p = plan.prevSize[i];
            int len = plan.slots[i].length;
            int pu = plan.pu[i];
            int pv = plan.pv[i];
            next.clear();
            for (int k = 0; k < cur.size; k++) {
                if ((k & 1023) == 0) {
                    checkTime(i, k, cur.size);
                }
                decode(cur, k, p, a);
                for (int x = p; x < len; x++) {
                    a[x] = 0;
                }
                double val = cur.value[k];
                // edge i not taken
                System.arraycopy(a, 0, b, 0, len);
                if (finishPath(i, len)) {
                    int idx = next.add(key);
                    if (idx < 0) {
                        throw tooWide(i, "path");
                    }
                    next.offer(idx, val, cur.count, k, k, 0);
                }
                // edge i taken
                int cu = a[pu];
                int cv = a[pv];
                if (cu == FULL || cv == FULL) {
                    continue;
                }
                int lu = cu != 0 ? cu : u == c.s ? S_END : u == c.t ? T_END : freshU;
                int lv = cv != 0 ? cv : v == c.s ? S_END : v == c.t ? T_END : freshV;
                if (lu == lv) {
                    continue; // both ends of one fragment: a cycle
                }
                System.arraycopy(a, 0, b, 0, len);
                if ((lu == S_END && lv == T_END) || (lu == T_END && lv == S_END)) {
                    b[pu] = FULL;
                    b[pv] = FULL;
                    boolean clean = true;
                    for (int x = 0; x < len; x++) {
                        if (b[x] > FULL) {
                            clean = false;
                            break;
                        }
                    }
                    if (clean) {
                        accepted.addProduct(0, cur.count, k, 1);
                        if (val + w > best) {
                            best = val + w;
                            bestLevel = i;
                            bestState = k;
                        }
                    }
                    continue;
                }
                int merged = lu == S_END || lv == S_END ? S_END
                        : lu == T_END || lv == T_END ? T_END
                        : lu < freshU ? lu : lv < freshU ? lv : newLabel;
                for (int x = 0; x < len; x++) {
                    if (b[x] > FULL && (b[x] == lu || b[x] == lv)) {
                        b[x] = merged;
                    }
                }
                b[pu] = cu == 0 && u != c.s && u != c.t ? merged : FULL;
                b[pv] = cv == 0 && v != c.s && v != c.t ? merged : FULL;
                if (finishPath(i, len)) {
                    int idx = next.add(key);
                    if (idx < 0) {
                        throw tooWide(i, "path");
                    }
                    next.offer(idx, val + w, cur.count, k, k, 1);
                }
            }
            keepLevel(next, i, "path");
            StateSet tmp = cur;
            cur = next;
            next = tmp;
        }
        if (bestLevel < 0) {
            return new Extreme(Double.NaN, null, BigInteger.ZERO, describe(""));
        }
        boolean[] chosen = new boolean[c.m];
        chosen[plan.order[bestLevel]] = true;
        int k = bestState;
        for (int j = bestLevel - 1; j >= 0; j--) {
            if (decisions.get(j)[k] == 1) {
                chosen[plan.order[j]] = true;
            }
            k = parents.get(j)[k];
        }
        return new Extreme(best, c.hostEdges(chosen), accepted.get(0), describe(""));
    }

    /**
     * Checks the vertices leaving after edge i in {@code b} (an open end, or s/t without its edge,
     * can never be completed), then compacts and canonicalises into {@link #key}.
     */
    private boolean finishPath(int i, int len) {
        boolean[] leaving = plan.leaving[i];
        int[] verts = plan.slots[i];
        int out = 0;
        stamp++;
        int nextLabel = FIRST_LABEL;
        for (int x = 0; x < len; x++) {
            int code = b[x];
            if (leaving[x]) {
                if (code > FULL || (code == 0 && (verts[x] == c.s || verts[x] == c.t))) {
                    return false;
                }
                continue;
            }
            if (code >= FIRST_LABEL) {
                if (seenStamp[code] != stamp) {
                    seenStamp[code] = stamp;
                    relabel[code] = nextLabel++;
                }
                code = relabel[code];
            }
            b[out++] = code;
        }
        encode(b, out);
        return true;
    }

    // ------------------------------------------------------------------ bonds

    /** Heaviest s–t bond (Σ 1/w over its edges) with the number of s–t bonds. */
    Extreme heaviestBond() {
        StateSet cur = start();
        StateSet next = new StateSet(words, maxStates);
        for (int i = 0; i < plan.m; i++) {
            int e = plan.order[i];
            int u = c.eu[e];
            int v = c.ev[e];
            double cap = 1.0 / c.ew[e];
            int p = plan.prevSize[i];
            int len = plan.slots[i].length;
            int pu = plan.pu[i];
            int pv = plan.pv[i];
            boolean inU = plan.enterU[i];
            boolean inV = plan.enterV[i];
            // sides tried for an entering endpoint: s is on side 0, t on side 1, others either
            int fromU = inU && u == c.t ? 1 : 0;
            int toU = inU && u != c.s ? 1 : 0;
            int fromV = inV && v == c.t ? 1 : 0;
            int toV = inV && v != c.s ? 1 : 0;
            next.clear();
            for (int k = 0; k < cur.size; k++) {
                if ((k & 1023) == 0) {
                    checkTime(i, k, cur.size);
                }
                decode(cur, k, p, a);
                double val = cur.value[k];
                for (int su = fromU; su <= toU; su++) {
                    for (int sv = fromV; sv <= toV; sv++) {
                        for (int x = 0; x < p; x++) {
                            int code = a[x];
                            if (code <= ROOT_T) {
                                side[x] = code;
                                comp[x] = code;
                            } else {
                                side[x] = (code - 2) & 1;
                                comp[x] = 2 + ((code - 2) >> 1);
                            }
                        }
                        if (inU) {
                            side[pu] = su;
                            comp[pu] = u == c.s ? ROOT_S : u == c.t ? ROOT_T : freshU;
                        }
                        if (inV) {
                            side[pv] = sv;
                            comp[pv] = v == c.s ? ROOT_S : v == c.t ? ROOT_T : freshV;
                        }
                        double nv = val;
                        if (side[pu] == side[pv]) {
                            int cu = comp[pu];
                            int cv = comp[pv];
                            if (cu != cv) {
                                int keep = Math.min(cu, cv);
                                int drop = Math.max(cu, cv);
                                for (int x = 0; x < len; x++) {
                                    if (comp[x] == drop) {
                                        comp[x] = keep;
                                    }
                                }
                            }
                        } else {
                            nv += cap;
                        }
                        if (finishBond(i, len)) {
                            int idx = next.add(key);
                            if (idx < 0) {
                                throw tooWide(i, "bond");
                            }
                            int dec = (inU ? su : 0) | (inV ? sv << 1 : 0);
                            next.offer(idx, nv, cur.count, k, k, dec);
                        }
                    }
                }
            }
            keepLevel(next, i, "bond");
            StateSet tmp = cur;
            cur = next;
            next = tmp;
        }
        // every vertex has left: at most one (empty) state remains
        if (cur.size == 0) {
            return new Extreme(Double.NaN, null, BigInteger.ZERO, describe(""));
        }
        int[] sideOf = new int[c.n];
        int k = 0;
        for (int j = plan.m - 1; j >= 0; j--) {
            int d = decisions.get(j)[k];
            int e = plan.order[j];
            if (plan.enterU[j]) {
                sideOf[c.eu[e]] = d & 1;
            }
            if (plan.enterV[j]) {
                sideOf[c.ev[e]] = (d >> 1) & 1;
            }
            k = parents.get(j)[k];
        }
        boolean[] cut = new boolean[c.m];
        for (int e = 0; e < c.m; e++) {
            cut[e] = sideOf[c.eu[e]] != sideOf[c.ev[e]];
        }
        return new Extreme(cur.value[0], c.hostEdges(cut), cur.count.get(0), describe(""));
    }

    /**
     * Drops the state if a leaving vertex takes the last frontier piece of a component that holds
     * neither s nor t; otherwise compacts and canonicalises {@link #side}/{@link #comp} into
     * {@link #key}.
     */
    private boolean finishBond(int i, int len) {
        boolean[] leaving = plan.leaving[i];
        for (int x = 0; x < len; x++) {
            if (leaving[x] && comp[x] > ROOT_T) {
                boolean stays = false;
                for (int y = 0; y < len; y++) {
                    if (!leaving[y] && comp[y] == comp[x]) {
                        stays = true;
                        break;
                    }
                }
                if (!stays) {
                    return false;
                }
            }
        }
        stamp++;
        int nextLabel = 0;
        int out = 0;
        for (int x = 0; x < len; x++) {
            if (leaving[x]) {
                continue;
            }
            int cp = comp[x];
            if (cp <= ROOT_T) {
                b[out++] = cp;
                continue;
            }
            if (seenStamp[cp] != stamp) {
                seenStamp[cp] = stamp;
                relabel[cp] = nextLabel++;
            }
            b[out++] = 2 + 2 * relabel[cp] + side[x];
        }
        encode(b, out);
        return true;
    }
}
