package spanwright.sweep;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import spanwright.analysis.VariableSymmetry;
import spanwright.model.Scenario;

/**
 * One member of a {@link Family}: the scenario of a size, how it was built, the builder's facts,
 * and the symmetry of its witness sizes when the family knows one (null otherwise). Immutable.
 */
public final class FamilyInstance {
    private final int size;
    private final Scenario scenario;
    private final String construction;
    private final Map<String, Object> stats;
    private final VariableSymmetry symmetry;

    public FamilyInstance(int size, Scenario scenario, String construction, Map<String, Object> stats,
            VariableSymmetry symmetry) {
        this.size = size;
        this.scenario = scenario;
        this.construction = construction;
        this.stats = Collections.unmodifiableMap(new LinkedHashMap<>(stats));
        this.symmetry = symmetry;
    }

    /** The family parameter's value. */
    public int size() {
        return size;
    }

    public Scenario scenario() {
        return scenario;
    }

    /** One line: which builder made the scenario from what. */
    public String construction() {
        return construction;
    }

    /** The builder's facts ({@code vertices}, {@code edges}, {@code variables}, …). */
    public Map<String, Object> stats() {
        return stats;
    }

    /** The symmetry of the witness sizes, or null. */
    public VariableSymmetry symmetry() {
        return symmetry;
    }
}
