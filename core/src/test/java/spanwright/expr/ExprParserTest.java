package spanwright.expr;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.function.Predicate;
import org.junit.jupiter.api.Test;

/**
 * The expression language: precedence, associativity, constants, functions, printing and errors.
 * Every expected value is a truth table computed by brute force in the test from the operator's
 * definition ("derived": the definition is written beside each check), never taken from the
 * parser itself.
 */
class ExprParserTest {

    private static final List<String> ABCD = List.of("a", "b", "c", "d");

    /** Value of variable {@code i} of {@code n} in {@code mask}: variable 0 is the most significant bit. */
    private static boolean bit(long mask, int i, int n) {
        return ((mask >>> (n - 1 - i)) & 1L) != 0;
    }

    /** Number of ones among the first n variables. */
    private static int ones(long mask, int n) {
        return Long.bitCount(mask & ((1L << n) - 1));
    }

    /** Asserts that {@code text} evaluates like {@code reference} on all 2^n inputs. */
    private static void assertTruthTable(String text, List<String> vars, Predicate<boolean[]> reference) {
        Expr e = ExprParser.parse(text, vars);
        int n = vars.size();
        for (long m = 0; m < (1L << n); m++) {
            boolean[] x = new boolean[n];
            for (int i = 0; i < n; i++) {
                x[i] = bit(m, i, n);
            }
            assertEquals(reference.test(x), e.eval(m), "\"" + text + "\" on input " + m + " (" + e + ")");
        }
    }

    private static boolean sameTable(Expr e1, Expr e2, int n) {
        for (long m = 0; m < (1L << n); m++) {
            if (e1.eval(m) != e2.eval(m)) {
                return false;
            }
        }
        return true;
    }

    // ------------------------------------------------------------------ evaluation order

    @Test
    void inputOrderFirstVariableIsMostSignificantBit() {
        // Source: the documented input order (input string "0110" = mask 6, first variable first).
        Expr a = ExprParser.parse("a", ABCD);
        Expr d = ExprParser.parse("d", ABCD);
        assertTrue(a.eval(0b1000));
        assertFalse(a.eval(0b0111));
        assertTrue(d.eval(0b0001));
        assertFalse(d.eval(0b1110));
    }

    @Test
    void constants() {
        // Source: definition — 0 is false and 1 is true on every input.
        assertTruthTable("0", ABCD, x -> false);
        assertTruthTable("1", ABCD, x -> true);
        assertTruthTable("!0", ABCD, x -> true);
        assertTruthTable("1 & a", ABCD, x -> x[0]);
        assertTruthTable("0 | b", ABCD, x -> x[1]);
        // constants work with no variables at all
        assertTrue(ExprParser.parse("1", List.of()).eval(0));
        assertFalse(ExprParser.parse("(0)", List.of()).eval(0));
    }

    @Test
    void eachOperatorAlone() {
        // Source: derived — the truth table of each connective from its definition.
        assertTruthTable("!a", ABCD, x -> !x[0]);
        assertTruthTable("a & b", ABCD, x -> x[0] && x[1]);
        assertTruthTable("a | b", ABCD, x -> x[0] || x[1]);
        assertTruthTable("a ^ b", ABCD, x -> x[0] != x[1]);
        assertTruthTable("a -> b", ABCD, x -> !x[0] || x[1]);
        assertTruthTable("a <-> b", ABCD, x -> x[0] == x[1]);
        assertTruthTable("a&b|!c", ABCD, x -> (x[0] && x[1]) || !x[2]); // no spaces needed
    }

