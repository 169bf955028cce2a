package spanwright.structure;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.function.ToIntFunction;
import spanwright.expr.Expr;
import spanwright.model.Deadline;
import spanwright.model.Promise;
import spanwright.model.Scenario;
import spanwright.model.ScenarioException;

/**
 * The reduction check without enumeration: does the scenario's graph G decide its target function
 * f on the domain? Three reduced ordered decision diagrams over the scenario's variables in
 * declaration order (see {@link DecisionDiagrams}): G's s–t connectivity, built by frontier-based
 * search; f, built from its expression (or, with {@link #checkAgainstConnectivity}, as the
 * connectivity of another graph); and the promise (an expression, or a Hamming-weight set through
 * the counting diagram). The counterexamples are the satisfying assignments of
 * (G ⊕ f) ∧ promise: inputs of the domain where "s and t are connected" differs from f. Their
 * number is its satisfying count; the first ones, in input order, its first satisfying
 * assignments. Because diagrams are canonical, the check holds exactly when that diagram is
 * FALSE (Bryant, IEEE Transactions on Computers C-35(8), 1986).
 *
 * <p>Cost: building the diagrams (see {@link DecisionDiagrams#connectivity} and
 * {@link DecisionDiagrams#fromExpr}) dominates; the comparison is one XOR and one AND, O(|G|·|f|·|P|)
 * at worst. Nothing here lists the 2^n inputs. Each call makes its own manager; stateless.
 * Promises that list their inputs one by one are not handled here: enumeration serves them.
 */
public final class DiagramCheck {
    /** A default node budget: a few hundred megabytes of node table at most. */
    public static final long DEFAULT_NODE_BUDGET = 20_000_000L;
    /** How the message of a check the time budget stopped begins (status {@link Status#OUT_OF_TIME}). */
    public static final String TIME_CUT = "the time budget ran out";
    /** How many counterexamples are listed. */
    public static final int LISTED = 10;

    private DiagramCheck() {}

    /** What the check could do. */
    public enum Status {
        /** the diagrams were built and compared; {@code holds} and the counts are the answer */
        CHECKED,
        /** the scenario gives no target function */
        NO_FUNCTION,
        /** the promise lists its inputs; use enumeration */
        UNSUPPORTED_PROMISE,
        /** the promise allows no input */
        EMPTY_DOMAIN,
        /** a diagram outgrew the node budget */
        TOO_LARGE,
        /** the time budget ran out while the diagrams were built or compared */
        OUT_OF_TIME
    }

    /**
     * The outcome. {@code counterexamples}, {@code domainSize} are null and {@code holds} false
     * unless {@code status} is {@link Status#CHECKED}; {@code firstCounterexamples} holds up to
     * {@link #LISTED} counterexamples in input order (entry i = variable i); node counts are
     * {@link DecisionDiagrams#nodeCount} of each diagram (0 for one not built, and for the promise
     * when there is none). {@code method} says in one line what ran; {@code message} says what
     * came out, or why nothing did and what to try. Immutable: the assignments are copied in and out.
     */
    public record Result(boolean holds, BigInteger counterexamples, List<boolean[]> firstCounterexamples,
            long graphNodes, long functionNodes, long promiseNodes, String method, Status status,
            String message, BigInteger domainSize) {
        public Result {
            firstCounterexamples = copy(firstCounterexamples);
        }

        @Override
        public List<boolean[]> firstCounterexamples() {
            return copy(firstCounterexamples);
        }

        private static List<boolean[]> copy(List<boolean[]> list) {
            List<boolean[]> out = new ArrayList<>(list.size());
            for (boolean[] x : list) {
                out.add(x.clone());
            }
            return List.copyOf(out);
        }
    }

    /**
     * Checks the scenario's graph against its target function {@code sc.function()}.
     *
     * @param maxNodes node budget of the one manager that holds all three diagrams
     */
    public static Result check(Scenario sc, long maxNodes) {
        return check(sc, maxNodes, Deadline.none());
    }

    /**
     * {@link #check(Scenario, long)} within a time budget (see {@link DecisionDiagrams#setDeadline});
     * when it runs out the result has status {@link Status#OUT_OF_TIME} and says so.
     */
    public static Result check(Scenario sc, long maxNodes, Deadline deadline) {
        if (sc.function() == null) {
            return refused(Status.NO_FUNCTION, "the scenario gives no target function, so there is nothing "
                    + "to check the graph against; add a function");
        }
        if (sc.function() instanceof Expr.Connectivity) {
            Expr.Connectivity c = (Expr.Connectivity) sc.function();
            int m = c.edgeCount();
            int[] u = new int[m];
            int[] v = new int[m];
            int[] var = new int[m];
            boolean[] positive = new boolean[m];
            for (int i = 0; i < m; i++) {
                u[i] = c.u(i);
                v[i] = c.v(i);
                var[i] = c.variable(i);
                positive[i] = c.positive(i);
            }
            return run(sc, maxNodes, dd -> dd.connectivity(c.vertexCount(), c.s(), c.t(), u, v, var, positive),
                    "f as the connectivity of its host graph", deadline);
        }
        return run(sc, maxNodes, dd -> dd.fromExpr(sc.function()), "f from its expression", deadline);
    }

