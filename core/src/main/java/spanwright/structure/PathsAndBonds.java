package spanwright.structure;

import java.math.BigInteger;
import spanwright.model.Deadline;

/**
 * Exact W₊ and W₋ of a host-graph instance (one variable per edge, every condition a positive
 * literal, no always-present edges) without enumerating the input cube. By Rayleigh monotonicity
 * W₊ is attained on a minimal positive input, which is the edge set of a simple s–t path, whose
 * resistance is its weight sum; W₋ is attained on a maximal negative input "every edge except an
 * s–t bond", whose capacitance is Σ 1/w over the bond (both sides contract to a node, the bond's
 * edges are in parallel). So W₊ = the heaviest simple s–t path and W₋ = the heaviest bond.
 *
 * <p>Only the component of the host graph holding s matters; self-loops are never on a path or in
 * a bond. A bond is the set of edges between S and V′∖S, where V′ is that component, s ∈ S,
 * t ∉ S, and both G[S] and G[V′∖S] are connected; parallel edges between the sides are all in it.
 * When s and t are not joined in the host graph there is no path (value NaN, no edges, count 0)
 * and the empty set is the one bond (value 0, count 1).
 *
 * <p>Two exact methods, chosen by an estimate of their work (or forced through {@link Method}):
 * frontier search ({@link FrontierSearch}: Knuth's simpath and its bond analogue), whose states
 * grow with the frontier width w (about k on a k×k grid, n − 1 on K_n); and dynamic programming
 * over vertex subsets ({@link SubsetDp}), whose work grows as 2^n. When the chosen one runs out of
 * budget the other is tried if its exact size fits. Each result says in {@link Extreme#method()}
 * which ran.
 *
 * <p>{@code maxStates} caps the states of one frontier level, or the subset DP's states; a
 * {@link TooWideException} is thrown before memory runs out. <b>Stateless</b>; each call allocates
 * its own single-threaded solver.
 */
public final class PathsAndBonds {
    private PathsAndBonds() {}

    /** Which exact method to run. */
    public enum Method {
        /** The cheaper by an estimate, falling back to the other on {@link TooWideException}. */
        AUTO,
        /** Frontier-based search over the edges. */
        FRONTIER,
        /** Dynamic programming over vertex subsets (at most 31 vertices in s's component). */
        SUBSETS
    }

    /** W₊ for one-variable-per-edge monotone instances: the heaviest simple s–t path (Σ w), with the number of simple s–t paths. */
    public static Extreme heaviestPath(HostGraph g, long maxStates) {
        return heaviestPath(g, maxStates, Method.AUTO);
    }

    /** W₋ for the same: the heaviest s–t bond (Σ 1/w), with the number of s–t bonds. */
    public static Extreme heaviestBond(HostGraph g, long maxStates) {
        return heaviestBond(g, maxStates, Method.AUTO);
    }

    /** {@link #heaviestPath(HostGraph, long)} by the given method. */
    public static Extreme heaviestPath(HostGraph g, long maxStates, Method method) {
        return heaviestPath(g, maxStates, method, Deadline.none());
    }

    /**
     * {@link #heaviestPath(HostGraph, long)} by the given method within a time budget, checked at
     * least every 1024 frontier states or 256 vertex subsets.
     *
     * @throws Deadline.Expired when the budget runs out first (nothing partial is certain)
     */
    public static Extreme heaviestPath(HostGraph g, long maxStates, Method method, Deadline deadline) {
        Component c = new Component(g);
        if (!c.joined) {
            return new Extreme(Double.NaN, null, BigInteger.ZERO, "s and t are not joined in the host graph: no path");
        }
        return run(c, maxStates, method, false, deadline);
    }

    /** {@link #heaviestBond(HostGraph, long)} by the given method. */
    public static Extreme heaviestBond(HostGraph g, long maxStates, Method method) {
        return heaviestBond(g, maxStates, method, Deadline.none());
    }

    /**
     * {@link #heaviestBond(HostGraph, long)} by the given method within a time budget (see
     * {@link #heaviestPath(HostGraph, long, Method, Deadline)}).
     *
     * @throws Deadline.Expired when the budget runs out first
     */
    public static Extreme heaviestBond(HostGraph g, long maxStates, Method method, Deadline deadline) {
        Component c = new Component(g);
        if (!c.joined) {
            return new Extreme(0.0, new boolean[g.edgeCount()], BigInteger.ONE,
                    "s and t are not joined in the host graph: the empty set is the only bond");
        }
        return run(c, maxStates, method, true, deadline);
    }

    private static Extreme run(Component c, long maxStates, Method method, boolean bond, Deadline deadline) {
        if (maxStates < 1) {
            throw new IllegalArgumentException("maxStates must be positive, got " + maxStates);
        }
        long subsetStates = bond ? SubsetDp.bondStates(c.n) : SubsetDp.pathStates(c.n);
        boolean subsetFits = c.n <= SubsetDp.MAX_VERTICES && subsetStates <= maxStates
                && subsetStates < Integer.MAX_VALUE - 8;
        if (method == Method.SUBSETS) {
            return subsets(c, maxStates, bond, deadline);
        }
        FrontierPlan plan = new FrontierPlan(c);
        if (method == Method.FRONTIER) {
            return frontier(c, plan, maxStates, bond, deadline);
        }
        double subsetWork = subsetFits ? (double) subsetStates * (bond ? c.n : c.n - 2) : Double.POSITIVE_INFINITY;
        // crude estimate of frontier states per level: 3^w (paths), 4^w (bonds, a side and a component each)
        double perLevel = Math.pow(bond ? 4 : 3, plan.width);
        double frontierWork = perLevel * plan.m * Math.max(1, plan.width);
        if (subsetFits && subsetWork <= frontierWork) {
            return subsets(c, maxStates, bond, deadline);
        }
        try {
            return frontier(c, plan, maxStates, bond, deadline);
        } catch (TooWideException e) {
            if (subsetFits) {
                return subsets(c, maxStates, bond, deadline);
            }
            throw e;
        }
    }

    private static Extreme frontier(Component c, FrontierPlan plan, long maxStates, boolean bond, Deadline deadline) {
        FrontierSearch search = new FrontierSearch(c, plan, maxStates, bond, deadline);
        return bond ? search.heaviestBond() : search.heaviestPath();
    }

    private static Extreme subsets(Component c, long maxStates, boolean bond, Deadline deadline) {
        return bond ? SubsetDp.heaviestBond(c, maxStates, deadline) : SubsetDp.heaviestPath(c, maxStates, deadline);
    }
}
