package spanwright.reduction;

import java.util.ArrayList;
import java.util.List;
import spanwright.model.Scenario;
import spanwright.model.ScenarioException;

/**
 * Small inner scenarios for the composition builder, built in so that a composition works without
 * a second file: each is the formula builder's series–parallel network of a function of two or
 * three variables (weights by the read-once rule), so F∘g stays small (k·m variables for an outer
 * F of k variables). Names are ours; they are accepted where an inner scenario is expected
 * ({@code "inner": "either-of-2"} in a build request, {@code build compose OUTER.json either-of-2}).
 */
public final class Gadgets {
    /** A built-in gadget: its name, the function it computes and a short description. */
    public record Gadget(String name, String expression, List<String> variables, String description) {}

    /** The built-in gadgets, the default (for the page's composition) first. */
    public static final List<Gadget> ALL = List.of(
            new Gadget("either-of-2", "p | q", List.of("p", "q"), "either of two switches: two parallel edges"),
            new Gadget("both-of-2", "p & q", List.of("p", "q"), "both of two switches: two edges in series"),
            new Gadget("two-of-3", "(p & q) | (r & (p | q))", List.of("p", "q", "r"),
                    "at least two of three switches (majority), a series–parallel network with p and q read twice"));

    private Gadgets() {}

    /** The names, in order. */
    public static List<String> names() {
        List<String> l = new ArrayList<>();
        for (Gadget g : ALL) {
            l.add(g.name());
        }
        return l;
    }

    /** The gadget named {@code name}, or null. */
    public static Gadget find(String name) {
        for (Gadget g : ALL) {
            if (g.name().equals(name)) {
                return g;
            }
        }
        return null;
    }

    /**
     * The scenario of the gadget {@code name}.
     *
     * @throws ScenarioException code {@code unknown-gadget} at {@code path}, naming the built-in ones
     */
    public static Scenario scenario(String name, String path) {
        Gadget g = find(name);
        if (g == null) {
            throw new ScenarioException("unknown-gadget", path, "\"" + name + "\" is not a built-in gadget (built in: "
                    + String.join(", ", names()) + "); give a scenario instead");
        }
        Scenario f = FormulaBuilder.build(g.expression(), g.variables(), FormulaBuilder.Weights.RULE).scenario();
        return new Scenario("gadget " + g.name() + " (" + g.expression() + ")", g.description(), f.variables(),
                f.functionText(), f.function(), f.promise(), f.vertices(), f.s(), f.t(), f.edges(), f.warnings());
    }
}
