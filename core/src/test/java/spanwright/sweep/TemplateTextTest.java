package spanwright.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import spanwright.io.Json;
import spanwright.model.ScenarioException;

/**
 * The family template language (our own syntax, docs/sweeps.md). Expected texts are derived by
 * hand from the rules: placeholders, integer arithmetic with floor division, repetitions with the
 * default and a given separator, nesting, lone placeholders becoming numbers, {"for"} elements.
 */
class TemplateTextTest {

    static Map<String, Long> n(long v) {
        return Map.of("n", v);
    }

    @Test
    void placeholdersAndArithmetic() {
        assertEquals("x5", TemplateText.expandString("x$n", n(5), "$"));
        assertEquals("a4b", TemplateText.expandString("a$(n - 1)b", n(5), "$"));
        // derived: 7 / 2 = 3 (floor), -7 / 2 = -4 (floor), 7 % 3 = 1, 2^3^2 = 2^9 = 512 (right-assoc)
        assertEquals(3L, TemplateText.evaluate("n / 2", n(7), "$"));
        assertEquals(-4L, TemplateText.evaluate("-n / 2", n(7), "$"));
        assertEquals(1L, TemplateText.evaluate("n % 3", n(7), "$"));
        assertEquals(512L, TemplateText.evaluate("2 ^ 3 ^ 2", n(0), "$"));
        assertEquals(3L, TemplateText.evaluate("log2(n)", n(15), "$"));
        assertEquals(3L, TemplateText.evaluate("sqrt(n)", n(15), "$"));
        assertEquals(4L, TemplateText.evaluate("max(min(n, 4), 2)", n(15), "$"));
        assertEquals("cost $5", TemplateText.expandString("cost $$$n", n(5), "$"));
    }

    @Test
    void loneNumbersBecomeNumbers() {
        assertEquals(6.0, TemplateText.expandString("$(2 * n)", n(3), "$"));
        assertEquals(3.0, TemplateText.expandString("$n", n(3), "$"));
        assertEquals("$n ", TemplateText.expandString("$$n ", n(3), "$"));
        assertEquals("3x", TemplateText.expandString("$(n)x", n(3), "$"));
    }

    @Test
    void repetitions() {
        assertEquals("any(x1, x2, x3)", TemplateText.expandString("any($[i = 1 .. n: x$i])", n(3), "$"));
        assertEquals("x1 | x2 | x3", TemplateText.expandString("$[i=1..n: x$i : | ]", n(3), "$"));
        assertEquals("", TemplateText.expandString("$[i = 1 .. n: x$i]", n(0), "$"));
        // nested: derived by hand for n = 2
        assertEquals("(a1_1 & a1_2) | (a2_1 & a2_2)",
                TemplateText.expandString("$[i = 1..n: ($[j = 1..n: a$(i)_$j : & ]) : | ]", n(2), "$"));
        // brackets in the body that are not a repetition stay literal
        assertEquals("[1][2]", TemplateText.expandString("$[i = 1..2: [$i] :]", n(0), "$"));
    }

    @Test
    void forElementsInArrays() {
        Object t = Json.parse("[\"s\", {\"for\": \"i = 1 .. n\", \"emit\": [\"a$i\", \"b$i\"]}, {\"for\": \"k = 2..n\","
                + " \"emit\": {\"id\": \"v$k\", \"x\": \"$(10 * k)\"}}]");
        Object e = TemplateText.expand(t, n(2), "$");
        assertEquals(Json.parse("[\"s\", \"a1\", \"b1\", \"a2\", \"b2\", {\"id\": \"v2\", \"x\": 20}]"), e);
    }

    @Test
    void errorsNameThePathAndColumn() {
        ScenarioException e = assertThrows(ScenarioException.class,
                () -> TemplateText.expandString("x$m", n(3), "$.build.expression"));
        assertEquals("$.build.expression", e.path());
        assertTrue(e.getMessage().contains("unknown variable \"m\""), e.getMessage());
        assertTrue(e.getMessage().contains("column 4"), e.getMessage());
        e = assertThrows(ScenarioException.class, () -> TemplateText.expandString("$[i = 1 .. n: x$i", n(3), "$.f"));
        assertTrue(e.getMessage().contains("not closed"), e.getMessage());
        e = assertThrows(ScenarioException.class, () -> TemplateText.evaluate("n / (n - 3)", n(3), "$.k"));
        assertTrue(e.getMessage().contains("division by zero"), e.getMessage());
        e = assertThrows(ScenarioException.class, () -> TemplateText.evaluate("10 ^ 40", n(3), "$.k"));
        assertTrue(e.getMessage().contains("too large"), e.getMessage());
        e = assertThrows(ScenarioException.class, () -> TemplateText.expand(Json.parse("[{\"for\": \"i = 1 .. n\","
                + " \"emit\": 1, \"extra\": 2}]"), n(3), "$.x"));
        assertEquals("$.x[0].extra", e.path());
        e = assertThrows(ScenarioException.class, () -> TemplateText.expandString("$[i = 1 .. 1000000: x]", n(3), "$"));
        assertTrue(e.getMessage().contains("more than"), e.getMessage());
        assertEquals(List.of(), List.of());
    }
}
