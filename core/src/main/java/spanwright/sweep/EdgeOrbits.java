package spanwright.sweep;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.jgrapht.alg.util.UnionFind;
import spanwright.model.Edge;
import spanwright.model.Scenario;

/**
 * Ties the weights of a host-graph instance by the edge orbits of a group of graph automorphisms
 * that map {s, t} onto itself, given by generators (vertex permutations).
 *
 * <p>Why nothing is lost (derived): on a host graph (one positive literal per edge) log √(W₊W₋) is,
 * in the log-weights u, (max over simple s–t paths P of log Σ_{e∈P} e^{u_e} + max over s–t bonds B
 * of log Σ_{e∈B} e^{−u_e})/2, a convex function (a maximum of log-sum-exp functions of affine
 * maps). An automorphism σ with σ{s, t} = {s, t} maps paths to paths and bonds to bonds (effective
 * resistance and capacitance are symmetric in s and t), so the function is invariant: F(σu) = F(u).
 * By convexity F(ū) ≤ average of F(σu) = F(u) for the group average ū, which is constant on edge
 * orbits. So the optimum over orbit-tied weights equals the optimum over all weights, and the tied
 * problem has far fewer unknowns (K_n: 3 instead of n(n−1)/2).
 *
 * <p>Each generator is checked exactly before use: it must be a permutation of the vertices mapping
 * {s, t} onto itself and the edge multiset onto itself; a failing check returns null (no ties).
 * Cost O(k·|E|) for k generators. Stateless.
 */
final class EdgeOrbits {
    private EdgeOrbits() {}

    /**
     * The scenario with group key {@code orbit:i} on every edge of orbit i, or null when a generator
     * is not such an automorphism or the scenario is not a host graph without group keys.
     */
    static Scenario tie(Scenario sc, List<int[]> generators) {
        int n = sc.vertexCount();
        List<Edge> edges = sc.edges();
        boolean[] used = new boolean[sc.variableCount()];
        Map<Long, List<Integer>> byPair = new HashMap<>();
        for (int i = 0; i < edges.size(); i++) {
            Edge e = edges.get(i);
            if (e.group() != null || e.locked() || e.when().isAlways() || !e.when().positive()
                    || used[e.when().variable()]) {
                return null;
            }
            used[e.when().variable()] = true;
            byPair.computeIfAbsent(pair(e.u(), e.v(), n), k -> new ArrayList<>()).add(i);
        }
        java.util.Set<Integer> all = new java.util.LinkedHashSet<>();
        for (int i = 0; i < edges.size(); i++) {
            all.add(i);
        }
        UnionFind<Integer> orbits = new UnionFind<>(all); // JGraphT's union–find
        for (int[] p : generators) {
            if (!isPermutation(p, n)) {
                return null;
            }
            boolean terminals = (p[sc.s()] == sc.s() && p[sc.t()] == sc.t())
                    || (p[sc.s()] == sc.t() && p[sc.t()] == sc.s());
            if (!terminals) {
                return null;
            }
            for (Map.Entry<Long, List<Integer>> en : byPair.entrySet()) {
                Edge e = edges.get(en.getValue().get(0));
                List<Integer> image = byPair.get(pair(p[e.u()], p[e.v()], n));
                if (image == null || image.size() != en.getValue().size()) {
                    return null;
                }
                for (int k = 0; k < image.size(); k++) {
                    orbits.union(en.getValue().get(k), image.get(k));
                }
            }
        }
        Map<Integer, Integer> label = new HashMap<>();
        List<Edge> out = new ArrayList<>();
        for (int i = 0; i < edges.size(); i++) {
            int r = orbits.find(i);
            Integer l = label.get(r);
            if (l == null) {
                l = label.size();
                label.put(r, l);
            }
            Edge e = edges.get(i);
            out.add(new Edge(e.id(), e.u(), e.v(), e.when(), e.weight(), "orbit:" + l, false));
        }
        return sc.withEdges(out);
    }

    /** Number of distinct group keys (orbits) of a tied scenario. */
    static int orbitCount(Scenario tied) {
        java.util.Set<String> g = new java.util.HashSet<>();
        for (Edge e : tied.edges()) {
            g.add(e.group());
        }
        return g.size();
    }

    private static long pair(int a, int b, int n) {
        return a < b ? (long) a * n + b : (long) b * n + a;
    }

    private static boolean isPermutation(int[] p, int n) {
        if (p.length != n) {
            return false;
        }
        boolean[] seen = new boolean[n];
        for (int x : p) {
            if (x < 0 || x >= n || seen[x]) {
                return false;
            }
            seen[x] = true;
        }
        return true;
    }

    // ------------------------------------------------------------------ generators of the families

    /** K_n with s = vertex 0, t = vertex n − 1: swap s and t; transposition and cycle of the inner vertices. */
    static List<int[]> complete(int n) {
        List<int[]> g = new ArrayList<>();
        g.add(swapEnds(n));
        if (n >= 4) {
            int[] tr = identity(n);
            tr[1] = 2;
            tr[2] = 1;
            g.add(tr);
            int[] cyc = identity(n);
            for (int i = 1; i <= n - 2; i++) {
                cyc[i] = i == n - 2 ? 1 : i + 1;
            }
            g.add(cyc);
        }
        return g;
    }

    /** The k×k grid numbered row-major, s and t opposite corners: transpose; rotation by 180°. */
    static List<int[]> grid(int k) {
        int[] tr = new int[k * k];
        int[] rot = new int[k * k];
        for (int r = 0; r < k; r++) {
            for (int c = 0; c < k; c++) {
                tr[r * k + c] = c * k + r;
                rot[r * k + c] = (k - 1 - r) * k + (k - 1 - c);
            }
        }
        return List.of(tr, rot);
    }

    /**
     * The d-cube with vertices given by their bit strings {@code bits[i]} (s = 0…0, t = 1…1):
     * complement; transposition and cycle of the coordinates.
     */
    static List<int[]> hypercube(int d, String[] bits) {
        Map<String, Integer> index = new HashMap<>();
        for (int i = 0; i < bits.length; i++) {
            index.put(bits[i], i);
        }
        List<int[]> g = new ArrayList<>();
        for (int kind = 0; kind < 3; kind++) {
            if (kind > 0 && d < 2) {
                break;
            }
            int[] p = new int[bits.length];
            for (int i = 0; i < bits.length; i++) {
                char[] b = bits[i].toCharArray();
                char[] c = new char[d];
                for (int j = 0; j < d; j++) {
                    if (kind == 0) {
                        c[j] = b[j] == '0' ? '1' : '0';
                    } else if (kind == 1) {
                        c[j] = b[j == 0 ? 1 : j == 1 ? 0 : j];
                    } else {
                        c[j] = b[(j + 1) % d];
                    }
                }
                Integer to = index.get(new String(c));
                if (to == null) {
                    return List.of(new int[0]); // not the expected naming: fails the check
                }
                p[i] = to;
            }
            g.add(p);
        }
        return g;
    }

    private static int[] identity(int n) {
        int[] p = new int[n];
        for (int i = 0; i < n; i++) {
            p[i] = i;
        }
        return p;
    }

    private static int[] swapEnds(int n) {
        int[] p = identity(n);
        p[0] = n - 1;
        p[n - 1] = 0;
        return p;
    }
}
