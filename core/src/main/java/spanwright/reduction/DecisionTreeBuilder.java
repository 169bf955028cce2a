package spanwright.reduction;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.expr.Expr;
import spanwright.model.ScenarioException;
import spanwright.model.Condition;
import spanwright.model.Promise;
import spanwright.model.Scenario;

/**
 * From any Boolean function (an expression, or a truth table of 2^n characters) to an
 * st-connectivity instance through a decision tree or diagram ({@link DecisionDiagram}).
 *
 * <p>Graph: one vertex per decision node, s = the root; a node querying x has an edge labelled
 * {@code x} to its 1-child and {@code !x} to its 0-child; every 1-leaf is the single vertex t;
 * edges into 0-leaves are left out. On input x every decision node keeps exactly one of its two
 * out-edges (the other literal is false), so each component of G(x) holds at most one node
 * without a kept out-edge, and s reaches t exactly when the computation path from the root ends
 * in a 1-leaf; this holds for the tree and for the merged diagram alike (derived).
 *
 * <p>Strategies: with no order, a tree of minimum depth D(f) (n ≤ 14); with an order (a list of
 * some or all variables; the rest follow in declaration order), the tree that queries along that
 * order. Output: the tree, or with {@code diagram} its merged form (equal subfunctions share one
 * node: with an order this is the reduced ordered decision diagram). Both sizes are reported.
 *
 * <p><b>Weights</b>. {@link Weights#GUESS} (default): at each node guess the child whose subtree
 * has the larger rank (ties: the 1-child); the guessed edge gets weight 1, the other T/G, with
 * T = depth and G = rank (the most wrong guesses on any path). On a tree this gives
 * W₊ ≤ T + G·T/G = 2T (the s–t path has at most T guessed and at most G wrong edges) and
 * W₋ ≤ T·G/T + G·1 = 2G (put potential 1 on the path from s, which is its whole component in a
 * tree: each path node contributes its absent edge), so √(W₊W₋) ≤ 2√(GT) (derived); the
 * construction is that of Beigi &amp; Taghavi, "Quantum speedup based on classical decision trees",
 * Quantum 4 (2020), arXiv:1905.13095, after Lin &amp; Lin (Theory of Computing 2016), with G = rank
 * as identified by Cornelissen, Mande &amp; Patro, arXiv:2203.02968. {@link Weights#UNIT}: weight 1
 * everywhere (W₊ ≤ T and W₋ ≤ T on a tree, derived the same way).
 *
 * <p>Layout: layered, root at the top, t at the bottom; in a tree a node sits above the middle of
 * its children, in a diagram the nodes of a layer are spread in depth-first order.
 *
 * <p>Cost: O(2^n × expression size) for the truth table, then O(3^n · n) (minimum depth) or
 * O(2^n) (ordered), and O(size) for the graph, refused beyond {@link ScenarioDraft#MAX_EDGES}
 * edges. Stats: {@code strategy}, {@code order}, {@code output}, {@code depth},
 * {@code wrongGuesses} (the rank G), {@code treeDecisionVertices}, {@code treeVertices},
 * {@code treeEdges}, {@code diagramDecisionVertices}, {@code diagramVertices},
 * {@code diagramEdges}, {@code weights}, and for a tree {@code boundPositive},
 * {@code boundNegative} (the bounds above).
 */
public final class DecisionTreeBuilder {
    /** How edges are weighted. */
    public enum Weights {
        /** Guessed direction 1, the other T/G (Beigi &amp; Taghavi). */
        GUESS("guess"),
        /** Every edge weight 1. */
        UNIT("unit");

        public final String key;

        Weights(String key) {
            this.key = key;
        }
    }

    private static final double DX = 130;
    private static final double DY = 110;
    /** Largest tree (decision nodes) written out as the function of a truth-table scenario. */
    private static final long MAX_FUNCTION_NODES = 4L * ScenarioDraft.MAX_EDGES;

    private DecisionTreeBuilder() {}

