package spanwright.reduction;

import spanwright.io.ScenarioReader;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Function;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.expr.Expr;
import spanwright.expr.ExprParser;
import spanwright.model.ScenarioException;
import spanwright.model.Condition;
import spanwright.model.Edge;
import spanwright.model.Inputs;
import spanwright.model.Promise;
import spanwright.model.Scenario;
import spanwright.model.Vertex;

/**
 * Composition by gadget substitution: from an outer scenario F over variables y₁ … y_k and an inner
 * scenario g over z₁ … z_m, the instance for F∘g on the k·m variables {@code y.z} (outer name, a dot,
 * inner name; block y feeds the y-th copy of g). Every outer edge labelled {@code y} becomes a fresh
 * copy of g's graph with g's s and t on the edge's endpoints and its variables renamed to block y;
 * every edge labelled {@code !y} a fresh copy of a graph for ¬g, built by the formula builder from
 * g's function (so the inner scenario must have a function); edges labelled {@code 1} stay.
 * A copy is connected between its endpoints exactly when its block's g (or ¬g) is 1, and it touches
 * the rest of the graph only there, so the composed graph decides F∘g (derived).
 *
 * <p><b>Weights</b>: a copy replacing an edge of weight w has its weights scaled by w / W₊(gadget).
 * Then a present copy has resistance ≤ w and an absent one capacitance ≤ W₊W₋(gadget)/w, and by
 * Rayleigh monotonicity (for the resistances and for the capacitances) W₊ ≤ W₊(F) and
 * W₋ ≤ W₋(F) · max over the gadgets used of W₊W₋(gadget); the stat {@code productBound} is the
 * product W₊(F)·W₋(F)·max W₊W₋(gadget) (derived: extend F's optimal flow through the present
 * copies' electrical flows, and F's optimal potential into the copies — constant inside a present
 * copy, the copy's own optimal potential inside an absent one; this is the multiplicativity that
 * makes span programs compose, as used for formulas by Reichardt &amp; Špalek,
 * "Span-program-based quantum algorithm for evaluating formulas", STOC 2008, arXiv:0710.2630).
 *
 * <p>Preconditions, each refused with its path: g has a function and no promise, both scenarios
 * decide their functions (checked by the analysis, so both are enumerated: O(2^k + 2^m) inputs),
 * F's promise is none, an expression or Hamming weights (it becomes a promise on the g-values),
 * k·m is within the enumeration limit, composed names are unambiguous.
 *
 * <p>Layout: F's drawing (laid out by distance from s when it has no positions) is enlarged so a
 * gadget keeps its own size, and each copy is g's drawing mapped by the similarity that takes g's
 * s and t onto the edge's endpoints; parallel copies are shifted sideways.
 * Stats: {@code outerPositive}, {@code outerNegative}, {@code innerPositive}, {@code innerNegative},
 * {@code negatedInnerPositive}, {@code negatedInnerNegative} (when ¬g is used),
 * {@code productBound}, {@code gadgets}.
 */
public final class CompositionBuilder {
    private CompositionBuilder() {}

