package spanwright.expr;

import java.util.List;

/**
 * A Boolean expression over the variables of a scenario, resolved to variable indices.
 * Immutable. Evaluation takes an input as a bit mask in Spanwright's input order: for n variables,
 * variable i is bit (n − 1 − i) of the mask, so the mask read as a binary number is the input
 * string ("0110" = 6). Cost of {@link #eval}: O(size of the expression).
 */
public abstract class Expr {
    Expr() {}

    /** Truth value on the input {@code mask}. */
    public abstract boolean eval(long mask);

    /** Text in Spanwright's expression syntax that parses back to an equal expression. */
    @Override
    public abstract String toString();

    /** Binding strength used by the printer: higher binds tighter. */
    abstract int precedence();

    String child(Expr e, int parentPrecedence) {
        String s = e.toString();
        return e.precedence() <= parentPrecedence ? "(" + s + ")" : s;
    }

    /** Constant 0 or 1. */
    public static final class Const extends Expr {
        public final boolean value;

        public Const(boolean value) {
            this.value = value;
        }

        @Override
        public boolean eval(long mask) {
            return value;
        }

        @Override
        public String toString() {
            return value ? "1" : "0";
        }

        @Override
        int precedence() {
            return 10;
        }
    }

    /** A variable, by name and index into the scenario's variable list. */
    public static final class Var extends Expr {
        public final String name;
        public final int index;
        private final int shift;

        public Var(String name, int index, int variableCount) {
            this.name = name;
            this.index = index;
            this.shift = variableCount - 1 - index;
        }

        @Override
        public boolean eval(long mask) {
            // int arithmetic where it suffices: longs are emulated in the page's JavaScript engine
            if (shift < 31 && (mask >>> 31) == 0) {
                return (((int) mask >>> shift) & 1) != 0;
            }
            return ((mask >>> shift) & 1L) != 0;
        }

        @Override
        public String toString() {
            return name;
        }

        @Override
        int precedence() {
            return 10;
        }
    }

    /** Negation {@code !e}. */
    public static final class Not extends Expr {
        public final Expr operand;

        public Not(Expr operand) {
            this.operand = operand;
        }

        @Override
        public boolean eval(long mask) {
            return !operand.eval(mask);
        }

        @Override
        public String toString() {
            return "!" + child(operand, 8);
        }

        @Override
        int precedence() {
            return 9;
        }
    }

    /** Binary operators: and, or, xor, implication, equivalence. */
    public enum Op {
        AND("&", 5), XOR("^", 4), OR("|", 3), IMPLIES("->", 2), IFF("<->", 1);

        public final String symbol;
        final int precedence;

        Op(String symbol, int precedence) {
            this.symbol = symbol;
            this.precedence = precedence;
        }
    }

    /** {@code left op right}. */
    public static final class Binary extends Expr {
        public final Op op;
        public final Expr left;
        public final Expr right;

        public Binary(Op op, Expr left, Expr right) {
            this.op = op;
            this.left = left;
            this.right = right;
        }

        @Override
        public boolean eval(long mask) {
            switch (op) {
                case AND:
                    return left.eval(mask) && right.eval(mask);
                case OR:
                    return left.eval(mask) || right.eval(mask);
                case XOR:
                    return left.eval(mask) != right.eval(mask);
                case IMPLIES:
                    return !left.eval(mask) || right.eval(mask);
                default:
                    return left.eval(mask) == right.eval(mask);
            }
        }

        @Override
        public String toString() {
            int p = op.precedence;
            // and, or, xor are associative and print left-nested chains flat; -> is right-associative.
            String l;
            String r;
            if (op == Op.IMPLIES) {
                l = child(left, p);
                r = child(right, p - 1);
            } else if (op == Op.IFF) {
                l = child(left, p - 1);
                r = child(right, p);
            } else {
                l = child(left, p - 1 + (left instanceof Binary && ((Binary) left).op == op ? 0 : 1));
                r = child(right, p);
            }
            return l + " " + op.symbol + " " + r;
        }

        @Override
        int precedence() {
            return op.precedence;
        }
    }

    /** Counting functions over a list of arguments. */
    public enum Count {
        /** at least k of the arguments are 1 */
        AT_LEAST("thr"),
        /** exactly k are 1 */
        EXACTLY("exactly"),
        /** at most k are 1 */
        AT_MOST("atmost");

