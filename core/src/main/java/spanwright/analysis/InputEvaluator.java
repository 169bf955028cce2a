package spanwright.analysis;

import java.util.ArrayList;
import java.util.List;
import spanwright.electric.ElectricalNetwork;
import spanwright.electric.Witness;
import spanwright.model.Edge;
import spanwright.model.Scenario;

/**
 * The per-input routine every enumeration shares ({@link AnalysisRun}, {@link Summary} ranges,
 * {@link CandidateInputs}, the weight optimiser): which edges are present on an input, and one
 * {@link ElectricalNetwork#evaluate} of the witness size. Self-loops carry neither current nor
 * charge and are left out; {@link #keptEdges()} maps the network's edges back to the scenario's.
 *
 * <p>Inputs are masks in Spanwright's input order (variable i is bit n − 1 − i); up to 64
 * variables. Cost per call: O(|E|) for the presence, plus the network's O(|E| α + m³/6).
 *
 * <p><b>Mutable and single-threaded</b>: one instance owns its network's work arrays and its
 * presence array, and reuses them on every call. Use one instance per thread.
 */
public final class InputEvaluator {
    private final Scenario scenario;
    private final int n;
    private final int[] keptEdge;
    private final int[] shift;
    private final boolean[] polarity;
    private final boolean[] always;
    private final boolean[] present;
    private final ElectricalNetwork network;

    /** An evaluator of {@code scenario} with its own weights. O(|E|) set-up. */
    public InputEvaluator(Scenario scenario) {
        this.scenario = scenario;
        this.n = scenario.variableCount();
        List<Integer> kept = new ArrayList<>();
        for (int i = 0; i < scenario.edges().size(); i++) {
            if (!scenario.edges().get(i).isSelfLoop()) {
                kept.add(i);
            }
        }
        int m = kept.size();
        keptEdge = new int[m];
        int[] u = new int[m];
        int[] v = new int[m];
        double[] w = new double[m];
        shift = new int[m];
        polarity = new boolean[m];
        always = new boolean[m];
        for (int k = 0; k < m; k++) {
            keptEdge[k] = kept.get(k);
            Edge e = scenario.edges().get(keptEdge[k]);
            u[k] = e.u();
            v[k] = e.v();
            w[k] = e.weight();
            always[k] = e.when().isAlways();
            shift[k] = always[k] ? 0 : n - 1 - e.when().variable();
            polarity[k] = e.when().positive();
        }
        network = new ElectricalNetwork(scenario.vertexCount(), scenario.s(), scenario.t(), u, v, w);
        present = new boolean[m];
    }

    public Scenario scenario() {
        return scenario;
    }

    /** Indices into {@code scenario.edges()} of the network's edges (the non-self-loops), in order. */
    public int[] keptEdges() {
        return keptEdge.clone();
    }

    /** Number of the network's edges. */
    public int edgeCount() {
        return keptEdge.length;
    }

    /** Index into {@code scenario.edges()} of the network's edge {@code k}. */
    public int keptEdge(int k) {
        return keptEdge[k];
    }

    /**
     * Fills and returns this evaluator's own presence array for input {@code x} (one entry per
     * kept edge). The array is overwritten by the next call; clone it to keep it.
     */
    public boolean[] fill(long x) {
        int m = keptEdge.length;
        if (n <= 31) {
            // int arithmetic: 64-bit longs are emulated, and slow, in the page's JavaScript engine
            int xi = (int) x;
            for (int e = 0; e < m; e++) {
                present[e] = always[e] || (((xi >>> shift[e]) & 1) != 0) == polarity[e];
            }
        } else {
            for (int e = 0; e < m; e++) {
                present[e] = always[e] || (((x >>> shift[e]) & 1L) != 0) == polarity[e];
            }
        }
        return present;
    }

    /**
     * The witness size of input {@code x} in one pass: R > 0 when s and t are connected, −(C + ε)
     * when they are not (see {@link ElectricalNetwork#evaluate}; decode with {@link #positive} and
     * {@link #value}). Allocation-free.
     */
    public double evaluate(long x) {
        return network.evaluate(fill(x));
    }

    /** Are s and t connected on input {@code x}? O(|E| α), no solve. */
    public boolean connected(long x) {
        return network.connected(fill(x));
    }

    /** The full witness of input {@code x} over the kept edges (allocates). */
    public Witness witness(long x) {
        return network.witness(fill(x));
    }

    /** Replaces the kept edges' weights (resistances) in place. */
    public void setWeights(double[] keptWeights) {
        network.setWeights(keptWeights);
    }

    /** Whether a code returned by {@link #evaluate} belongs to a positive input. */
    public static boolean positive(double code) {
        return ElectricalNetwork.isPositive(code);
    }

    /** The witness size (R or C) of a code returned by {@link #evaluate}. */
    public static double value(double code) {
        return ElectricalNetwork.value(code);
    }
}