    /**
     * Builds the tree or diagram instance of {@code function}.
     *
     * @param function an expression, or a truth table: 2^n characters 0/1 listing f on the inputs
     *     in input order (first variable most significant)
     * @param variables the variables, or null (an expression's own, in order of first appearance;
     *     x1 … xn for a truth table)
     * @param diagram output the merged diagram instead of the tree
     * @param order variables to query first, in this order, or null for a minimum-depth tree
     * @throws ScenarioException for a bad function ({@code $.function}), variable list
     *     ({@code $.variables}), order ({@code $.order}), or a result beyond the limits
     */
    public static Built build(String function, List<String> variables, boolean diagram, List<String> order,
            Weights weights) {
        String text = function == null ? "" : function.trim();
        if (spanwright.expr.ExprParser.looksLikeTruthTable(text)) {
            text = spanwright.expr.ExprParser.tableDigits(text); // "0110 1001" is the table 01101001
        }
        int tableVars = TruthTable.variablesOfString(text);
        String badLength = spanwright.expr.ExprParser.truthTableLengthProblem(text);
        if (badLength != null) {
            throw new ScenarioException("truth-table", "$.function", badLength);
        }
        List<String> vars;
        TruthTable table;
        String functionText;
        if (tableVars > 0) {
            if (tableVars > TruthTable.MAX_VARIABLES) {
                throw new ScenarioException("too-many-variables", "$.function", "a truth table of " + text.length()
                        + " values has " + tableVars + " variables; at most " + TruthTable.MAX_VARIABLES);
            }
            if (variables == null) {
                vars = new ArrayList<>();
                for (int i = 1; i <= tableVars; i++) {
                    vars.add("x" + i);
                }
            } else {
                vars = BuildSupport.variables(null, variables, "$.function", "$.variables");
                if (vars.size() != tableVars) {
                    throw new ScenarioException("variables", "$.variables", "the truth table has " + text.length()
                            + " = 2^" + tableVars + " values, so it needs " + tableVars + " variables, but "
                            + vars.size() + " are listed");
                }
            }
            table = TruthTable.ofString(text, tableVars);
            functionText = null; // written from the tree below
        } else {
            vars = BuildSupport.variables(text, variables, "$.function", "$.variables");
            Expr e = BuildSupport.parse(text, vars, "$.function");
            if (vars.size() > TruthTable.MAX_VARIABLES) {
                throw new ScenarioException("too-many-variables", "$.variables", "the function has " + vars.size()
                        + " variables; decision trees are built from the truth table, for at most "
                        + TruthTable.MAX_VARIABLES);
            }
            table = TruthTable.of(e, vars.size());
            functionText = text;
        }
        int n = vars.size();
        ScenarioDraft.checkVariableCount(n, "$.variables");

        DecisionDiagram dd;
        int[] orderIndex = null;
        if (order == null) {
            if (n > DecisionDiagram.MAX_MINIMUM_DEPTH_VARIABLES) {
                throw new ScenarioException("too-many-variables", "$.order", "a minimum-depth tree searches all 3^n subcubes,"
                        + " feasible for at most " + DecisionDiagram.MAX_MINIMUM_DEPTH_VARIABLES + " variables; this function has "
                        + n + ". Give a variable order to build an ordered tree instead");
            }
            dd = DecisionDiagram.minimumDepth(table);
        } else {
            orderIndex = fullOrder(order, vars);
            dd = DecisionDiagram.ordered(table, orderIndex);
        }

        long treeEdges = dd.treeEdges();
        int diagramEdges = dd.diagramEdges();
        long graphEdges = diagram ? diagramEdges : treeEdges;
        if (graphEdges > ScenarioDraft.MAX_EDGES) {
            throw new ScenarioException("too-large", "$.function", "the decision " + (diagram ? "diagram" : "tree")
                    + " has " + BuildSupport.count(graphEdges) + " edges, more than the limit of " + ScenarioDraft.MAX_EDGES
                    + (diagram ? "" : "; its merged diagram has " + diagramEdges + " (ask for the diagram)"));
        }
        if (functionText == null) {
            functionText = dd.treeDecisionNodes() <= MAX_FUNCTION_NODES ? expression(dd, vars).toString() : null;
        }

        ScenarioDraft d = new ScenarioDraft();
        int s = d.vertex("s", 0, 0);
        int t = d.vertex("t", 0, DY);
        double T = dd.depth();
        double G = dd.rank();
        double off = weights == Weights.GUESS && G > 0 ? T / G : 1.0;
        if (dd.isTerminal(dd.root())) {
            d.move(t, DX, 0);
            if (dd.root() == DecisionDiagram.TRUE) {
                d.edge(s, t, Condition.ALWAYS, 1.0);
            }
        } else if (diagram) {
            placeDiagram(d, dd, vars, s, t, off, orderIndex);
        } else {
            double[] slot = {0};
            double x = unfold(d, dd, vars, dd.root(), s, 0, t, off, slot);
            d.move(s, x, 0);
            d.move(t, x, (T + 1) * DY);
        }

        Map<String, Object> stats = new LinkedHashMap<>();
        stats.put("strategy", order == null ? "minimum-depth" : "ordered");
        if (orderIndex != null) {
            List<Object> names = new ArrayList<>();
            for (int i : orderIndex) {
                names.add(vars.get(i));
            }
            stats.put("order", names);
        }
        stats.put("output", diagram ? "diagram" : "tree");
        stats.put("depth", dd.depth());
        stats.put("wrongGuesses", dd.rank());
        boolean constant = dd.isTerminal(dd.root());
        stats.put("treeDecisionVertices", dd.treeDecisionNodes());
        stats.put("treeVertices", constant ? 2 : dd.treeDecisionNodes() + 1);
        stats.put("treeEdges", constant ? d.edgeCount() : treeEdges);
        stats.put("diagramDecisionVertices", dd.decisionNodes());
        stats.put("diagramVertices", constant ? 2 : dd.decisionNodes() + 1);
        stats.put("diagramEdges", constant ? d.edgeCount() : diagramEdges);
        stats.put("weights", weights.key);
        if (!diagram && !constant) {
            stats.put("boundPositive", weights == Weights.GUESS ? 2 * T : T);
            stats.put("boundNegative", weights == Weights.GUESS ? 2 * G : T);
        }
        String what = diagram ? (order == null ? "merged minimum-depth decision diagram" : "reduced ordered decision diagram")
                : (order == null ? "minimum-depth decision tree" : "ordered decision tree");
        String title = "Decision " + (diagram ? "diagram" : "tree") + " for "
                + (tableVars > 0 ? "a truth table of " + n + " variables" : BuildSupport.shorten(text));
        String notes = "Built as a " + what + " (depth " + dd.depth() + ", rank " + dd.rank()
                + "): s is the root, every 1-leaf is t, 0-leaves are left out; "
                + (weights == Weights.GUESS ? "guessed branches weight 1, the others depth/rank." : "unit weights.");
        Scenario sc = d.build(title, notes, vars, functionText, Promise.NONE, s, t, "$.variables");
        return new Built(sc, stats);
    }

