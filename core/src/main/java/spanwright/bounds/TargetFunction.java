package spanwright.bounds;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import spanwright.domain.InputDomain;
import spanwright.expr.Expr;
import spanwright.expr.ExprParser;
import spanwright.model.ScenarioException;
import spanwright.model.Inputs;
import spanwright.model.Promise;
import spanwright.model.Scenario;

/**
 * A Boolean function f restricted to its domain D ⊆ {0,1}^n (the whole cube, or the inputs a
 * promise allows): the object every measure in {@code spanwright.bounds} is computed for. Inputs
 * are masks in Spanwright's input order (first variable = most significant bit, see
 * {@link Inputs}). Holds a table of 2^n bytes, so n is at most {@link #MAX_VARIABLES}. Immutable.
 */
public final class TargetFunction {
    /** Largest n for which the table of 2^n values is built (2^20 bytes = 1 MiB). */
    public static final int MAX_VARIABLES = 20;

    /** Table entry of an input outside the domain. */
    public static final byte OUTSIDE = -1;

    private final List<String> variables;
    private final long[] inputs;
    private final byte[] table;
    private final int ones;

    /**
     * f on the listed inputs.
     *
     * @param variables the variable names, in input order
     * @param inputs the domain as masks (any order, no repeats)
     * @param values f on each input of {@code inputs}
     */
    public TargetFunction(List<String> variables, long[] inputs, boolean[] values) {
        int n = variables.size();
        if (n > MAX_VARIABLES) {
            throw new IllegalArgumentException(n + " variables: the function table is limited to " + MAX_VARIABLES);
        }
        if (inputs.length != values.length) {
            throw new IllegalArgumentException("inputs and values differ in length");
        }
        this.variables = List.copyOf(variables);
        this.table = new byte[1 << n];
        Arrays.fill(table, OUTSIDE);
        int count = 0;
        for (int k = 0; k < inputs.length; k++) {
            long x = inputs[k];
            if (x < 0 || x >= (1L << n)) {
                throw new IllegalArgumentException("input " + x + " is not a mask of " + n + " variables");
            }
            if (table[(int) x] != OUTSIDE) {
                throw new IllegalArgumentException("input " + Inputs.format(x, n) + " is listed twice");
            }
            table[(int) x] = (byte) (values[k] ? 1 : 0);
            if (values[k]) {
                count++;
            }
        }
        long[] sorted = inputs.clone();
        Arrays.sort(sorted);
        this.inputs = sorted;
        this.ones = count;
    }

    /**
     * The scenario's {@code function} on the scenario's domain (promise respected).
     *
     * @throws ScenarioException {@code no-function} when the scenario has no function;
     *     {@code too-many-variables} when n exceeds {@link #MAX_VARIABLES}; {@code empty-domain}
     *     as {@link InputDomain#of}
     */
    public static TargetFunction of(Scenario scenario) {
        Expr f = scenario.function();
        if (f == null) {
            throw new ScenarioException("no-function", "$.function",
                    "lower bounds and classical measures need the function the graph should decide: add \"function\" to the scenario");
        }
        int n = scenario.variableCount();
        if (n > MAX_VARIABLES) {
            throw new ScenarioException("too-many-variables", "$.variables", n
                    + " variables is more than the " + MAX_VARIABLES + " for which lower bounds and classical measures are tabulated");
        }
        InputDomain d = InputDomain.of(scenario);
        long[] x = new long[(int) d.size()];
        boolean[] v = new boolean[x.length];
        for (int k = 0; k < x.length; k++) {
            x[k] = d.get(k);
            v[k] = f.eval(x[k]);
        }
        return new TargetFunction(scenario.variables(), x, v);
    }

    /**
     * The expression {@code function} over {@code variables} on the inputs {@code promise} allows
     * (for tests and builders that have no scenario).
     *
     * @throws spanwright.expr.ExprException when the expression does not parse
     */
    public static TargetFunction parse(List<String> variables, String function, Promise promise) {
        Expr f = ExprParser.parse(function, variables);
        Promise p = promise == null ? Promise.NONE : promise;
        int n = variables.size();
        List<Long> xs = new ArrayList<>();
        for (long m = 0; m < (1L << n); m++) {
            if (p.allows(m)) {
                xs.add(m);
            }
        }
        long[] x = new long[xs.size()];
        boolean[] v = new boolean[x.length];
        for (int k = 0; k < x.length; k++) {
            x[k] = xs.get(k);
            v[k] = f.eval(x[k]);
        }
        return new TargetFunction(variables, x, v);
    }

    /** Variables x1..xn named {@code prefix + i} (1-based), for tests and examples. */
    public static List<String> names(String prefix, int n) {
        List<String> l = new ArrayList<>(n);
        for (int i = 1; i <= n; i++) {
            l.add(prefix + i);
        }
        return l;
    }

    public int variableCount() {
        return variables.size();
    }

    public List<String> variables() {
        return variables;
    }

    /** |D|. */
    public int size() {
        return inputs.length;
    }

    /** The k-th input of the domain (increasing masks). */
    public long input(int k) {
        return inputs[k];
    }

    /** f of the k-th input. */
    public boolean value(int k) {
        return table[(int) inputs[k]] == 1;
    }

    /** f(x) as 0 or 1, or {@link #OUTSIDE} when x is not in the domain. */
    public int valueAt(long mask) {
        return mask < 0 || mask >= table.length ? OUTSIDE : table[(int) mask];
    }

    /** Is x in the domain? */
    public boolean contains(long mask) {
        return valueAt(mask) != OUTSIDE;
    }

    /** Is the domain the whole cube? */
    public boolean isTotal() {
        return inputs.length == table.length;
    }

    /** Number of inputs with f = 1. */
    public int onesCount() {
        return ones;
    }

    /** Number of inputs with f = 0. */
    public int zerosCount() {
        return inputs.length - ones;
    }

    /** Is f constant on the domain? */
    public boolean isConstant() {
        return ones == 0 || ones == inputs.length;
    }

    /** Value of variable i (0-based, input order) in {@code mask}. */
    public boolean bit(long mask, int i) {
        return Inputs.bit(mask, i, variables.size());
    }

    /** The mask with only variable i set. */
    public long variableMask(int i) {
        return 1L << (variables.size() - 1 - i);
    }

    /** Input string of {@code mask}. */
    public String format(long mask) {
        return Inputs.format(mask, variables.size());
    }

    /** Names of the variables in {@code set} (a mask), in input order. */
    public List<String> names(long set) {
        List<String> l = new ArrayList<>();
        for (int i = 0; i < variables.size(); i++) {
            if ((set & variableMask(i)) != 0) {
                l.add(variables.get(i));
            }
        }
        return l;
    }
}
