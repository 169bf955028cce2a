package spanwright.optimize;

import java.util.ArrayList;
import java.util.List;
import spanwright.domain.InputDomain;
import spanwright.electric.ElectricalNetwork;
import spanwright.electric.Witness;
import spanwright.model.Edge;
import spanwright.model.Scenario;

/**
 * Evaluates W₊ = max R and W₋ = max C of one scenario for many weightings, skipping inputs that
 * cannot be worst by Rayleigh's monotonicity law: if variable i occurs only in positive literals,
 * turning x_i from 1 to 0 only removes edges, so a positive input x with x_i = 1 whose neighbour
 * x − e_i is also a positive input of the domain has R(x) ≤ R(x − e_i) and need not be evaluated;
 * a negative input with x_i = 0 whose neighbour x + e_i is a negative input has C(x) ≤ C(x + e_i)
 * (contracting an edge never lowers the capacitance). Symmetrically for variables occurring only in
 * negated literals; variables occurring in both polarities give no pruning. Variables that occur
 * nowhere are treated as positive-only (both neighbours have the same graph; one is kept).
 *
 * <p>Set-up: one connectivity test per input, O(2^n · |E| α). Each {@link #evaluate}: one solve
 * per kept input. <b>Mutable, single-threaded.</b>
 */
final class WorstCaseEvaluator {
    final Scenario scenario;
    final int[] keptEdge; // indices into scenario.edges() of non-self-loop edges
    final ElectricalNetwork network;
    final long[] positives; // candidate positive inputs (masks), in input order
    final long[] negatives;
    private final boolean[] present;
    private final int n;
    private final int[] shift;
    private final boolean[] polarity;
    private final boolean[] always;
    final long domainSize;

    // last evaluation
    final double[] positiveValue;
    final double[] negativeValue;
    double maxR;
    double maxC;
    int worstPositive;
    int worstNegative;
    long solves;

    WorstCaseEvaluator(Scenario sc) {
        this.scenario = sc;
        this.n = sc.variableCount();
        List<Integer> kept = new ArrayList<>();
        for (int i = 0; i < sc.edges().size(); i++) {
            if (!sc.edges().get(i).isSelfLoop()) {
                kept.add(i);
            }
        }
        keptEdge = new int[kept.size()];
        int m = keptEdge.length;
        int[] u = new int[m];
        int[] v = new int[m];
        double[] w = new double[m];
        shift = new int[m];
        polarity = new boolean[m];
        always = new boolean[m];
        // polarity occurrence per variable: bit 1 = positive literal, bit 2 = negated literal
        int[] occurs = new int[n];
        for (int k = 0; k < m; k++) {
            keptEdge[k] = kept.get(k);
            Edge e = sc.edges().get(keptEdge[k]);
            u[k] = e.u();
            v[k] = e.v();
            w[k] = e.weight();
            always[k] = e.when().isAlways();
            if (!always[k]) {
                shift[k] = n - 1 - e.when().variable();
                polarity[k] = e.when().positive();
                occurs[e.when().variable()] |= e.when().positive() ? 1 : 2;
            }
        }
        network = new ElectricalNetwork(sc.vertexCount(), sc.s(), sc.t(), u, v, w);
        present = new boolean[m];
        InputDomain domain = InputDomain.of(sc);
        domainSize = domain.size();
        int size = (int) domain.size();
        boolean[] connected = new boolean[size];
        for (int k = 0; k < size; k++) {
            fillPresent(domain.get(k));
            connected[k] = network.connected(present);
        }
        List<Long> pos = new ArrayList<>();
        List<Long> neg = new ArrayList<>();
        for (int k = 0; k < size; k++) {
            long x = domain.get(k);
            boolean c = connected[k];
            boolean dominated = false;
            for (int i = 0; i < n && !dominated; i++) {
                if (occurs[i] == 3) {
                    continue;
                }
                long bit = 1L << (n - 1 - i);
                boolean set = (x & bit) != 0;
                // "down" for this variable = the direction that removes edges
                boolean removesWhenCleared = occurs[i] != 2; // positive-only (or absent)
                long neighbour;
                if (c) {
                    // positive: move in the edge-removing direction
                    if (removesWhenCleared == set) {
                        neighbour = x ^ bit;
                    } else {
                        continue;
                    }
                } else {
                    if (removesWhenCleared != set) {
                        neighbour = x ^ bit;
                    } else {
                        continue;
                    }
                }
                long o = domain.ordinalOf(neighbour);
                if (o >= 0 && connected[(int) o] == c) {
                    dominated = true;
                }
            }
            if (!dominated) {
                (c ? pos : neg).add(x);
            }
        }
        positives = toArray(pos);
        negatives = toArray(neg);
        positiveValue = new double[positives.length];
        negativeValue = new double[negatives.length];
    }

    private static long[] toArray(List<Long> l) {
        long[] a = new long[l.size()];
        for (int i = 0; i < a.length; i++) {
            a[i] = l.get(i);
        }
        return a;
    }

    private void fillPresent(long x) {
        for (int e = 0; e < present.length; e++) {
            present[e] = always[e] || (((x >>> shift[e]) & 1L) != 0) == polarity[e];
        }
    }

    /** Present kept edges on input x (a fresh array). */
    boolean[] presentOn(long x) {
        fillPresent(x);
        return present.clone();
    }

    /**
     * Evaluates every candidate input under weights {@code w} (one per kept edge).
     *
     * @return W₊·W₋ (NaN when a side is empty)
     */
    double evaluate(double[] w) {
        network.setWeights(w);
        maxR = Double.NaN;
        maxC = Double.NaN;
        worstPositive = -1;
        worstNegative = -1;
        for (int i = 0; i < positives.length; i++) {
            fillPresent(positives[i]);
            double r = network.evaluate(present);
            positiveValue[i] = r;
            if (worstPositive < 0 || r > maxR) {
                maxR = r;
                worstPositive = i;
            }
        }
        for (int i = 0; i < negatives.length; i++) {
            fillPresent(negatives[i]);
            double c = -network.evaluate(present) - 1.0;
            negativeValue[i] = c;
            if (worstNegative < 0 || c > maxC) {
                maxC = c;
                worstNegative = i;
            }
        }
        solves += positives.length + negatives.length;
        return maxR * maxC;
    }

    /** Witness (flow or potential) of a candidate input under the current weights. */
    Witness witness(long x) {
        fillPresent(x);
        return network.witness(present);
    }
}
