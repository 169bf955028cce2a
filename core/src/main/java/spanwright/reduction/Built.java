package spanwright.reduction;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import spanwright.model.Scenario;

/**
 * What a builder returns: an ordinary scenario (so the analysis, the writer and the page treat it
 * like any drawn one) and an ordered map of facts about the construction, ready for JSON
 * (numbers, strings, booleans, lists of them). Every builder reports {@code vertices},
 * {@code edges} and {@code variables}; the other keys are documented on each builder and in
 * {@code docs/builders.md}. Immutable.
 */
public final class Built {
    private final Scenario scenario;
    private final Map<String, Object> stats;

    Built(Scenario scenario, Map<String, Object> extra) {
        this.scenario = scenario;
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("vertices", scenario.vertexCount());
        m.put("edges", scenario.edges().size());
        m.put("variables", scenario.variableCount());
        m.putAll(extra);
        this.stats = Collections.unmodifiableMap(m);
    }

    public Scenario scenario() {
        return scenario;
    }

    /** Facts about the construction, in a stable key order. */
    public Map<String, Object> stats() {
        return stats;
    }
}