    /** F∘g; paths in errors start with {@code $.outer} or {@code $.inner}. */
    public static Built compose(Scenario outer, Scenario inner) {
        if (inner.function() == null) {
            throw new ScenarioException("missing", "$.inner.function", "the inner scenario needs a \"function\": it says"
                    + " what each gadget computes (and a graph for its negation is built from it)");
        }
        if (inner.promise().kind() != Promise.Kind.NONE) {
            throw new ScenarioException("promise", "$.inner.promise", "the inner scenario has a promise; composition"
                    + " needs g on all its inputs (remove the promise)");
        }
        if (outer.promise().kind() == Promise.Kind.INPUTS) {
            throw new ScenarioException("promise", "$.outer.promise", "an outer promise given as a list of inputs cannot"
                    + " be carried over; use an expression or Hamming weights");
        }
        int k = outer.variableCount();
        int m = inner.variableCount();
        if ((long) k * m > spanwright.io.ScenarioReader.MAX_ENUMERATED_VARIABLES) {
            throw new ScenarioException("too-many-variables", "$", "the composition has " + k + " × " + m + " = " + (k * m)
                    + " variables, more than the enumeration limit of " + spanwright.io.ScenarioReader.MAX_ENUMERATED_VARIABLES);
        }
        AnalysisResult ro = decides(outer, "$.outer");
        AnalysisResult ri = decides(inner, "$.inner");

        boolean negatedUsed = false;
        for (Edge e : outer.edges()) {
            negatedUsed |= !e.when().isAlways() && !e.when().positive();
        }
        Scenario negated = null;
        AnalysisResult rn = null;
        if (negatedUsed) {
            try {
                negated = FormulaBuilder.network(AndOrForm.of(inner.function(), false), inner.variables(),
                        "!(" + inner.functionText() + ")", "negation gadget", "", FormulaBuilder.Weights.RULE,
                        Promise.NONE).scenario();
            } catch (ScenarioException e) {
                throw new ScenarioException(e.code(), "$.inner.function", "building a graph for the negation of the inner"
                        + " function: " + e.getMessage());
            }
            rn = Analysis.run(negated);
        }

        // composed variables y.z, block by block
        List<String> vars = new ArrayList<>();
        Set<String> seen = new HashSet<>();
        for (String y : outer.variables()) {
            for (String z : inner.variables()) {
                String name = y + "." + z;
                if (!seen.add(name)) {
                    throw new ScenarioException("duplicate-id", "$.inner.variables", "the composed variable name \"" + name
                            + "\" arises twice (outer and inner names with dots clash); rename a variable");
                }
                vars.add(name);
            }
        }

        ScenarioDraft d = new ScenarioDraft();
        double[][] outerXy = positions(outer);
        double[][] innerXy = positions(inner);
        double[][] negXy = negated == null ? null : positions(negated);
        double scale = Math.max(1.0, span(innerXy, inner) / medianEdgeLength(outer, outerXy));
        if (negated != null) {
            scale = Math.max(scale, span(negXy, negated) / medianEdgeLength(outer, outerXy));
        }
        for (int i = 0; i < outer.vertexCount(); i++) {
            d.vertex(outer.vertices().get(i).id(), outerXy[i][0] * scale, outerXy[i][1] * scale);
        }
        Map<Long, Integer> parallelTotal = new HashMap<>();
        for (Edge e : outer.edges()) {
            parallelTotal.merge(pairKey(e), 1, Integer::sum);
        }
        Map<Long, Integer> parallelSeen = new HashMap<>();
        int gadgets = 0;
        for (Edge e : outer.edges()) {
            Condition c = e.when();
            if (c.isAlways()) {
                d.edge(e.id(), e.u(), e.v(), Condition.ALWAYS, e.weight());
                continue;
            }
            Scenario gadget = c.positive() ? inner : negated;
            double[][] gxy = c.positive() ? innerXy : negXy;
            double wPlus = (c.positive() ? ri : rn).maxResistance();
            double lambda = wPlus > 0 && !Double.isNaN(wPlus) ? e.weight() / wPlus : e.weight();
            int copy = parallelSeen.merge(pairKey(e), 1, Integer::sum) - 1;
            int copies = parallelTotal.get(pairKey(e));
            insert(d, gadget, gxy, e, c.variable(), m, vars, lambda, copy, copies);
            gadgets++;
        }

        // function and promise on the composed variables
        Function<Expr.Var, Expr> block = y -> rename(inner.function(), y.index, m, vars);
        String functionText = outer.function() == null ? null : substitute(outer.function(), block).toString();
        Promise promise = Promise.NONE;
        if (outer.promise().kind() == Promise.Kind.EXPRESSION) {
            String text = substitute(outer.promise().expr(), block).toString();
            promise = Promise.expression(text, ExprParser.parse(text, vars));
        } else if (outer.promise().kind() == Promise.Kind.WEIGHTS) {
            List<Expr> gs = new ArrayList<>();
            for (int y = 0; y < k; y++) {
                gs.add(rename(inner.function(), y, m, vars));
            }
            Expr any = null;
            for (int w : outer.promise().weights()) {
                Expr term = new Expr.Counting(Expr.Count.EXACTLY, w, gs);
                any = any == null ? term : new Expr.Binary(Expr.Op.OR, any, term);
            }
            String text = any.toString();
            promise = Promise.expression(text, ExprParser.parse(text, vars));
        }

        Map<String, Object> stats = new LinkedHashMap<>();
        stats.put("outerPositive", ro.maxResistance());
        stats.put("outerNegative", ro.maxCapacitance());
        stats.put("innerPositive", ri.maxResistance());
        stats.put("innerNegative", ri.maxCapacitance());
        double product = ri.maxResistance() * ri.maxCapacitance();
        if (rn != null) {
            stats.put("negatedInnerPositive", rn.maxResistance());
            stats.put("negatedInnerNegative", rn.maxCapacitance());
            product = Math.max(product, rn.maxResistance() * rn.maxCapacitance());
        }
        stats.put("productBound", ro.maxResistance() * ro.maxCapacitance() * product);
        stats.put("gadgets", gadgets);
        String title = "Composition: " + name(outer) + " of " + name(inner);
        String notes = "Each outer edge y (or !y) is replaced by a copy of the inner graph (or of a formula graph for its"
                + " negation) on the variables y.*, weights scaled by the edge weight over the gadget's W+.";
        Scenario sc = d.build(title, notes, vars, functionText, promise, outer.s(), outer.t(), "$");
        return new Built(sc, stats);
    }

