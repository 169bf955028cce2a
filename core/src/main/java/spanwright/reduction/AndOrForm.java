package spanwright.reduction;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import spanwright.expr.Expr;

/**
 * Negation normal form of an expression: a tree of AND and OR gates over literals, with every
 * negation pushed to the variables (De Morgan), and the operators that are not AND/OR expanded
 * into them. The result is held as a DAG (equal sub-forms are shared, built once), and each node
 * knows how many literal leaves its tree has, so an explosive expansion is detected — and its size
 * reported — before any graph is built.
 *
 * <p>Expansions (m arguments; "at least k of them" is the basic counting form):
 * <ul>
 *   <li>{@code a -> b} = {@code !a | b}; {@code a <-> b} = {@code !(a ^ b)}.</li>
 *   <li>Parity of m operands (a chain of {@code ^} or {@code parity(…)}): split the operands into
 *       halves A, B (A the larger); P(A∪B) = (P(A) &amp; ¬P(B)) | (¬P(A) &amp; P(B)), and
 *       ¬P(A∪B) = (P(A) &amp; P(B)) | (¬P(A) &amp; ¬P(B)). Leaves for literal operands:
 *       L(1) = 1, L(m) = 2(L(⌈m/2⌉) + L(⌊m/2⌋)), so L(m) = m² when m is a power of two
 *       (derived; Khrapchenko's lower bound says no formula for parity is smaller in that case).</li>
 *   <li>At least k of m: k ≤ 0 → 1, k &gt; m → 0, k = 1 → OR, k = m → AND; otherwise split into
 *       halves A, B and take OR over j of (at least j of A) &amp; (at least k−j of B).</li>
 *   <li>Negation: ¬(at least k of X) = at least m−k+1 of the negated X; {@code maj} is at least
 *       ⌊m/2⌋+1; {@code exactly(k)} = at least k of X &amp; at least m−k of ¬X;
 *       {@code atmost(k)} = at least m−k of ¬X.</li>
 * </ul>
 * Constants are folded; nested gates of one kind are flattened. Cost: polynomial in the
 * expression (each sub-expression is expanded once per polarity, each counting range once); the
 * leaf count may be exponential and is computed without enumerating the leaves.
 */
final class AndOrForm {
    /** Leaf counts saturate here (no overflow). */
    static final long SATURATED = Long.MAX_VALUE / 4;

    /** A node of the form. Immutable. */
    abstract static class Node {
        /** Number of literal leaves of the tree this node stands for (saturating). */
        final long leaves;

        Node(long leaves) {
            this.leaves = leaves;
        }
    }

    /** Constant 0 or 1 (only ever a whole form, never inside a gate). */
    static final class Constant extends Node {
        final boolean value;

        private Constant(boolean value) {
            super(0);
            this.value = value;
        }
    }

    static final Constant TRUE = new Constant(true);
    static final Constant FALSE = new Constant(false);

    /** A literal: variable {@code index} ({@code name}), positive or negated. */
    static final class Literal extends Node {
        final int index;
        final String name;
        final boolean positive;

        Literal(int index, String name, boolean positive) {
            super(1);
            this.index = index;
            this.name = name;
            this.positive = positive;
        }
    }

    /** An AND (series) or OR (parallel) gate with at least two children. */
    static final class Gate extends Node {
        final boolean and;
        final Node[] children;

        Gate(boolean and, Node[] children, long leaves) {
            super(leaves);
            this.and = and;
            this.children = children;
        }
    }

    private final Map<Expr, Node> positiveMemo = new IdentityHashMap<>();
    private final Map<Expr, Node> negativeMemo = new IdentityHashMap<>();

    private AndOrForm() {}

    /** The negation normal form of {@code e} (of {@code !e} when {@code positive} is false). */
    static Node of(Expr e, boolean positive) {
        return new AndOrForm().expand(e, positive);
    }

    private Node expand(Expr e, boolean pol) {
        Map<Expr, Node> memo = pol ? positiveMemo : negativeMemo;
        Node done = memo.get(e);
        if (done == null) {
            done = expandFresh(e, pol);
            memo.put(e, done);
        }
        return done;
    }

