package spanwright.structure;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The edge order of a frontier search and, for each edge, the frontier it works on. Edges are
 * sorted by the later and then the earlier of their endpoints' positions in a vertex order; the
 * vertex order is the best (smallest widest frontier, then smallest total) of a few candidates:
 * the host's own numbering (row-major grids get a frontier of about one row), breadth-first from s
 * and from t, and a greedy order from s and from t that always takes a vertex with the most
 * neighbours already placed. A vertex enters the frontier at its first edge and leaves after its
 * last. Cost O(c·(m log m + n²)) for c candidates (the greedy orders are quadratic in n; they are
 * skipped above 4000 vertices). Immutable after construction.
 *
 * <p>Frontier {@code F_i} of edge i = the frontier after edge i−1 (slots {@code 0..prevSize[i]−1},
 * in the same order) followed by the endpoints of edge i that enter at it.
 */
final class FrontierPlan {
    final int m;
    final int[] order;
    final int width;
    final long total;
    final int[] prevSize;
    final int[][] slots;
    final int[] pu;
    final int[] pv;
    final boolean[] enterU;
    final boolean[] enterV;
    final boolean[][] leaving;
    final String ordering;

    FrontierPlan(Component c) {
        m = c.m;
        int[][] nb = c.neighbours();
        List<int[]> candidates = new ArrayList<>();
        List<String> names = new ArrayList<>();
        int[] identity = new int[c.n];
        for (int x = 0; x < c.n; x++) {
            identity[x] = x; // local numbering is BFS from s; host numbering is recovered below
        }
        candidates.add(hostOrder(c));
        names.add("host numbering");
        candidates.add(identity);
        names.add("breadth-first from s");
        candidates.add(bfs(nb, c.t, c.n));
        names.add("breadth-first from t");
        if (c.n <= 4000) {
            candidates.add(greedy(nb, c.s, c.n));
            names.add("greedy from s");
            candidates.add(greedy(nb, c.t, c.n));
            names.add("greedy from t");
        }
        int[] bestOrder = null;
        int bestWidth = Integer.MAX_VALUE;
        long bestTotal = Long.MAX_VALUE;
        String bestName = "";
        for (int k = 0; k < candidates.size(); k++) {
            int[] eo = edgeOrder(c, candidates.get(k));
            long[] wt = widthAndTotal(c, eo);
            if (wt[0] < bestWidth || (wt[0] == bestWidth && wt[1] < bestTotal)) {
                bestWidth = (int) wt[0];
                bestTotal = wt[1];
                bestOrder = eo;
                bestName = names.get(k);
            }
        }
        order = bestOrder;
        width = bestWidth;
        total = bestTotal;
        ordering = bestName;
        prevSize = new int[m + 1];
        slots = new int[m][];
        pu = new int[m];
        pv = new int[m];
        enterU = new boolean[m];
        enterV = new boolean[m];
        leaving = new boolean[m][];
        int[] first = new int[c.n];
        int[] last = new int[c.n];
        Arrays.fill(first, -1);
        for (int i = 0; i < m; i++) {
            int e = order[i];
            for (int x : new int[] {c.eu[e], c.ev[e]}) {
                if (first[x] < 0) {
                    first[x] = i;
                }
                last[x] = i;
            }
        }
        int[] frontier = new int[0];
        for (int i = 0; i < m; i++) {
            int e = order[i];
            int a = c.eu[e];
            int b = c.ev[e];
            prevSize[i] = frontier.length;
            int[] f = Arrays.copyOf(frontier, frontier.length + 2);
            int len = frontier.length;
            enterU[i] = first[a] == i;
            if (enterU[i]) {
                f[len++] = a;
            }
            enterV[i] = first[b] == i;
            if (enterV[i]) {
                f[len++] = b;
            }
            f = Arrays.copyOf(f, len);
            slots[i] = f;
            leaving[i] = new boolean[len];
            int keep = 0;
            for (int x = 0; x < len; x++) {
                if (f[x] == a) {
                    pu[i] = x;
                }
                if (f[x] == b) {
                    pv[i] = x;
                }
                leaving[i][x] = last[f[x]] == i;
                if (!leaving[i][x]) {
                    keep++;
                }
            }
            frontier = new int[keep];
            keep = 0;
            for (int x = 0; x < len; x++) {
                if (!leaving[i][x]) {
                    frontier[keep++] = f[x];
                }
            }
        }
        prevSize[m] = frontier.length;
    }