    @Test
    void precedenceNotOverAndOverXorOverOrOverImpliesOverIff() {
        // Source: derived — each pair is chosen so that the two possible groupings have different
        // truth tables; the reference is the documented grouping (! > & > ^ > | > -> > <->).
        assertTruthTable("!a & b", ABCD, x -> (!x[0]) && x[1]);
        assertTruthTable("a & b ^ c", ABCD, x -> (x[0] && x[1]) != x[2]);
        assertTruthTable("a ^ b & c", ABCD, x -> x[0] != (x[1] && x[2]));
        assertTruthTable("a ^ b | c", ABCD, x -> (x[0] != x[1]) || x[2]);
        assertTruthTable("a | b ^ c", ABCD, x -> x[0] || (x[1] != x[2]));
        assertTruthTable("a | b -> c", ABCD, x -> !(x[0] || x[1]) || x[2]);
        assertTruthTable("a -> b | c", ABCD, x -> !x[0] || (x[1] || x[2]));
        assertTruthTable("a -> b <-> c", ABCD, x -> (!x[0] || x[1]) == x[2]);
        assertTruthTable("a <-> b -> c", ABCD, x -> x[0] == (!x[1] || x[2]));
        assertTruthTable("!a | b & c ^ d", ABCD, x -> !x[0] || ((x[1] && x[2]) != x[3]));
        // the groupings really differ, so the checks above can tell them apart
        assertFalse(sameTable(ExprParser.parse("(a & b) ^ c", ABCD), ExprParser.parse("a & (b ^ c)", ABCD), 4));
        assertFalse(sameTable(ExprParser.parse("(a | b) -> c", ABCD), ExprParser.parse("a | (b -> c)", ABCD), 4));
    }

    @Test
    void implicationIsRightAssociative() {
        // Source: derived — a -> b -> c means a -> (b -> c); on a=0, b=0, c=0 that is 1 while
        // (a -> b) -> c is 0, so the tables differ.
        assertTruthTable("a -> b -> c", ABCD, x -> !x[0] || (!x[1] || x[2]));
        assertFalse(ExprParser.parse("(a -> b) -> c", ABCD).eval(0b0000));
        assertTrue(ExprParser.parse("a -> b -> c", ABCD).eval(0b0000));
        assertTruthTable("a -> b -> c -> d", ABCD, x -> !x[0] || !x[1] || !x[2] || x[3]);
    }

    @Test
    void otherBinaryOperatorsChainLeftToRight() {
        // Source: derived — &, |, ^ and <-> are associative, so any grouping gives the same table;
        // the check is that long chains parse and mean the chained operation.
        assertTruthTable("a & b & c & d", ABCD, x -> x[0] && x[1] && x[2] && x[3]);
        assertTruthTable("a | b | c | d", ABCD, x -> x[0] || x[1] || x[2] || x[3]);
        assertTruthTable("a ^ b ^ c ^ d", ABCD, x -> x[0] ^ x[1] ^ x[2] ^ x[3]);
        assertTruthTable("a <-> b <-> c", ABCD, x -> (x[0] == x[1]) == x[2]);
    }

    @Test
    void parenthesesOverridePrecedence() {
        // Source: derived.
        assertTruthTable("a & (b | c)", ABCD, x -> x[0] && (x[1] || x[2]));
        assertTruthTable("!(a & b)", ABCD, x -> !(x[0] && x[1]));
        assertTruthTable("(a -> b) -> c", ABCD, x -> !(!x[0] || x[1]) || x[2]);
        assertTruthTable("((((a))))", ABCD, x -> x[0]);
        assertTruthTable("!!a", ABCD, x -> x[0]);
        assertTruthTable(" ( a\t|\nb ) ", ABCD, x -> x[0] || x[1]); // any whitespace
    }

    @Test
    void namesWithDigitsUnderscoresAndDots() {
        // Source: the documented name syntax (letter or _, then letters, digits, _ or .).
        List<String> vars = List.of("x1", "_y", "road.north", "B2_c");
        assertTruthTable("x1 & _y | road.north ^ B2_c", vars, x -> (x[0] && x[1]) || (x[2] != x[3]));
        assertTrue(ExprParser.isName("road.north"));
        assertTrue(ExprParser.isName("_"));
        assertFalse(ExprParser.isName("1a"));
        assertFalse(ExprParser.isName(".a"));
        assertFalse(ExprParser.isName(""));
        assertFalse(ExprParser.isName("a-b"));
        assertFalse(ExprParser.isName(null));
    }

    // ------------------------------------------------------------------ functions