        public final String keyword;

        Count(String keyword) {
            this.keyword = keyword;
        }
    }

    /** {@code thr(k, …)}, {@code exactly(k, …)}, {@code atmost(k, …)}. */
    public static final class Counting extends Expr {
        public final Count kind;
        public final int k;
        public final List<Expr> args;
        private final Expr[] array;

        public Counting(Count kind, int k, List<Expr> args) {
            this.kind = kind;
            this.k = k;
            this.args = List.copyOf(args);
            this.array = args.toArray(new Expr[0]);
        }

        @Override
        public boolean eval(long mask) {
            int ones = 0;
            for (Expr e : array) {
                if (e.eval(mask)) {
                    ones++;
                }
            }
            switch (kind) {
                case AT_LEAST:
                    return ones >= k;
                case EXACTLY:
                    return ones == k;
                default:
                    return ones <= k;
            }
        }

        @Override
        public String toString() {
            StringBuilder sb = new StringBuilder(kind.keyword).append('(').append(k);
            for (Expr e : array) {
                sb.append(", ").append(e);
            }
            return sb.append(')').toString();
        }

        @Override
        int precedence() {
            return 10;
        }
    }
    /**
     * The s–t connectivity function of a graph whose edges are switched by literals: 1 on an input
     * exactly when s and t are joined by edges whose literal holds. It has no text in the expression
     * syntax (a scenario file carries it as the object {@code {"connects": …}}, see
     * docs/scenario-format.md); {@link #toString()} gives words. Edge i joins {@code u[i]}–{@code v[i]}
     * and is present when variable {@code variable[i]} equals {@code positive[i]}; variable −1 means
     * always present. Cost of {@link #eval}: O(|E| α(|V|)) with union–find; the arrays are private
     * copies, the work array makes evaluation not thread-safe (like the solvers, one per thread).
     */
    public static final class Connectivity extends Expr {
        private final int vertexCount;
        private final int s;
        private final int t;
        private final int[] u;
        private final int[] v;
        private final int[] variable;
        private final boolean[] positive;
        private final int variableCount;
        private final String words;
        private final int[] parent;

        public Connectivity(int vertexCount, int s, int t, int[] u, int[] v, int[] variable, boolean[] positive,
                int variableCount, String words) {
            if (s == t || s < 0 || t < 0 || s >= vertexCount || t >= vertexCount) {
                throw new IllegalArgumentException("s and t must be different vertices");
            }
            this.vertexCount = vertexCount;
            this.s = s;
            this.t = t;
            this.u = u.clone();
            this.v = v.clone();
            this.variable = variable.clone();
            this.positive = positive.clone();
            this.variableCount = variableCount;
            this.words = words;
            this.parent = new int[vertexCount];
        }

        public int vertexCount() {
            return vertexCount;
        }

        public int s() {
            return s;
        }

        public int t() {
            return t;
        }

        public int edgeCount() {
            return u.length;
        }

        public int u(int e) {
            return u[e];
        }

        public int v(int e) {
            return v[e];
        }

        /** The edge's variable index, or −1 for an always-present edge. */
        public int variable(int e) {
            return variable[e];
        }

        public boolean positive(int e) {
            return positive[e];
        }

        @Override
        public boolean eval(long mask) {
            boolean[] x = new boolean[variableCount];
            for (int i = 0; i < variableCount; i++) {
                x[i] = ((mask >>> (variableCount - 1 - i)) & 1L) != 0;
            }
            return eval(x);
        }

        /** Truth value on an assignment given variable by variable (any number of variables). */
        public boolean eval(boolean[] x) {
            for (int i = 0; i < vertexCount; i++) {
                parent[i] = i;
            }
            for (int e = 0; e < u.length; e++) {
                if (variable[e] < 0 || x[variable[e]] == positive[e]) {
                    int a = find(u[e]);
                    int b = find(v[e]);
                    if (a != b) {
                        parent[a] = b;
                    }
                }
            }
            return find(s) == find(t);
        }

        private int find(int a) {
            while (parent[a] != a) {
                parent[a] = parent[parent[a]];
                a = parent[a];
            }
            return a;
        }

        @Override
        public String toString() {
            return words;
        }

        @Override
        int precedence() {
            return 10;
        }
    }
}