    private static String name(Scenario sc) {
        if (!sc.title().isEmpty()) {
            return BuildSupport.shorten(sc.title());
        }
        return sc.functionText() == null ? "an untitled scenario" : BuildSupport.shorten(sc.functionText());
    }

    /** Analyses {@code sc} and refuses it when it does not decide its function. */
    private static AnalysisResult decides(Scenario sc, String path) {
        AnalysisResult r = Analysis.run(sc);
        if (Boolean.FALSE.equals(r.correct())) {
            throw new ScenarioException("wrong-reduction", path, "the " + path.substring(2) + " scenario does not decide"
                    + " its function: wrong on " + r.counterexampleCount() + " input(s), for example "
                    + Inputs.format(r.counterexamples().get(0), sc.variableCount()) + "; fix it before composing");
        }
        return r;
    }

    private static long pairKey(Edge e) {
        return ((long) Math.min(e.u(), e.v()) << 32) | Math.max(e.u(), e.v());
    }

    /** Inserts a scaled copy of {@code gadget} for outer edge {@code e} of variable block {@code y}. */
    private static void insert(ScenarioDraft d, Scenario gadget, double[][] gxy, Edge e, int y, int m, List<String> vars,
            double lambda, int copy, int copies) {
        int gs = gadget.s();
        int gt = gadget.t();
        double ux = d.x(e.u());
        double uy = d.y(e.u());
        double vx = d.x(e.v());
        double vy = d.y(e.v());
        double ax = gxy[gs][0];
        double ay = gxy[gs][1];
        double bx = gxy[gt][0];
        double by = gxy[gt][1];
        double dx1 = bx - ax;
        double dy1 = by - ay;
        double len1 = dx1 * dx1 + dy1 * dy1;
        if (len1 < 1e-18) {
            dx1 = FormulaBuilder.CELL;
            dy1 = 0;
            len1 = dx1 * dx1;
        }
        double dx2 = vx - ux;
        double dy2 = vy - uy;
        double len2 = Math.sqrt(dx2 * dx2 + dy2 * dy2);
        double rr;
        double ri;
        if (len2 < 1e-9) { // coincident endpoints: keep the gadget's own size
            rr = 1;
            ri = 0;
        } else {
            rr = (dx2 * dx1 + dy2 * dy1) / len1;
            ri = (dy2 * dx1 - dx2 * dy1) / len1;
        }
        double shift = (copy - (copies - 1) / 2.0) * 0.35 * len2;
        double nx = len2 < 1e-9 ? 0 : -dy2 / len2 * shift;
        double ny = len2 < 1e-9 ? 0 : dx2 / len2 * shift;
        int[] map = new int[gadget.vertexCount()];
        for (int i = 0; i < map.length; i++) {
            if (i == gs) {
                map[i] = e.u();
            } else if (i == gt) {
                map[i] = e.v();
            } else {
                double zx = gxy[i][0] - ax;
                double zy = gxy[i][1] - ay;
                double px = ux + zx * rr - zy * ri + nx;
                double py = uy + zx * ri + zy * rr + ny;
                String id = e.id() + "/" + gadget.vertices().get(i).id();
                while (d.indexOf(id) >= 0) {
                    id = id + "'";
                }
                map[i] = d.vertex(id, px, py);
            }
        }
        for (Edge ge : gadget.edges()) {
            if (ge.isSelfLoop()) {
                continue; // carries nothing
            }
            Condition c = ge.when();
            Condition cc = c.isAlways() ? Condition.ALWAYS
                    : Condition.literal(y * m + c.variable(), vars.get(y * m + c.variable()), c.positive());
            d.edge(e.id() + "/" + ge.id(), map[ge.u()], map[ge.v()], cc, ge.weight() * lambda);
        }
    }

