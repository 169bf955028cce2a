package spanwright.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.function.LongPredicate;
import spanwright.domain.InputDomain;
import spanwright.expr.Expr;
import spanwright.model.Deadline;
import spanwright.model.Edge;
import spanwright.model.Inputs;
import spanwright.model.Scenario;
import spanwright.model.SeededRandom;

/**
 * The inputs that can be worst — the only ones whose witness sizes must be computed to know W₊
 * and W₋ exactly — with the reason why they suffice, stated for the output.
 *
 * <p><b>Rayleigh monotonicity.</b> If variable i occurs only in positive literals, turning x_i from
 * 1 to 0 only removes edges. Removing a present edge never lowers the effective resistance
 * (Rayleigh's monotonicity law: R is a minimum over unit flows of Σ w θ², and the flows of the
 * smaller graph are among those of the larger), so a positive input x with x_i = 1 whose
 * neighbour x − e_i is still positive has R(x) ≤ R(x − e_i). Adding an edge contracts its endpoints
 * for the capacitance, which can only raise C (C is a minimum over potentials constant on present
 * edges, and the admissible potentials of the larger graph are among those of the smaller), so a
 * negative input with x_i = 0 whose neighbour x + e_i is still negative has C(x) ≤ C(x + e_i).
 * Symmetrically for variables that occur only negated; variables of both polarities give nothing;
 * variables that occur nowhere count as positive-only. An input with such a neighbour on its own
 * side is <i>dominated</i>; following neighbours ends at an undominated input of at least the
 * same value, so the maximum over the undominated inputs is W± (exactly, up to the rounding of
 * values that are equal in exact arithmetic). For a monotone instance (every condition a positive
 * literal or 1) the undominated inputs are the minimal positive and the maximal negative inputs.
 * The worst inputs reported are the first among the candidates. For a positive-only variable the
 * dominator of a positive input (x − e_i) comes earlier in input order, so in a monotone instance
 * the worst positive input is also the first of the whole domain; a dominator that comes later
 * (x + e_i of a negative input, or any step of a negated-only variable) may hide an earlier input
 * that ties with the reported one.
 *
 * <p><b>Symmetry.</b> With a {@link VariableSymmetry}, inputs of one orbit have equal witness
 * sizes and equal f, so one input per orbit (its first in input order) stands for all; the
 * dominance test is applied to those representatives, with the neighbours' connectivity computed
 * directly. Connectivity (and the reduction check) is tested on every representative.
 *
 * <p>Immutable. Memory of {@link #undominated}: one byte per input of the domain during set-up.
 */
public final class CandidateInputs {
    /** How the candidates were chosen. */
    public enum Method {
        /** every input of the domain, with Rayleigh dominance */
        MONOTONE,
        /** one input per orbit of a symmetry group, with Rayleigh dominance */
        ORBITS
    }

    /** Seeded inputs per generator for the spot check of a derived symmetry. */
    public static final int SPOT_CHECKS = 64;

    private final Method method;
    private final long[] inputs;
    private final boolean[] connected;
    private final int positiveCandidates;
    private final int negativeCandidates;
    private final double domainSize;
    private final long tested;
    private final double representedPositive;
    private final double representedNegative;
    private final boolean checked;
    private final double counterexampleCount;
    private final long[] counterexamples;
    private final String explanation;
    private final int variableCount;

    private CandidateInputs(Method method, List<Long> in, List<Boolean> conn, double domainSize, long tested,
            double representedPositive, double representedNegative, boolean checked, double counterexampleCount,
            List<Long> counterexamples, String explanation, Scenario sc) {
        this.method = method;
        this.inputs = new long[in.size()];
        this.connected = new boolean[in.size()];
        int p = 0;
        for (int i = 0; i < inputs.length; i++) {
            inputs[i] = in.get(i);
            connected[i] = conn.get(i);
            if (connected[i]) {
                p++;
            }
        }
        this.positiveCandidates = p;
        this.negativeCandidates = inputs.length - p;
        this.domainSize = domainSize;
        this.tested = tested;
        this.representedPositive = representedPositive;
        this.representedNegative = representedNegative;
        this.checked = checked;
        this.counterexampleCount = counterexampleCount;
        this.counterexamples = new long[counterexamples.size()];
        for (int i = 0; i < this.counterexamples.length; i++) {
            this.counterexamples[i] = counterexamples.get(i);
        }
        this.explanation = explanation;
        this.variableCount = sc.variableCount();
    }