    /** The order as variable indices: the listed names first, the rest in declaration order. */
    private static int[] fullOrder(List<String> order, List<String> vars) {
        int n = vars.size();
        boolean[] used = new boolean[n];
        int[] out = new int[n];
        int k = 0;
        for (int i = 0; i < order.size(); i++) {
            String name = order.get(i);
            int idx = vars.indexOf(name);
            String p = "$.order[" + i + "]";
            if (idx < 0) {
                throw new ScenarioException("unknown-variable", p, "unknown variable \"" + name + "\" in the order (variables: "
                        + String.join(", ", vars) + ")");
            }
            if (used[idx]) {
                throw new ScenarioException("duplicate-id", p, "variable \"" + name + "\" appears twice in the order");
            }
            used[idx] = true;
            out[k++] = idx;
        }
        for (int i = 0; i < n; i++) {
            if (!used[i]) {
                out[k++] = i;
            }
        }
        return out;
    }

    /** The child that is guessed at {@code v}: the one of larger rank, ties the 1-child. */
    private static int guessed(DecisionDiagram dd, int v) {
        return dd.rank(dd.high(v)) >= dd.rank(dd.low(v)) ? dd.high(v) : dd.low(v);
    }

    /** Adds the edge from vertex {@code from} for the branch of {@code v} to {@code child}, if kept. */
    private static void branch(ScenarioDraft d, DecisionDiagram dd, List<String> vars, int v, boolean one, int from,
            int to, double off) {
        int child = one ? dd.high(v) : dd.low(v);
        int x = dd.variable(v);
        double w = child == guessed(dd, v) ? 1.0 : off;
        d.edge(from, to, Condition.literal(x, vars.get(x), one), w);
    }

    /** Unfolds the tree below decision node {@code v} drawn at {@code vertex}; returns its x. */
    private static double unfold(ScenarioDraft d, DecisionDiagram dd, List<String> vars, int v, int vertex, int level,
            int t, double off, double[] slot) {
        double sum = 0;
        int kids = 0;
        for (boolean one : new boolean[] {false, true}) {
            int child = one ? dd.high(v) : dd.low(v);
            if (child == DecisionDiagram.FALSE) {
                continue;
            }
            if (child == DecisionDiagram.TRUE) {
                // the branch to t takes a column of its own, so the edges into t fan out
                branch(d, dd, vars, v, one, vertex, t, off);
                sum += (slot[0]++) * DX;
                kids++;
                continue;
            }
            int cv = d.vertex("n" + (d.vertexCount() - 1), 0, (level + 1) * DY);
            branch(d, dd, vars, v, one, vertex, cv, off);
            double cx = unfold(d, dd, vars, child, cv, level + 1, t, off, slot);
            d.move(cv, cx, (level + 1) * DY);
            sum += cx;
            kids++;
        }
        if (kids == 0) {
            return (slot[0]++) * DX;
        }
        return sum / kids;
    }