    /**
     * Checks the scenario's graph against the s–t connectivity of {@code host}, a graph whose
     * edge conditions use the same variables (for example the host graph a reduction was built
     * for, when f is "s and t are connected in the host").
     *
     * @throws ScenarioException {@code host-variables} ({@code $.function}) when the host's
     *     variables are not the scenario's
     */
    public static Result checkAgainstConnectivity(Scenario sc, Scenario host, long maxNodes) {
        if (!host.variables().equals(sc.variables())) {
            throw new ScenarioException("host-variables", "$.function", "the graph whose connectivity is f has "
                    + "variables " + show(host.variables()) + ", the scenario has " + show(sc.variables())
                    + "; both must list the same variables in the same order");
        }
        return run(sc, maxNodes, dd -> connectivity(dd, host), "f as the connectivity of its host graph",
                Deadline.none());
    }

    /** The s–t connectivity diagram of {@code sc}'s graph in the manager {@code dd}. */
    public static int connectivity(DecisionDiagrams dd, Scenario sc) {
        EdgeArrays a = EdgeArrays.of(sc);
        return dd.connectivity(sc.vertexCount(), sc.s(), sc.t(), a.u(), a.v(), a.variable(), a.positive());
    }

    private static Result run(Scenario sc, long maxNodes, ToIntFunction<DecisionDiagrams> function, String how,
            Deadline deadline) {
        Promise p = sc.promise();
        if (p.kind() == Promise.Kind.INPUTS) {
            return refused(Status.UNSUPPORTED_PROMISE, "the promise lists its " + p.inputs().length
                    + " inputs one by one; the diagram check handles promises given as an expression or "
                    + "as Hamming weights; use enumeration for a listed domain");
        }
        int n = sc.variableCount();
        String method = "decision diagrams over " + n + " variables: graph by frontier-based search, " + how
                + (p.kind() == Promise.Kind.NONE ? "" : p.kind() == Promise.Kind.WEIGHTS
                        ? ", promise by Hamming-weight counting" : ", promise from its expression")
                + "; no enumeration";
        DecisionDiagrams dd = new DecisionDiagrams(n, maxNodes);
        dd.setDeadline(deadline);
        long graphNodes = 0;
        long functionNodes = 0;
        long promiseNodes = 0;
        try {
            int g = connectivity(dd, sc);
            graphNodes = dd.nodeCount(g);
            int f = function.applyAsInt(dd);
            functionNodes = dd.nodeCount(f);
            int domain = DecisionDiagrams.TRUE;
            if (p.kind() == Promise.Kind.EXPRESSION) {
                domain = dd.fromExpr(p.expr());
            } else if (p.kind() == Promise.Kind.WEIGHTS) {
                domain = dd.hammingWeightIn(p.weights());
            }
            promiseNodes = p.kind() == Promise.Kind.NONE ? 0 : dd.nodeCount(domain);
            if (domain == DecisionDiagrams.FALSE) {
                return new Result(false, null, List.of(), graphNodes, functionNodes, promiseNodes, method,
                        Status.EMPTY_DOMAIN, "the promise allows none of the 2^" + n + " inputs", null);
            }
            int bad = dd.and(dd.xor(g, f), domain);
            BigInteger count = dd.satCount(bad);
            BigInteger size = dd.satCount(domain);
            List<boolean[]> first = dd.firstSatisfying(bad, LISTED);
            boolean holds = bad == DecisionDiagrams.FALSE;
            String message = holds
                    ? "the graph decides f on all " + size + " inputs of the domain"
                    : "the graph disagrees with f on " + count + " of the " + size + " inputs of the domain";
            return new Result(holds, count, first, graphNodes, functionNodes, promiseNodes, method, Status.CHECKED,
                    message, size);
        } catch (TooLargeDiagramException e) {
            return new Result(false, null, List.of(), graphNodes, functionNodes, promiseNodes, method,
                    Status.TOO_LARGE, e.getMessage(), null);
        } catch (Deadline.Expired e) {
            return new Result(false, null, List.of(), graphNodes, functionNodes, promiseNodes, method,
                    Status.OUT_OF_TIME, TIME_CUT + " while " + e.getMessage() + "; the reduction was"
                    + " not checked (give more time, e.g. analyze --seconds)", null);
        }
    }

    private static Result refused(Status status, String message) {
        return new Result(false, null, List.of(), 0, 0, 0, "decision diagrams (not run)", status, message, null);
    }

    private static String show(List<String> names) {
        if (names.size() <= 6) {
            return "[" + String.join(", ", names) + "]";
        }
        return "[" + String.join(", ", names.subList(0, 5)) + ", … (" + names.size() + " in all)]";
    }
}