    @Test
    void anyAllParity() {
        // Source: derived — any = OR, all = AND, parity = XOR (odd number of ones) of the arguments.
        assertTruthTable("any(a, b, c, d)", ABCD, x -> x[0] || x[1] || x[2] || x[3]);
        assertTruthTable("all(a, b, c, d)", ABCD, x -> x[0] && x[1] && x[2] && x[3]);
        assertTruthTable("parity(a, b, c, d)", ABCD, x -> count(x) % 2 == 1);
        assertTruthTable("any(a)", ABCD, x -> x[0]);
        assertTruthTable("all(b)", ABCD, x -> x[1]);
        assertTruthTable("parity(c)", ABCD, x -> x[2]);
        assertTruthTable("parity(a, a)", ABCD, x -> false);
    }

    @Test
    void majIsStrictMajority() {
        // Source: derived — strict majority of m arguments: more than m/2 are 1, i.e. at least
        // floor(m/2) + 1. For m = 4 that is 3 (a 2–2 tie is 0); for m = 2 it is AND.
        assertTruthTable("maj(a, b, c)", ABCD, x -> count(x[0], x[1], x[2]) >= 2);
        assertTruthTable("maj(a, b, c, d)", ABCD, x -> count(x) >= 3);
        assertTruthTable("maj(a, b)", ABCD, x -> x[0] && x[1]);
        assertTruthTable("maj(a)", ABCD, x -> x[0]);
        assertFalse(ExprParser.parse("maj(a, b, c, d)", ABCD).eval(0b1100), "a 2-2 tie is not a majority");
        List<String> five = List.of("p", "q", "r", "s", "t");
        Expr maj5 = ExprParser.parse("maj(p, q, r, s, t)", five);
        for (long m = 0; m < 32; m++) {
            assertEquals(ones(m, 5) >= 3, maj5.eval(m), "maj5 on " + m);
        }
    }

    @Test
    void thresholdExactlyAtMost() {
        // Source: derived — thr(k, …): at least k ones; exactly(k, …): exactly k; atmost(k, …): at most k.
        for (int k = 0; k <= 5; k++) {
            final int kk = k;
            assertTruthTable("thr(" + k + ", a, b, c, d)", ABCD, x -> count(x) >= kk);
            assertTruthTable("exactly(" + k + ", a, b, c, d)", ABCD, x -> count(x) == kk);
            assertTruthTable("atmost(" + k + ", a, b, c, d)", ABCD, x -> count(x) <= kk);
        }
        // k = 0 is always true for thr, k above the argument count is never true
        assertTruthTable("thr(0, a)", ABCD, x -> true);
        assertTruthTable("thr(9, a, b)", ABCD, x -> false);
        assertTruthTable("thr( 2 , a , b , c )", ABCD, x -> count(x[0], x[1], x[2]) >= 2);
    }

    @Test
    void functionArgumentsAreWholeExpressions() {
        // Source: derived.
        assertTruthTable("thr(2, a & b, !c, c -> d)", ABCD,
            x -> count(x[0] && x[1], !x[2], !x[2] || x[3]) >= 2);
        assertTruthTable("exactly(1, any(a, b), all(c, d))", ABCD,
            x -> count(x[0] || x[1], x[2] && x[3]) == 1);
        assertTruthTable("!maj(a, b, c) | d", ABCD, x -> !(count(x[0], x[1], x[2]) >= 2) || x[3]);
        assertTruthTable("parity(a, b) & atmost(1, c, d)", ABCD, x -> (x[0] != x[1]) && count(x[2], x[3]) <= 1);
        assertTruthTable("any (a, b)", ABCD, x -> x[0] || x[1]); // space before '('
    }

    private static int count(boolean... x) {
        int c = 0;
        for (boolean b : x) {
            if (b) {
                c++;
            }
        }
        return c;
    }

    // ------------------------------------------------------------------ printer

