package spanwright.reduction;

import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.expr.Expr;
import spanwright.expr.ExprException;
import spanwright.expr.ExprParser;
import spanwright.model.ScenarioException;
import spanwright.io.ScenarioReader;
import spanwright.model.Condition;
import spanwright.model.Promise;
import spanwright.model.Scenario;

/**
 * From a formula to a series–parallel st-connectivity instance. The expression is brought into
 * AND/OR form with negations on the variables ({@link AndOrForm}: De Morgan, and the documented
 * expansion of {@code ->}, {@code <->}, {@code ^}, {@code parity}, {@code maj}, {@code thr},
 * {@code exactly}, {@code atmost}); then a literal becomes an edge from s to t, an AND puts its
 * children in series (s to t through fresh junctions), an OR puts them in parallel (same s and t).
 * So s and t connect in G(x) exactly when the formula is true on x.
 *
 * <p><b>Weights</b> ({@link Weights#RULE}, the default): the inductive rule that is exact for
 * read-once formulas. With (W₊, W₋) of a child after scaling its weights by λ being (λW₊, W₋/λ):
 * in an AND node each child is scaled so that its W₋ = 1 (then W₊(AND) = Σ W₊W₋ of the children,
 * W₋(AND) = 1); in an OR node so that its W₊ = 1 (W₊(OR) = 1, W₋(OR) = Σ W₊W₋); a literal edge has
 * W₊ = W₋ = 1; finally the whole network is scaled so that W₊ = W₋. Hence √(W₊W₋) = √N for a
 * formula with N leaves — when it is read-once this is exact and optimal: Barnum &amp; Saks, "A
 * lower bound on the quantum query complexity of read-once functions", J. Comput. Syst. Sci. 69
 * (2004); Høyer, Lee &amp; Špalek, "Tight adversary bounds for composite functions", 2005,
 * arXiv:quant-ph/0509067 (adversary bound √N); Reichardt &amp; Špalek, "Span-program-based quantum
 * algorithm for evaluating formulas", STOC 2008, arXiv:0710.2630 (span programs reaching it).
 * For a formula that reads a variable twice the same recursion is an upper bound on each side,
 * since in series R adds and C is at most a failing child's, and in parallel R is at most a
 * passing child's and C adds (derived; the analysis gives the true values).
 * {@link Weights#UNIT} puts weight 1 on every edge.
 *
 * <p><b>Layout</b>: left to right; a node occupies a box of (series length × parallel width)
 * cells, series children side by side, parallel children stacked.
 *
 * <p>Cost: O(expression size²) for the expansion (see {@link AndOrForm}), O(N) for the graph,
 * where N is the number of leaves, refused when N &gt; {@link ScenarioDraft#MAX_EDGES}.
 * Stats: {@code leaves}, {@code readOnce}, {@code predictedPositive}, {@code predictedNegative},
 * {@code predictedComplexity} (the recursion's W₊, W₋ and √(W₊W₋); exact when read-once),
 * {@code weights}.
 */
public final class FormulaBuilder {
    /** How edges are weighted. */
    public enum Weights {
        /** The read-once-exact inductive rule, balanced so that W₊ = W₋. */
        RULE("rule"),
        /** Every edge weight 1. */
        UNIT("unit");

        public final String key;

        Weights(String key) {
            this.key = key;
        }
    }

    /** Horizontal and vertical size of one layout cell, in drawing units. */
    static final double CELL = 90;

    private FormulaBuilder() {}

    /**
     * Builds the network of {@code expression}.
     *
     * @param variables the variables in input order, or null to take them from the expression in
     *     order of first appearance
     * @throws ScenarioException {@code expression} (path {@code $.expression}) for a syntax error,
     *     {@code too-large} when the expansion has more than {@link ScenarioDraft#MAX_EDGES} leaves
     */
    public static Built build(String expression, List<String> variables, Weights weights) {
        return build(expression, variables, weights, ScenarioReader.MAX_ENUMERATED_VARIABLES);
    }

    /** Most variables of {@link #buildInMemory} (inputs are 64-bit masks). */
    public static final int MAX_IN_MEMORY_VARIABLES = 64;

