package spanwright.expr;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Expressions of any size the limits allow parse, evaluate and print without deep recursion;
 * deeper ones are refused with a message that names the limit. Sizes that once overflowed the
 * stack (765 parentheses, 11,842 '!', an OR of 23,591 terms) are checked by name. Values: derived
 * (an OR is 1 exactly when one of its terms is; !!x = x; parentheses do not change a value).
 */
class ExprLimitsTest {
    private static final List<String> AB = List.of("a", "b");

    @Test
    void deepParenthesesAreRefusedWithTheLimit() {
        String deep = "(".repeat(765) + "a" + ")".repeat(765);
        ExprException e = assertThrows(ExprException.class, () -> ExprParser.parse(deep, AB));
        assertTrue(e.getMessage().contains("more than " + ExprParser.MAX_NESTING + " levels"), e.getMessage());
        assertEquals(ExprParser.MAX_NESTING + 1, e.column(), "the column of the first parenthesis too many");
        // at the limit it parses, and the value is a's (derived)
        String ok = "(".repeat(ExprParser.MAX_NESTING) + "a" + ")".repeat(ExprParser.MAX_NESTING);
        Expr x = ExprParser.parse(ok, AB);
        assertTrue(x.eval(0b10));
        assertEquals(false, x.eval(0b01));
    }

    @Test
    void longNegationChainsAreRefused() {
        ExprException e = assertThrows(ExprException.class, () -> ExprParser.parse("!".repeat(11_842) + "a", AB));
        assertTrue(e.getMessage().contains("levels deep"), e.getMessage());
        // derived: 200 negations are the identity
        Expr x = ExprParser.parse("!".repeat(200) + "a", AB);
        assertTrue(x.eval(0b10));
        assertEquals(false, x.eval(0b00));
    }

    @Test
    void longImplicationChainsAreRefused() {
        StringBuilder sb = new StringBuilder("a");
        for (int i = 0; i < 5000; i++) {
            sb.append(" -> b");
        }
        assertThrows(ExprException.class, () -> ExprParser.parse(sb.toString(), AB));
    }

    @Test
    void aHugeOrIsBalancedAndWorks() {
        int terms = 23_591;
        List<String> vars = new ArrayList<>();
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < 60; i++) {
            vars.add("x" + i);
        }
        for (int i = 0; i < terms; i++) {
            sb.append(i == 0 ? "" : " | ").append("x").append(i % 60);
        }
        Expr e = ExprParser.parse(sb.toString(), vars);
        assertTrue(ExprParser.depth(e) <= 20, "balanced: depth " + ExprParser.depth(e));
        // derived: an OR of all 60 variables is 0 only on the all-zero input
        assertEquals(false, e.eval(0L));
        assertTrue(e.eval(1L));
        assertTrue(e.eval(1L << 59));
        // the printed text parses back to the same function
        Expr back = ExprParser.parse(e.toString(), vars);
        for (long x : new long[] {0, 1, 2, 1L << 40, (1L << 60) - 1}) {
            assertEquals(e.eval(x), back.eval(x));
        }
        // any(…) of many arguments likewise
        StringBuilder any = new StringBuilder("any(x0");
        for (int i = 1; i < terms; i++) {
            any.append(", x").append(i % 60);
        }
        Expr a = ExprParser.parse(any.append(')').toString(), vars);
        assertTrue(ExprParser.depth(a) <= 20);
        assertTrue(a.eval(1L << 30));
    }

    @Test
    void shortChainsKeepTheirWrittenShape() {
        // the printer's output of short chains is unchanged: left-nested, printed flat
        List<String> v = List.of("a", "b", "c", "d");
        assertEquals("a | b | c | d", ExprParser.parse("a | b | c | d", v).toString());
        assertEquals("a & (b | c)", ExprParser.parse("a & (b | c)", v).toString());
    }

    @Test
    void thresholdsTakeAsciiDigitsOnly() {
        // '١' is ARABIC-INDIC DIGIT ONE (U+0661); Integer.parseInt would accept it
        assertThrows(ExprException.class, () -> ExprParser.parse("thr(\u0661, a, b)", AB));
        assertTrue(ExprParser.parse("thr(1, a, b)", AB).eval(0b01));
    }
}
