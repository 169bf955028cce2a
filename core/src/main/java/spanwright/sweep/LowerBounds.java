package spanwright.sweep;

import java.util.LinkedHashMap;
import java.util.Map;
import spanwright.bounds.Bounds;
import spanwright.bounds.BoundsReport;
import spanwright.model.ScenarioException;
import spanwright.model.Scenario;

/**
 * The lower bounds of one size, where the size allows, from {@link Bounds#compute}: ADV± (certified
 * interval), ADV (certified interval), and the classical measures D, C, s, bs. Limits: ADV± up to
 * the sweep's {@code boundsMaxVariables} (at most the command-line tool's limit), ADV up to two
 * more variables, the classical measures up to four more (within their own limits). A bound not
 * computed is null with the reason. Asymptotic query-complexity bounds, not run-time estimates.
 */
final class LowerBounds {
    private LowerBounds() {}

    static Map<String, Object> compute(Scenario sc, SweepOptions options) {
        Map<String, Object> m = new LinkedHashMap<>();
        int n = sc.variableCount();
        int general = Math.min(options.boundsMaxVariables, Bounds.Limits.CLI.general());
        int positive = Math.min(options.boundsMaxVariables + 2, Bounds.Limits.CLI.positive());
        int classical = Math.min(options.boundsMaxVariables + 4, Bounds.Limits.CLI.classical());
        if (!options.bounds) {
            m.put("status", "skipped");
            m.put("reason", "lower bounds were not asked for");
            return m;
        }
        if (sc.function() == null) {
            m.put("status", "skipped");
            m.put("reason", "the instance has no function to bound");
            return m;
        }
        if (n > classical) {
            m.put("status", "skipped");
            m.put("reason", n + " variables: more than the sweep's limits for lower bounds (ADV± " + general + ", ADV "
                    + positive + ", D and the other classical measures " + classical + ")");
            return m;
        }
        BoundsReport r;
        try {
            r = Bounds.compute(sc, new Bounds.Limits("the sweep", general, positive, classical));
        } catch (Bounds.BoundViolation e) {
            m.put("status", "violation");
            m.put("reason", e.getMessage());
            return m;
        } catch (ScenarioException e) {
            m.put("status", "skipped");
            m.put("reason", e.getMessage());
            return m;
        }
        m.put("status", "ok");
        if (r.general() != null) {
            Map<String, Object> g = new LinkedHashMap<>();
            g.put("lower", r.general().lower());
            g.put("upper", r.general().upper());
            g.put("status", r.general().status().name().toLowerCase().replace('_', '-'));
            m.put("adversaryGeneral", g);
        } else {
            m.put("adversaryGeneral", null);
        }
        if (r.positive() != null) {
            Map<String, Object> p = new LinkedHashMap<>();
            p.put("lower", r.positive().lower());
            p.put("upper", r.positive().upper());
            m.put("adversary", p);
        } else {
            m.put("adversary", null);
        }
        if (r.classical() != null) {
            m.put("decisionTree", r.classical().decisionTreeDepth());
            m.put("certificate", r.classical().c());
            m.put("sensitivity", r.classical().sensitivity());
            m.put("blockSensitivity", r.classical().blockSensitivity());
        } else {
            m.put("decisionTree", null);
        }
        if (!r.reasons().isEmpty()) {
            m.put("reasons", new LinkedHashMap<String, Object>(r.reasons()));
        }
        m.put("caution", Bounds.CAUTION);
        return m;
    }
}