    /**
     * As {@link #build}, but with up to {@link #MAX_IN_MEMORY_VARIABLES} variables, for scenarios
     * that stay in memory (family sweeps past brute force, which evaluate chosen inputs only).
     * Such a scenario cannot be written to a file that reads back when it has more variables
     * than the reader's enumeration limit.
     */
    public static Built buildInMemory(String expression, List<String> variables, Weights weights) {
        return build(expression, variables, weights, MAX_IN_MEMORY_VARIABLES);
    }

    private static Built build(String expression, List<String> variables, Weights weights, int maxVariables) {
        List<String> vars = BuildSupport.variables(expression, variables, "$.expression", "$.variables");
        Expr e = BuildSupport.parse(expression, vars, "$.expression");
        AndOrForm.Node form = AndOrForm.of(e, true);
        if (form.leaves > ScenarioDraft.MAX_EDGES) {
            throw new ScenarioException("too-large", "$.expression", "expanding \"" + BuildSupport.shorten(expression)
                    + "\" into AND/OR form gives " + BuildSupport.count(form.leaves)
                    + " literal edges, more than the limit of " + ScenarioDraft.MAX_EDGES
                    + " (parity, thresholds and exactly(…) grow fast; see docs/builders.md)");
        }
        String title = "Series–parallel network for " + BuildSupport.shorten(expression);
        String notes = "Built from the formula by pushing negations to the variables (AND = series, OR = parallel); "
                + (weights == Weights.RULE
                        ? "weights by the read-once rule (AND children scaled to W- = 1, OR children to W+ = 1), balanced so W+ = W-."
                        : "unit weights.");
        return network(form, vars, expression, title, notes, weights, Promise.NONE, maxVariables);
    }

    /**
     * The network of an AND/OR form; shared with the composition builder (for ¬g gadgets).
     * {@code functionText} is the scenario's function (may be null).
     */
    static Built network(AndOrForm.Node form, List<String> vars, String functionText, String title, String notes,
            Weights weights, Promise promise) {
        return network(form, vars, functionText, title, notes, weights, promise,
                ScenarioReader.MAX_ENUMERATED_VARIABLES);
    }

    private static Built network(AndOrForm.Node form, List<String> vars, String functionText, String title,
            String notes, Weights weights, Promise promise, int maxVariables) {
        ScenarioDraft d = new ScenarioDraft();
        d.allowVariables(maxVariables);
        Map<String, Object> stats = new LinkedHashMap<>();
        stats.put("leaves", form.leaves);
        int s;
        int t;
        double[] predicted = {Double.NaN, Double.NaN};
        if (form instanceof AndOrForm.Constant) {
            s = d.vertex("s", 0, 0);
            t = d.vertex("t", CELL, 0);
            if (((AndOrForm.Constant) form).value) {
                d.edge(s, t, Condition.ALWAYS, 1.0);
                predicted[0] = 1.0;
            }
            stats.put("readOnce", true);
        } else {
            Shape shape = new Shape(weights);
            shape.measure(form);
            double[] pm = shape.values.get(form);
            double balance = weights == Weights.RULE ? Math.sqrt(pm[1] / pm[0]) : 1.0;
            predicted[0] = pm[0] * balance;
            predicted[1] = pm[1] / balance;
            int[] size = shape.size.get(form);
            double mid = size[1] * CELL / 2;
            s = d.vertex("s", 0, mid);
            t = d.vertex("t", size[0] * CELL, mid);
            shape.place(d, form, s, t, 0, size[0] * CELL, 0, balance);
            stats.put("readOnce", readOnce(form, vars.size()));
        }
        stats.put("predictedPositive", predicted[0]);
        stats.put("predictedNegative", predicted[1]);
        stats.put("predictedComplexity", Math.sqrt(predicted[0] * predicted[1]));
        stats.put("weights", weights.key);
        Scenario sc = d.build(title, notes, vars, functionText, promise, s, t, "$.variables");
        return new Built(sc, stats);
    }

    /** Whether every variable labels at most one leaf of the (unshared) tree. */
    private static boolean readOnce(AndOrForm.Node form, int n) {
        for (long uses : occurrences(form, n, new IdentityHashMap<>())) {
            if (uses > 1) {
                return false;
            }
        }
        return true;
    }