    @Test
    void printerRoundTripsHandWrittenExpressions() {
        // Source: the printer's contract — parse(toString(e)) evaluates equal to e on all inputs.
        String[] texts = {"a", "!a", "!!a", "!(a & b)", "a & b | c", "a & (b | c)", "(a | b) & c",
            "a -> b -> c", "(a -> b) -> c", "a <-> b <-> c", "a <-> (b <-> c)", "(a <-> b) -> c",
            "a -> (b <-> c)", "a ^ (b ^ c)", "(a ^ b) ^ c", "!(a -> b)", "maj(a, b, c)",
            "thr(2, a, !b, c | d)", "exactly(0, a)", "atmost(3, a & b, c, d, a)", "any(a, b) & all(c, d)",
            "parity(a, b, c) -> d", "1 & !0", "!(a | b) ^ !(c & d)", "(a & b) & (c & d)", "a | (b | c)"};
        for (String text : texts) {
            Expr e = ExprParser.parse(text, ABCD);
            Expr back = ExprParser.parse(e.toString(), ABCD);
            assertTrue(sameTable(e, back, 4), text + " printed as " + e);
            assertEquals(e.toString(), back.toString(), "printing is stable for " + text);
        }
        assertEquals("a & b | c", ExprParser.parse("(a & b) | c", ABCD).toString());
        assertEquals("a & (b | c)", ExprParser.parse("a & (b | c)", ABCD).toString());
        assertEquals("thr(2, a, b, c)", ExprParser.parse("thr(2,a,b,c)", ABCD).toString());
    }

    @Test
    void printerRoundTripsSeededRandomExpressions() {
        // Source: the printer's contract on random trees (seeded), built with the constructors so
        // that the printer meets shapes the parser never produces (e.g. right-nested &).
        Random random = new Random(777_123L);
        List<String> vars = List.of("a", "b", "c", "d", "e");
        for (int trial = 0; trial < 2000; trial++) {
            Expr e = randomExpr(random, vars, 1 + random.nextInt(5));
            String text = e.toString();
            Expr back;
            try {
                back = ExprParser.parse(text, vars);
            } catch (ExprException ex) {
                throw new AssertionError("trial " + trial + ": printed text does not parse: " + text, ex);
            }
            assertTrue(sameTable(e, back, vars.size()), "trial " + trial + ": " + text + " reparsed as " + back);
            assertEquals(text, back.toString(), "trial " + trial + ": printing is stable");
        }
    }

    private static Expr randomExpr(Random r, List<String> vars, int depth) {
        if (depth == 0 || r.nextInt(6) == 0) {
            if (r.nextInt(8) == 0) {
                return new Expr.Const(r.nextBoolean());
            }
            int i = r.nextInt(vars.size());
            return new Expr.Var(vars.get(i), i, vars.size());
        }
        int kind = r.nextInt(10);
        if (kind == 0) {
            return new Expr.Not(randomExpr(r, vars, depth - 1));
        }
        if (kind == 1) {
            int m = 1 + r.nextInt(4);
            List<Expr> args = new ArrayList<>();
            for (int i = 0; i < m; i++) {
                args.add(randomExpr(r, vars, depth - 1));
            }
            Expr.Count c = Expr.Count.values()[r.nextInt(3)];
            return new Expr.Counting(c, r.nextInt(m + 2), args);
        }
        Expr.Op op = Expr.Op.values()[r.nextInt(Expr.Op.values().length)];
        return new Expr.Binary(op, randomExpr(r, vars, depth - 1), randomExpr(r, vars, depth - 1));
    }

    // ------------------------------------------------------------------ errors

    private static ExprException error(String text, List<String> vars) {
        return assertThrows(ExprException.class, () -> ExprParser.parse(text, vars), text);
    }

    @Test
    void emptyExpression() {
        // Source: the language's contract (an expression is required).
        for (String text : new String[] {"", "   ", "\t\n"}) {
            ExprException e = error(text, ABCD);
            assertEquals(1, e.column(), "column for \"" + text + "\"");
            assertTrue(e.getMessage().contains("empty"), e.getMessage());
        }
    }

    @Test
    void unknownVariableNamesItAndItsColumn() {
        // Source: the contract — errors give the 1-based column where the problem starts.
        ExprException e = error("a & zz", ABCD);
        assertEquals(5, e.column());
        assertTrue(e.getMessage().contains("unknown variable 'zz'"), e.getMessage());
        assertTrue(e.getMessage().contains("a, b, c, d"), "lists the declared variables: " + e.getMessage());
        assertEquals(1, error("q", ABCD).column());
        assertEquals(4, error("  (x)", ABCD).column());
        // a function name without '(' is not a variable
        assertTrue(error("a | maj", ABCD).getMessage().contains("unknown variable 'maj'"));
    }

