package spanwright.facade;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.Map;
import spanwright.analysis.Analysis;
import spanwright.analysis.StructuralAnalysis;
import spanwright.io.Json;
import spanwright.model.Normalisation;
import spanwright.model.Scenario;

/**
 * The JSON form of a structural analysis ({@code analyze --json} beyond enumeration; keys in
 * docs/cli.md). The worst inputs carry their witnesses in the same shape as
 * {@link ResultJson#detail}.
 */
public final class StructureJson {
    private StructureJson() {}

    /** The result as an ordered JSON object. */
    public static Map<String, Object> analysis(StructuralAnalysis.Result r, Analysis.Choice choice) {
        Scenario sc = r.scenario();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("title", sc.title());
        m.put("method", "structure");
        m.put("methodReason", choice.reason());
        m.put("methodDetail", r.method());
        m.put("variables", sc.variableCount());
        m.put("domain", "all 2^" + sc.variableCount() + " inputs (not enumerated)");
        m.put("function", sc.functionText() == null ? Json.NULL : sc.functionText());
        Map<String, Object> red = new LinkedHashMap<>();
        StructuralAnalysis.Reduction rd = r.reduction();
        red.put("status", rd.status());
        red.put("correct", rd.correct() == null ? Json.NULL : (Object) rd.correct());
        red.put("counterexamples", rd.counterexamples() == null ? Json.NULL : rd.counterexamples().toString());
        red.put("first", new ArrayList<Object>(rd.firstCounterexamples()));
        red.put("how", rd.method());
        m.put("reduction", red);
        m.put("maxResistance", side(sc, r.positive()));
        m.put("maxCapacitance", side(sc, r.negative()));
        m.put("complexity", ResultJson.num(r.complexity()));
        m.put("complexityUpper", ResultJson.num(Math.sqrt(r.positive().upper() * r.negative().upper())));
        boolean wrong = Boolean.FALSE.equals(rd.correct());
        m.put("complexityIsBound", !wrong);
        if (wrong) {
            m.put("complexityNote", Analysis.notABound(String.valueOf(rd.counterexamples())));
        }
        m.put("exact", r.exact());
        if (r.cut() != null) {
            m.put("cut", r.cut());
        }
        m.put("convention", Normalisation.CONVENTION);
        m.put("caution", Normalisation.CAUTION);
        return m;
    }

    private static Map<String, Object> side(Scenario sc, StructuralAnalysis.Side s) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("value", ResultJson.num(s.value()));
        m.put("upper", ResultJson.num(s.upper()));
        m.put("exact", s.exact());
        m.put("extremeInputs", s.extremeInputs() == null ? Json.NULL : s.extremeInputs().toString());
        m.put("how", s.method());
        m.put("worst", s.worst() == null ? Json.NULL : ResultJson.detail(sc, s.worst()));
        return m;
    }
}