    /** Local vertices ordered by their host numbers. */
    private static int[] hostOrder(Component c) {
        int[] hostOf = new int[c.n];
        Arrays.fill(hostOf, Integer.MAX_VALUE);
        for (int e = 0; e < c.m; e++) {
            hostOf[c.eu[e]] = c.host.u(c.hostEdge[e]);
            hostOf[c.ev[e]] = c.host.v(c.hostEdge[e]);
        }
        Integer[] idx = new Integer[c.n];
        for (int x = 0; x < c.n; x++) {
            idx[x] = x;
        }
        Arrays.sort(idx, (p, q) -> Integer.compare(hostOf[p], hostOf[q]));
        int[] out = new int[c.n];
        for (int x = 0; x < c.n; x++) {
            out[x] = idx[x];
        }
        return out;
    }

    private static int[] bfs(int[][] nb, int start, int n) {
        int[] out = new int[n];
        boolean[] seen = new boolean[n];
        int head = 0;
        int tail = 0;
        out[tail++] = start;
        seen[start] = true;
        while (head < tail) {
            int x = out[head++];
            for (int y : nb[x]) {
                if (!seen[y]) {
                    seen[y] = true;
                    out[tail++] = y;
                }
            }
        }
        return out;
    }

    private static int[] greedy(int[][] nb, int start, int n) {
        int[] placedNb = new int[n];
        int[] freeNb = new int[n];
        boolean[] placed = new boolean[n];
        for (int x = 0; x < n; x++) {
            freeNb[x] = nb[x].length;
        }
        int[] out = new int[n];
        int next = start;
        for (int k = 0; k < n; k++) {
            out[k] = next;
            placed[next] = true;
            for (int y : nb[next]) {
                placedNb[y]++;
                freeNb[y]--;
            }
            next = -1;
            for (int x = 0; x < n; x++) {
                if (!placed[x] && placedNb[x] > 0 && (next < 0 || placedNb[x] > placedNb[next]
                        || (placedNb[x] == placedNb[next] && freeNb[x] < freeNb[next]))) {
                    next = x;
                }
            }
            if (next < 0) {
                break; // connected graph: only after the last vertex
            }
        }
        return out;
    }

    private static int[] edgeOrder(Component c, int[] vertexOrder) {
        int[] pos = new int[c.n];
        for (int k = 0; k < c.n; k++) {
            pos[vertexOrder[k]] = k;
        }
        long[] keyed = new long[c.m];
        for (int e = 0; e < c.m; e++) {
            long hi = Math.max(pos[c.eu[e]], pos[c.ev[e]]);
            long lo = Math.min(pos[c.eu[e]], pos[c.ev[e]]);
            keyed[e] = (((hi << 21) | lo) << 21) | e;
        }
        Arrays.sort(keyed);
        int[] out = new int[c.m];
        for (int e = 0; e < c.m; e++) {
            out[e] = (int) (keyed[e] & ((1L << 21) - 1));
        }
        return out;
    }

    /** {widest F_i, Σ |F_i|} for an edge order. */
    private static long[] widthAndTotal(Component c, int[] order) {
        int[] first = new int[c.n];
        int[] last = new int[c.n];
        Arrays.fill(first, -1);
        for (int i = 0; i < order.length; i++) {
            int e = order[i];
            for (int x : new int[] {c.eu[e], c.ev[e]}) {
                if (first[x] < 0) {
                    first[x] = i;
                }
                last[x] = i;
            }
        }
        int[] diff = new int[order.length + 1];
        for (int x = 0; x < c.n; x++) {
            if (first[x] >= 0) {
                diff[first[x]]++;
                diff[last[x] + 1]--;
            }
        }
        long widest = 0;
        long total = 0;
        int cur = 0;
        for (int i = 0; i < order.length; i++) {
            cur += diff[i];
            widest = Math.max(widest, cur);
            total += cur;
        }
        return new long[] {widest, total};
    }
}