    @Test
    void unknownFunctionNamesItAndItsColumn() {
        ExprException e = error("a | foo(b)", ABCD);
        assertEquals(5, e.column());
        assertTrue(e.getMessage().contains("unknown function 'foo'"), e.getMessage());
        assertTrue(e.getMessage().contains("maj"), "lists the known functions: " + e.getMessage());
        assertEquals(1, error("Maj(a, b, c)", ABCD).column(), "function names are case-sensitive");
    }

    @Test
    void missingClosingParenthesis() {
        ExprException e = error("(a & b", ABCD);
        assertEquals(7, e.column());
        assertTrue(e.getMessage().contains("expected ')'"), e.getMessage());
        assertTrue(e.getMessage().contains("end of the expression"), e.getMessage());
        ExprException f = error("(a & b c", ABCD);
        assertEquals(8, f.column());
        assertTrue(f.getMessage().contains("expected ')'") && f.getMessage().contains("'c'"), f.getMessage());
        ExprException g = error("maj(a, b", ABCD);
        assertEquals(9, g.column());
        assertTrue(g.getMessage().contains("expected ',' or ')'"), g.getMessage());
    }

    @Test
    void trailingGarbage() {
        ExprException e = error("a b", ABCD);
        assertEquals(3, e.column());
        assertTrue(e.getMessage().contains("expected an operator or the end of the expression"), e.getMessage());
        assertTrue(e.getMessage().contains("'b'"), e.getMessage());
        assertEquals(6, error("a & b)", ABCD).column());
        assertEquals(3, error("a $", ABCD).column());
        assertEquals(4, error("a || b", ABCD).column(), "'||' is not an operator: the second '|' is unexpected");
    }

    @Test
    void missingOperandOrArgument() {
        ExprException e = error("a &", ABCD);
        assertEquals(4, e.column());
        assertTrue(e.getMessage().contains("expected a variable, 0, 1, '(' or a function"), e.getMessage());
        assertTrue(e.getMessage().contains("end of the expression"), e.getMessage());
        assertEquals(1, error("& a", ABCD).column());
        assertEquals(2, error("!", ABCD).column());
        assertEquals(5, error("any()", ABCD).column());
        assertEquals(8, error("any(a, )", ABCD).column());
        assertEquals(2, error("()", ABCD).column());
        assertEquals(1, error("10", ABCD).column(), "a constant is one digit");
        assertEquals(1, error("0a", ABCD).column());
        assertEquals(1, error("2", ABCD).column());
    }

    @Test
    void countingFunctionsNeedAWholeNumberK() {
        ExprException e = error("thr(a, b)", ABCD);
        assertEquals(5, e.column());
        assertTrue(e.getMessage().contains("whole number k"), e.getMessage());
        assertEquals(9, error("exactly(-1, a)", ABCD).column());
        ExprException f = error("atmost(2 a)", ABCD);
        assertEquals(10, f.column());
        assertTrue(f.getMessage().contains("','"), f.getMessage());
        assertEquals(8, error("thr(2, )", ABCD).column());
        assertTrue(error("thr(1234567, a)", ABCD).getMessage().contains("whole number k"), "k is bounded");
    }

    @Test
    void aTruthTableWhereAnExpressionIsExpectedIsNamed() {
        // Common practice, no source: a string of 0s and 1s is a truth table, not an expression;
        // the message says so, with the length a table needs when it has none of 2^n.
        ExprException odd = error("0111011", ABCD);
        assertEquals(1, odd.column());
        assertTrue(odd.getMessage().contains("a truth table needs 2^n characters 0 or 1")
                && odd.getMessage().contains("got 7; 4 would make 2 variables, 8 would make 3"), odd.getMessage());
        ExprException table = error("0110", ABCD);
        assertTrue(table.getMessage().contains("truth table of 2 variables") && table.getMessage().contains("build tree"),
                table.getMessage());
        assertEquals(null, ExprParser.truthTableLengthProblem("0110"));
        assertEquals(null, ExprParser.truthTableLengthProblem("a & b"));
        assertTrue(ExprParser.truthTableLengthProblem("011").contains("got 3; 2 would make 1 variable, 4 would make 2"));
        // single digits stay constants
        assertEquals(new Expr.Const(true).toString(), ExprParser.parse("1", ABCD).toString());
    }
}