    // ------------------------------------------------------------------ dominance

    /**
     * Occurrence of each variable in the edge conditions: bit 1 = in a positive literal, bit 2 = in
     * a negated literal (0 = nowhere, 3 = both polarities). Self-loops are ignored.
     */
    public static int[] occurrences(Scenario sc) {
        int[] occurs = new int[sc.variableCount()];
        for (Edge e : sc.edges()) {
            if (!e.isSelfLoop() && !e.when().isAlways()) {
                occurs[e.when().variable()] |= e.when().positive() ? 1 : 2;
            }
        }
        return occurs;
    }

    /**
     * Is input {@code x} (on the side {@code connected}) dominated: does it have a neighbour,
     * in the edge-removing direction for a positive input or the edge-adding direction for a
     * negative one, of a single-polarity variable, for which {@code sameSide} holds (the neighbour
     * is in the domain and on the same side)? See the class comment for why such inputs can be
     * skipped.
     */
    public static boolean dominated(long x, boolean connected, int[] occurs, LongPredicate sameSide) {
        int n = occurs.length;
        for (int i = 0; i < n; i++) {
            if (occurs[i] == 3) {
                continue;
            }
            long bit = 1L << (n - 1 - i);
            boolean set = (x & bit) != 0;
            // clearing the bit removes edges for a positive-only (or absent) variable
            boolean removesWhenCleared = occurs[i] != 2;
            boolean towardsFewerEdges = removesWhenCleared == set;
            if (connected == towardsFewerEdges && sameSide.test(x ^ bit)) {
                return true;
            }
        }
        return false;
    }

    /**
     * The undominated inputs of the scenario's whole domain: connectivity (and f, when given) is
     * tested on every input, witness sizes are needed only for the returned ones.
     * Cost O(|D| · (|E| α + n log |D|)); memory one byte per input.
     */
    public static CandidateInputs undominated(Scenario sc) {
        return undominated(sc, Deadline.none());
    }

    /**
     * {@link #undominated(Scenario)} within a time budget, checked once per input of the domain
     * (one step: a connectivity test and f).
     *
     * @throws Deadline.Expired naming how many inputs were tested, when the budget runs out first
     */
    public static CandidateInputs undominated(Scenario sc, Deadline deadline) {
        InputDomain domain = InputDomain.of(sc);
        if (domain.size() > Integer.MAX_VALUE - 16) {
            throw new IllegalStateException("domain too large to store");
        }
        int size = (int) domain.size();
        InputEvaluator ev = new InputEvaluator(sc);
        boolean[] conn = new boolean[size];
        long positives = 0;
        Expr f = sc.function();
        double ceCount = 0;
        List<Long> ce = new ArrayList<>();
        for (int k = 0; k < size; k++) {
            if (deadline.passed()) {
                throw new Deadline.Expired("listing the inputs that can be worst (" + k + " of " + size
                        + " inputs tested)");
            }
            long x = domain.get(k);
            conn[k] = ev.connected(x);
            if (conn[k]) {
                positives++;
            }
            if (f != null && f.eval(x) != conn[k]) {
                ceCount++;
                if (ce.size() < AnalysisRun.KEPT_COUNTEREXAMPLES) {
                    ce.add(x);
                }
            }
        }
        int[] occurs = occurrences(sc);
        List<Long> in = new ArrayList<>();
        List<Boolean> side = new ArrayList<>();
        for (int k = 0; k < size; k++) {
            long x = domain.get(k);
            boolean c = conn[k];
            if (!dominated(x, c, occurs, y -> {
                long o = domain.ordinalOf(y);
                return o >= 0 && conn[(int) o] == c;
            })) {
                in.add(x);
                side.add(c);
            }
        }
        String why = monotoneReason(sc, occurs) + " Connectivity" + (f != null ? " and f were" : " was")
                + " tested on all " + size + " inputs of the domain; witness sizes were computed on the "
                + in.size() + " undominated ones.";
        return new CandidateInputs(Method.MONOTONE, in, side, size, size, positives, size - positives, f != null,
                ceCount, ce, why, sc);
    }

    /** Outcome of checking that a symmetry leaves the instance's witness sizes unchanged. */
    public static final class SymmetryCheck {
        public final boolean holds;
        /** What was checked, or what failed (with an input). */
        public final String detail;

        SymmetryCheck(boolean holds, String detail) {
            this.holds = holds;
            this.detail = detail;
        }
    }