    private Node expandFresh(Expr e, boolean pol) {
        if (e instanceof Expr.Const) {
            return ((Expr.Const) e).value == pol ? TRUE : FALSE;
        }
        if (e instanceof Expr.Var) {
            Expr.Var v = (Expr.Var) e;
            return new Literal(v.index, v.name, pol);
        }
        if (e instanceof Expr.Not) {
            return expand(((Expr.Not) e).operand, !pol);
        }
        if (e instanceof Expr.Binary) {
            Expr.Binary b = (Expr.Binary) e;
            switch (b.op) {
                case AND:
                    return gate(pol, expand(b.left, pol), expand(b.right, pol));
                case OR:
                    return gate(!pol, expand(b.left, pol), expand(b.right, pol));
                case IMPLIES:
                    // a -> b = !a | b; its negation a & !b
                    return gate(!pol, expand(b.left, !pol), expand(b.right, pol));
                case XOR: {
                    List<Expr> operands = new ArrayList<>();
                    flattenXor(b, operands);
                    return new Parity(operands).of(0, operands.size(), pol);
                }
                default: // IFF = !(a ^ b)
                    return new Parity(List.of(b.left, b.right)).of(0, 2, !pol);
            }
        }
        Expr.Counting c = (Expr.Counting) e;
        int m = c.args.size();
        switch (c.kind) {
            case AT_LEAST:
                return pol ? new Threshold(c.args, true).of(c.k, 0, m)
                        : new Threshold(c.args, false).of(m - c.k + 1, 0, m);
            case AT_MOST:
                return pol ? new Threshold(c.args, false).of(m - c.k, 0, m)
                        : new Threshold(c.args, true).of(c.k + 1, 0, m);
            default: // EXACTLY
                if (pol) {
                    return gate(true, new Threshold(c.args, true).of(c.k, 0, m),
                            new Threshold(c.args, false).of(m - c.k, 0, m));
                }
                return gate(false, new Threshold(c.args, false).of(m - c.k + 1, 0, m),
                        new Threshold(c.args, true).of(c.k + 1, 0, m));
        }
    }

    private static void flattenXor(Expr e, List<Expr> out) {
        if (e instanceof Expr.Binary && ((Expr.Binary) e).op == Expr.Op.XOR) {
            flattenXor(((Expr.Binary) e).left, out);
            flattenXor(((Expr.Binary) e).right, out);
        } else {
            out.add(e);
        }
    }

    /** Balanced parity expansion over a list of operands, memoised by (range, polarity). */
    private final class Parity {
        private final List<Expr> operands;
        private final Map<Long, Node> memo = new HashMap<>();

        Parity(List<Expr> operands) {
            this.operands = operands;
        }

        Node of(int lo, int hi, boolean pol) {
            if (hi - lo == 1) {
                return expand(operands.get(lo), pol);
            }
            long key = ((long) lo << 33) | ((long) hi << 1) | (pol ? 1 : 0);
            Node done = memo.get(key);
            if (done != null) {
                return done;
            }
            int mid = lo + (hi - lo + 1) / 2;
            // odd parity: exactly one half odd; even parity: both odd or both even
            Node result = gate(false,
                    gate(true, of(lo, mid, true), of(mid, hi, !pol)),
                    gate(true, of(lo, mid, false), of(mid, hi, pol)));
            memo.put(key, result);
            return result;
        }
    }

    /** "At least k of args[lo, hi) have polarity {@code argPolarity}", memoised by (k, range). */
    private final class Threshold {
        private final List<Expr> args;
        private final boolean argPolarity;
        private final Map<Long, Node> memo = new HashMap<>();

        Threshold(List<Expr> args, boolean argPolarity) {
            this.args = args;
            this.argPolarity = argPolarity;
        }

        Node of(int k, int lo, int hi) {
            int m = hi - lo;
            if (k <= 0) {
                return TRUE;
            }
            if (k > m) {
                return FALSE;
            }
            long key = ((long) k << 42) | ((long) lo << 21) | hi;
            Node done = memo.get(key);
            if (done != null) {
                return done;
            }
            Node result;
            if (k == 1 || k == m) {
                Node[] all = new Node[m];
                for (int i = 0; i < m; i++) {
                    all[i] = expand(args.get(lo + i), argPolarity);
                }
                result = gate(k == m, all);
            } else {
                int mid = lo + (m + 1) / 2;
                int left = mid - lo;
                int right = hi - mid;
                List<Node> terms = new ArrayList<>();
                for (int j = Math.max(0, k - right); j <= Math.min(k, left); j++) {
                    terms.add(gate(true, of(j, lo, mid), of(k - j, mid, hi)));
                }
                result = gate(false, terms.toArray(new Node[0]));
            }
            memo.put(key, result);
            return result;
        }
    }

    /** AND ({@code and}) or OR of the children, with constants folded and like gates flattened. */
    static Node gate(boolean and, Node... children) {
        List<Node> kept = new ArrayList<>();
        for (Node c : children) {
            if (c instanceof Constant) {
                boolean v = ((Constant) c).value;
                if (v != and) {
                    return c; // 0 in an AND, 1 in an OR decides the gate
                }
                continue; // 1 in an AND, 0 in an OR drops out
            }
            if (c instanceof Gate && ((Gate) c).and == and) {
                for (Node g : ((Gate) c).children) {
                    kept.add(g);
                }
            } else {
                kept.add(c);
            }
        }
        if (kept.isEmpty()) {
            return and ? TRUE : FALSE;
        }
        if (kept.size() == 1) {
            return kept.get(0);
        }
        long leaves = 0;
        for (Node c : kept) {
            leaves = Math.min(SATURATED, leaves + c.leaves);
        }
        return new Gate(and, kept.toArray(new Node[0]), leaves);
    }
}