    private static long[] occurrences(AndOrForm.Node node, int n, Map<AndOrForm.Node, long[]> memo) {
        long[] done = memo.get(node);
        if (done != null) {
            return done;
        }
        long[] c = new long[n];
        if (node instanceof AndOrForm.Literal) {
            c[((AndOrForm.Literal) node).index] = 1;
        } else if (node instanceof AndOrForm.Gate) {
            for (AndOrForm.Node ch : ((AndOrForm.Gate) node).children) {
                long[] cc = occurrences(ch, n, memo);
                for (int i = 0; i < n; i++) {
                    c[i] = Math.min(AndOrForm.SATURATED, c[i] + cc[i]);
                }
            }
        }
        memo.put(node, c);
        return c;
    }

    /**
     * Per-node witness-size recursion, child scale factors and layout boxes, memoised on the
     * shared DAG (each shared node is measured once, placed once per occurrence).
     */
    private static final class Shape {
        private final Weights weights;
        /** {W₊, W₋} of the node with its internal scaling applied. */
        final Map<AndOrForm.Node, double[]> values = new IdentityHashMap<>();
        /** Scale factor applied to each child, in child order. */
        final Map<AndOrForm.Node, double[]> scales = new IdentityHashMap<>();
        /** {series length, parallel width} in cells. */
        final Map<AndOrForm.Node, int[]> size = new IdentityHashMap<>();

        Shape(Weights weights) {
            this.weights = weights;
        }

        void measure(AndOrForm.Node node) {
            if (values.containsKey(node)) {
                return;
            }
            if (node instanceof AndOrForm.Literal) {
                values.put(node, new double[] {1, 1});
                size.put(node, new int[] {1, 1});
                return;
            }
            AndOrForm.Gate g = (AndOrForm.Gate) node;
            int k = g.children.length;
            double[] lambda = new double[k];
            double pos = 0;
            double neg = 0;
            int length = 0;
            int width = 0;
            for (int i = 0; i < k; i++) {
                AndOrForm.Node c = g.children[i];
                measure(c);
                double[] pm = values.get(c);
                int[] sz = size.get(c);
                if (weights == Weights.RULE) {
                    lambda[i] = g.and ? pm[1] : 1.0 / pm[0];
                } else {
                    lambda[i] = 1.0;
                }
                double p = lambda[i] * pm[0];
                double m = pm[1] / lambda[i];
                if (g.and) {
                    pos += p;
                    neg = Math.max(neg, m);
                    length += sz[0];
                    width = Math.max(width, sz[1]);
                } else {
                    pos = Math.max(pos, p);
                    neg += m;
                    length = Math.max(length, sz[0]);
                    width += sz[1];
                }
            }
            values.put(node, new double[] {pos, neg});
            scales.put(node, lambda);
            size.put(node, new int[] {length, width});
        }

        /** Adds the node's edges between u and v inside the box [x0, x1] × [top, top + width]. */
        void place(ScenarioDraft d, AndOrForm.Node node, int u, int v, double x0, double x1, double top,
                double scale) {
            if (node instanceof AndOrForm.Literal) {
                AndOrForm.Literal l = (AndOrForm.Literal) node;
                d.edge(u, v, Condition.literal(l.index, l.name, l.positive), scale);
                return;
            }
            AndOrForm.Gate g = (AndOrForm.Gate) node;
            double[] lambda = scales.get(node);
            int[] box = size.get(node);
            if (g.and) {
                double y = top + box[1] * CELL / 2;
                double x = x0;
                int from = u;
                for (int i = 0; i < g.children.length; i++) {
                    int[] cs = size.get(g.children[i]);
                    double nx = x + (x1 - x0) * cs[0] / box[0];
                    int to = i == g.children.length - 1 ? v : d.vertex("j" + (d.vertexCount() - 1), nx, y);
                    double childTop = top + (box[1] - cs[1]) * CELL / 2;
                    place(d, g.children[i], from, to, x, nx, childTop, scale * lambda[i]);
                    from = to;
                    x = nx;
                }
            } else {
                double y = top;
                for (int i = 0; i < g.children.length; i++) {
                    int[] cs = size.get(g.children[i]);
                    place(d, g.children[i], u, v, x0, x1, y, scale * lambda[i]);
                    y += cs[1] * CELL;
                }
            }
        }
    }
}