    /** The diagram: one vertex per reachable node, layered by order position or longest path. */
    private static void placeDiagram(ScenarioDraft d, DecisionDiagram dd, List<String> vars, int s, int t, double off,
            int[] orderIndex) {
        int[] nodes = dd.reachable(); // children before parents
        Map<Integer, Integer> vertexOf = new HashMap<>();
        Map<Integer, Integer> layer = new HashMap<>();
        int[] position = null;
        if (orderIndex != null) {
            position = new int[orderIndex.length];
            for (int l = 0; l < orderIndex.length; l++) {
                position[orderIndex[l]] = l;
            }
        }
        int root = dd.root();
        vertexOf.put(root, s);
        layer.put(root, 0);
        int maxLayer = 0;
        for (int i = nodes.length - 1; i >= 0; i--) { // parents before children
            int v = nodes[i];
            if (v != root) {
                vertexOf.put(v, d.vertex("n" + (d.vertexCount() - 1), 0, 0));
            }
            int lv = position != null ? position[dd.variable(v)] : layer.get(v);
            layer.put(v, lv);
            maxLayer = Math.max(maxLayer, lv);
            for (int c : new int[] {dd.low(v), dd.high(v)}) {
                if (c >= 2 && position == null) {
                    layer.put(c, Math.max(layer.getOrDefault(c, 0), lv + 1));
                }
            }
        }
        // edges, in depth-first order from the root (0-branch first), which also orders each layer
        List<List<Integer>> rows = new ArrayList<>();
        for (int l = 0; l <= maxLayer; l++) {
            rows.add(new ArrayList<>());
        }
        boolean[] visited = new boolean[nodes.length == 0 ? 0 : nodes[nodes.length - 1] + 1];
        List<Integer> stack = new ArrayList<>();
        stack.add(root);
        while (!stack.isEmpty()) {
            int v = stack.remove(stack.size() - 1);
            if (visited[v]) {
                continue;
            }
            visited[v] = true;
            rows.get(layer.get(v)).add(v);
            for (boolean one : new boolean[] {false, true}) {
                int c = one ? dd.high(v) : dd.low(v);
                if (c == DecisionDiagram.TRUE) {
                    branch(d, dd, vars, v, one, vertexOf.get(v), t, off);
                } else if (c != DecisionDiagram.FALSE) {
                    branch(d, dd, vars, v, one, vertexOf.get(v), vertexOf.get(c), off);
                }
            }
            if (dd.high(v) >= 2) {
                stack.add(dd.high(v));
            }
            if (dd.low(v) >= 2) {
                stack.add(dd.low(v));
            }
        }
        for (int l = 0; l <= maxLayer; l++) {
            List<Integer> row = rows.get(l);
            for (int k = 0; k < row.size(); k++) {
                d.move(vertexOf.get(row.get(k)), (k - (row.size() - 1) / 2.0) * DX, l * DY);
            }
        }
        d.move(t, 0, (maxLayer + 1) * DY);
    }

    /** The unfolded tree as an expression (for a truth table's {@code function}). */
    private static Expr expression(DecisionDiagram dd, List<String> vars) {
        Map<Integer, Expr> memo = new HashMap<>();
        return expression(dd, vars, dd.root(), memo);
    }

    private static Expr expression(DecisionDiagram dd, List<String> vars, int v, Map<Integer, Expr> memo) {
        if (v < 2) {
            return new Expr.Const(v == DecisionDiagram.TRUE);
        }
        Expr done = memo.get(v);
        if (done != null) {
            return done;
        }
        int i = dd.variable(v);
        Expr x = new Expr.Var(vars.get(i), i, vars.size());
        Expr notX = new Expr.Not(x);
        int lo = dd.low(v);
        int hi = dd.high(v);
        Expr e;
        if (lo == DecisionDiagram.FALSE && hi == DecisionDiagram.TRUE) {
            e = x;
        } else if (lo == DecisionDiagram.TRUE && hi == DecisionDiagram.FALSE) {
            e = notX;
        } else if (lo == DecisionDiagram.FALSE) {
            e = new Expr.Binary(Expr.Op.AND, x, expression(dd, vars, hi, memo));
        } else if (hi == DecisionDiagram.FALSE) {
            e = new Expr.Binary(Expr.Op.AND, notX, expression(dd, vars, lo, memo));
        } else if (lo == DecisionDiagram.TRUE) {
            e = new Expr.Binary(Expr.Op.OR, notX, expression(dd, vars, hi, memo));
        } else if (hi == DecisionDiagram.TRUE) {
            e = new Expr.Binary(Expr.Op.OR, x, expression(dd, vars, lo, memo));
        } else {
            e = new Expr.Binary(Expr.Op.OR, new Expr.Binary(Expr.Op.AND, x, expression(dd, vars, hi, memo)),
                    new Expr.Binary(Expr.Op.AND, notX, expression(dd, vars, lo, memo)));
        }
        memo.put(v, e);
        return e;
    }
}
