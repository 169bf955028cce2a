package spanwright.optimize;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import spanwright.model.Edge;
import spanwright.model.Scenario;

/**
 * How the optimiser's free log-weights map onto edges: one group per {@link Edge#group()} key, per
 * literal with {@link OptimizerOptions.Tie#LITERAL}, otherwise per edge; a locked edge is a group of
 * its own that never moves. The starting log-weight of a group is the mean of its members'
 * log-weights (their geometric mean). Shared by the whole-domain and the working-set optimiser, so
 * both tie and lock alike. <b>Immutable</b> after construction (the arrays are not handed out
 * to callers outside the package). O(|E|).
 */
final class WeightGroups {
    /** Group of each kept edge. */
    final int[] group;
    /** Number of groups. */
    final int count;
    /** Whether each group may move (not locked). */
    final boolean[] free;
    /** Starting log-weight of each group. */
    final double[] u0;
    final boolean anyLocked;
    final int freeCount;

    /** Groups over the edges {@code keptEdge} (indices into {@code scenario.edges()}). */
    WeightGroups(Scenario scenario, int[] keptEdge, OptimizerOptions.Tie tie) {
        int m = keptEdge.length;
        Map<String, Integer> groupOf = new HashMap<>();
        group = new int[m];
        List<Boolean> lockedList = new ArrayList<>();
        for (int k = 0; k < m; k++) {
            Edge e = scenario.edges().get(keptEdge[k]);
            String key;
            if (e.locked()) {
                key = "locked#" + k;
            } else if (e.group() != null) {
                key = "group:" + e.group();
            } else if (tie == OptimizerOptions.Tie.LITERAL) {
                key = "literal:" + e.when();
            } else {
                key = "edge#" + k;
            }
            Integer gi = groupOf.get(key);
            if (gi == null) {
                gi = groupOf.size();
                groupOf.put(key, gi);
                lockedList.add(e.locked());
            }
            group[k] = gi;
        }
        count = groupOf.size();
        free = new boolean[count];
        u0 = new double[count];
        int[] members = new int[count];
        boolean locked = false;
        for (int q = 0; q < count; q++) {
            free[q] = !lockedList.get(q);
            locked |= !free[q];
        }
        anyLocked = locked;
        for (int k = 0; k < m; k++) {
            u0[group[k]] += Math.log(scenario.edges().get(keptEdge[k]).weight());
            members[group[k]]++;
        }
        int f = 0;
        for (int q = 0; q < count; q++) {
            u0[q] /= members[q];
            if (free[q]) {
                f++;
            }
        }
        freeCount = f;
    }

    /** Weights per kept edge from log-weights per group. */
    double[] expand(double[] u) {
        double[] w = new double[group.length];
        for (int k = 0; k < group.length; k++) {
            w[k] = Math.exp(u[group[k]]);
        }
        return w;
    }
}