    /**
     * Checks {@code sym} against the scenario: for {@link VariableSymmetry.Reason#AUTOMORPHISM},
     * exactly, that each generator maps the multiset of edges (endpoints, condition, weight bits)
     * onto itself; for both reasons, on {@link #SPOT_CHECKS} seeded random inputs per generator,
     * that connectivity and f agree on x and its image and the witness sizes agree to 1e-9
     * relative. Also requires the full cube as domain.
     */
    public static SymmetryCheck check(Scenario sc, VariableSymmetry sym, long seed) {
        int n = sc.variableCount();
        if (sym.variableCount() != n) {
            return new SymmetryCheck(false, "the symmetry acts on " + sym.variableCount() + " variables, the scenario has " + n);
        }
        if (sc.promise().kind() != spanwright.model.Promise.Kind.NONE) {
            return new SymmetryCheck(false, "a promise restricts the domain; orbits are only used on the full cube");
        }
        List<int[]> gens = sym.generators();
        if (sym.reason() == VariableSymmetry.Reason.AUTOMORPHISM) {
            List<String> base = edgeKeys(sc, null);
            for (int[] g : gens) {
                if (!base.equals(edgeKeys(sc, g))) {
                    return new SymmetryCheck(false, "a generator does not map the graph onto itself with every vertex fixed");
                }
            }
        }
        InputEvaluator ev = new InputEvaluator(sc);
        SeededRandom rnd = new SeededRandom(seed);
        Expr f = sc.function();
        for (int[] g : gens) {
            for (int k = 0; k < SPOT_CHECKS; k++) {
                long x = n == 64 ? rnd.nextLong() : rnd.nextLong() & ((1L << n) - 1);
                long y = VariableSymmetry.apply(g, x);
                double a = ev.evaluate(x);
                double b = ev.evaluate(y);
                boolean fa = f == null || f.eval(x);
                boolean fb = f == null || f.eval(y);
                if ((a >= 0) != (b >= 0) || fa != fb
                        || Math.abs(InputEvaluator.value(a) - InputEvaluator.value(b))
                                > 1e-9 * Math.max(1e-300, Math.abs(InputEvaluator.value(a)))) {
                    return new SymmetryCheck(false, "input " + Inputs.format(x, n) + " and its image "
                            + Inputs.format(y, n) + " differ (" + InputEvaluator.value(a) + " vs "
                            + InputEvaluator.value(b) + ")");
                }
            }
        }
        String what = (sym.reason() == VariableSymmetry.Reason.AUTOMORPHISM ? "each of the " + gens.size()
                + " generators maps the edges onto themselves (checked exactly), and " : "")
                + "witness sizes, connectivity and f agree on " + SPOT_CHECKS + " seeded inputs and their images under each of the "
                + gens.size() + " generators";
        return new SymmetryCheck(true, what);
    }

    /** Sorted edge keys (endpoints, condition with permuted variable, weight bits). */
    private static List<String> edgeKeys(Scenario sc, int[] perm) {
        List<String> keys = new ArrayList<>();
        for (Edge e : sc.edges()) {
            int a = Math.min(e.u(), e.v());
            int b = Math.max(e.u(), e.v());
            String cond = e.when().isAlways() ? "1"
                    : (e.when().positive() ? "+" : "-") + (perm == null ? e.when().variable() : perm[e.when().variable()]);
            keys.add(a + " " + b + " " + cond + " " + Long.toHexString(Double.doubleToLongBits(e.weight())));
        }
        keys.sort(null);
        return keys;
    }