    /** g with its variables renamed to block {@code y} of the composed list. */
    private static Expr rename(Expr g, int y, int m, List<String> vars) {
        return substitute(g, z -> new Expr.Var(vars.get(y * m + z.index), y * m + z.index, vars.size()));
    }

    /** {@code e} with every variable replaced by {@code f(variable)}. Cost O(size of the result). */
    static Expr substitute(Expr e, Function<Expr.Var, Expr> f) {
        if (e instanceof Expr.Const) {
            return e;
        }
        if (e instanceof Expr.Var) {
            return f.apply((Expr.Var) e);
        }
        if (e instanceof Expr.Not) {
            return new Expr.Not(substitute(((Expr.Not) e).operand, f));
        }
        if (e instanceof Expr.Binary) {
            Expr.Binary b = (Expr.Binary) e;
            return new Expr.Binary(b.op, substitute(b.left, f), substitute(b.right, f));
        }
        Expr.Counting c = (Expr.Counting) e;
        List<Expr> args = new ArrayList<>();
        for (Expr a : c.args) {
            args.add(substitute(a, f));
        }
        return new Expr.Counting(c.kind, c.k, args);
    }

    /** Positions of {@code sc}'s vertices, or a layout by distance from s when some are missing. */
    private static double[][] positions(Scenario sc) {
        double[][] xy = new double[sc.vertexCount()][];
        boolean all = true;
        for (int i = 0; i < xy.length; i++) {
            Vertex v = sc.vertices().get(i);
            xy[i] = new double[] {v.x(), v.y()};
            all &= v.hasPosition();
        }
        return all ? xy : BuildSupport.layeredByDistance(sc);
    }

    /** Distance between s and t in a drawing. */
    private static double span(double[][] xy, Scenario sc) {
        double dx = xy[sc.t()][0] - xy[sc.s()][0];
        double dy = xy[sc.t()][1] - xy[sc.s()][1];
        return Math.sqrt(dx * dx + dy * dy);
    }

    private static double medianEdgeLength(Scenario sc, double[][] xy) {
        List<Double> lengths = new ArrayList<>();
        for (Edge e : sc.edges()) {
            double dx = xy[e.v()][0] - xy[e.u()][0];
            double dy = xy[e.v()][1] - xy[e.u()][1];
            double l = Math.sqrt(dx * dx + dy * dy);
            if (l > 1e-9) {
                lengths.add(l);
            }
        }
        if (lengths.isEmpty()) {
            return FormulaBuilder.CELL;
        }
        lengths.sort(Double::compare);
        return lengths.get(lengths.size() / 2);
    }
}
