package spanwright.structure;

import java.util.Arrays;

/**
 * The part of a {@link HostGraph} that matters for s–t paths and bonds: the connected component
 * of s (when it contains t), renumbered {@code 0..n−1}, without self-loops. Keeps the maps back to
 * the host's vertex and edge numbers. Immutable after construction.
 */
final class Component {
    final HostGraph host;
    /** Whether s and t are joined in the host graph; when false the other fields are empty. */
    final boolean joined;
    final int n;
    final int s;
    final int t;
    final int m;
    final int[] eu;
    final int[] ev;
    final double[] ew;
    /** Local edge → host edge. */
    final int[] hostEdge;

    Component(HostGraph g) {
        host = g;
        int hn = g.vertexCount();
        int hm = g.edgeCount();
        int[] deg = new int[hn];
        for (int e = 0; e < hm; e++) {
            if (g.u(e) != g.v(e)) {
                deg[g.u(e)]++;
                deg[g.v(e)]++;
            }
        }
        int[][] inc = new int[hn][];
        for (int x = 0; x < hn; x++) {
            inc[x] = new int[deg[x]];
        }
        int[] fill = new int[hn];
        for (int e = 0; e < hm; e++) {
            if (g.u(e) != g.v(e)) {
                inc[g.u(e)][fill[g.u(e)]++] = e;
                inc[g.v(e)][fill[g.v(e)]++] = e;
            }
        }
        int[] local = new int[hn];
        Arrays.fill(local, -1);
        int[] queue = new int[hn];
        int head = 0;
        int tail = 0;
        queue[tail++] = g.s();
        local[g.s()] = 0;
        while (head < tail) {
            int x = queue[head++];
            for (int e : inc[x]) {
                int y = g.u(e) == x ? g.v(e) : g.u(e);
                if (local[y] < 0) {
                    local[y] = tail;
                    queue[tail++] = y;
                }
            }
        }
        joined = local[g.t()] >= 0;
        if (!joined) {
            n = 0;
            s = -1;
            t = -1;
            m = 0;
            eu = new int[0];
            ev = eu;
            ew = new double[0];
            hostEdge = eu;
            return;
        }
        n = tail;
        s = local[g.s()];
        t = local[g.t()];
        int count = 0;
        for (int e = 0; e < hm; e++) {
            if (g.u(e) != g.v(e) && local[g.u(e)] >= 0) {
                count++;
            }
        }
        m = count;
        eu = new int[m];
        ev = new int[m];
        ew = new double[m];
        hostEdge = new int[m];
        int k = 0;
        for (int e = 0; e < hm; e++) {
            if (g.u(e) != g.v(e) && local[g.u(e)] >= 0) {
                eu[k] = local[g.u(e)];
                ev[k] = local[g.v(e)];
                ew[k] = g.weight(e);
                hostEdge[k++] = e;
            }
        }
    }

    /** Host edge set of the given local edges. */
    boolean[] hostEdges(boolean[] localEdges) {
        boolean[] out = new boolean[host.edgeCount()];
        for (int e = 0; e < m; e++) {
            if (localEdges[e]) {
                out[hostEdge[e]] = true;
            }
        }
        return out;
    }

    /** Neighbour lists (with repeats for parallel edges), local numbering. */
    int[][] neighbours() {
        int[] deg = new int[n];
        for (int e = 0; e < m; e++) {
            deg[eu[e]]++;
            deg[ev[e]]++;
        }
        int[][] nb = new int[n][];
        for (int x = 0; x < n; x++) {
            nb[x] = new int[deg[x]];
        }
        int[] fill = new int[n];
        for (int e = 0; e < m; e++) {
            nb[eu[e]][fill[eu[e]]++] = ev[e];
            nb[ev[e]][fill[ev[e]]++] = eu[e];
        }
        return nb;
    }
}