    /**
     * One input per orbit of {@code sym} (its first in input order), connectivity and f tested on
     * each, the dominated ones dropped. The caller should have run {@link #check}; the
     * explanation quotes {@code checkDetail}.
     *
     * @throws IllegalStateException when there are more than {@link VariableSymmetry#MAX_ORBITS} orbits
     */
    public static CandidateInputs orbits(Scenario sc, VariableSymmetry sym, String checkDetail) {
        int n = sc.variableCount();
        InputEvaluator ev = new InputEvaluator(sc);
        int[] occurs = occurrences(sc);
        Expr f = sc.function();
        List<Long> in = new ArrayList<>();
        List<Boolean> side = new ArrayList<>();
        double[] represented = new double[2];
        double[] ceCount = new double[1];
        long[] orbitCount = new long[1];
        List<Long> ce = new ArrayList<>();
        sym.forEachOrbit((rep, size) -> {
            orbitCount[0]++;
            boolean c = ev.connected(rep);
            represented[c ? 0 : 1] += size;
            if (f != null && f.eval(rep) != c) {
                ceCount[0] += size;
                if (ce.size() < AnalysisRun.KEPT_COUNTEREXAMPLES) {
                    ce.add(rep);
                }
            }
            if (!dominated(rep, c, occurs, y -> ev.connected(y) == c)) {
                in.add(rep);
                side.add(c);
            }
        });
        double domain = Math.pow(2, n);
        boolean unate = false;
        for (int o : occurs) {
            unate |= o != 3;
        }
        String why = "The instance is invariant under " + sym.describe() + "; here " + checkDetail
                + ". Inputs of one orbit have equal witness sizes and equal f, so one input per orbit stands for all: "
                + orbitCount[0] + " orbits for the 2^" + n + " inputs; connectivity" + (f != null ? " and f were" : " was")
                + " tested on each orbit's first input. "
                + (unate ? monotoneReason(sc, occurs) + " Witness sizes were computed on the " + in.size()
                        + " undominated orbit representatives."
                        : "Witness sizes were computed on every representative.");
        return new CandidateInputs(Method.ORBITS, in, side, domain, orbitCount[0], represented[0], represented[1],
                f != null, ceCount[0], ce, why, sc);
    }

    private static String monotoneReason(Scenario sc, int[] occurs) {
        List<String> pos = new ArrayList<>();
        List<String> neg = new ArrayList<>();
        int both = 0;
        for (int i = 0; i < occurs.length; i++) {
            if (occurs[i] == 3) {
                both++;
            } else if (occurs[i] == 2) {
                neg.add(sc.variables().get(i));
            } else {
                pos.add(sc.variables().get(i));
            }
        }
        StringBuilder sb = new StringBuilder();
        if (both == 0 && neg.isEmpty()) {
            sb.append("Every condition is a positive literal or 1 (a monotone instance), so only the minimal"
                    + " positive and the maximal negative inputs can be worst");
        } else {
            sb.append(pos.size()).append(" variable(s) occur only as positive literals, ").append(neg.size())
                    .append(" only negated and ").append(both).append(" in both polarities; only inputs with no"
                    + " single-variable neighbour on their own side in the edge-removing (positive) or edge-adding"
                    + " (negative) direction of a single-polarity variable can be worst");
        }
        sb.append(" (Rayleigh monotonicity: removing a present edge never lowers R, adding one never lowers C);"
                + " the worst inputs named are the first among those evaluated.");
        return sb.toString();
    }

    // ------------------------------------------------------------------ accessors

    public Method method() {
        return method;
    }

    /** All candidates (masks), in input order. */
    public long[] inputs() {
        return inputs.clone();
    }

    /** Number of candidates. */
    public int size() {
        return inputs.length;
    }

    /** Candidate {@code i} (input order). */
    public long input(int i) {
        return inputs[i];
    }

    public boolean connected(int i) {
        return connected[i];
    }

    /** The positive candidates, in input order. */
    public long[] positives() {
        return side(true);
    }

    /** The negative candidates, in input order. */
    public long[] negatives() {
        return side(false);
    }

    private long[] side(boolean positive) {
        long[] r = new long[positive ? positiveCandidates : negativeCandidates];
        int k = 0;
        for (int i = 0; i < inputs.length; i++) {
            if (connected[i] == positive) {
                r[k++] = inputs[i];
            }
        }
        return r;
    }

    public int positiveCandidates() {
        return positiveCandidates;
    }

    public int negativeCandidates() {
        return negativeCandidates;
    }

    /** Size of the domain (exact below 2^53; 2^64 for 64 variables). */
    public double domainSize() {
        return domainSize;
    }

    /** Inputs (or orbit representatives) whose connectivity was tested. */
    public long tested() {
        return tested;
    }

    /** Inputs of the domain on the positive side (orbit sizes added; exact below 2^53). */
    public double representedPositive() {
        return representedPositive;
    }

    public double representedNegative() {
        return representedNegative;
    }

    /** Whether f was checked (a function is given). */
    public boolean checked() {
        return checked;
    }

    /** Inputs on which connectivity differs from f (orbit sizes added). */
    public double counterexampleCount() {
        return counterexampleCount;
    }

    /** The first counterexamples (representatives), input order. */
    public long[] counterexamples() {
        return counterexamples.clone();
    }

    /** Which inputs were evaluated, and why that suffices: a paragraph for the output. */
    public String explanation() {
        return explanation;
    }

    public int variableCount() {
        return variableCount;
    }
}
