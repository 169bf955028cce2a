package spanwright.facade;

import spanwright.io.Json;
import spanwright.io.ScenarioReader;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.model.Scenario;

/**
 * {@link JsonFacade#build}: the request kinds of its javadoc, the answer envelope, and errors with
 * request paths. Source: the facade's documented contract; the built scenarios are checked by
 * the analysis (independent enumeration).
 */
class JsonFacadeBuildTest {

    @SuppressWarnings("unchecked")
    private static Map<String, Object> answer(String request) {
        return (Map<String, Object>) Json.parse(JsonFacade.build(request));
    }

    @SuppressWarnings("unchecked")
    private static Scenario scenarioOf(Map<String, Object> a) {
        assertEquals(true, a.get("ok"), String.valueOf(a.get("error")));
        Map<String, Object> stats = (Map<String, Object>) a.get("stats");
        Scenario sc = ScenarioReader.fromJson(a.get("scenario"));
        assertEquals((double) sc.vertexCount(), stats.get("vertices"));
        assertEquals((double) sc.edges().size(), stats.get("edges"));
        return sc;
    }

    @Test
    void everyKindAnswersAScenarioAndStats() {
        String[] requests = {"{\"kind\":\"formula\",\"expression\":\"a & (b | !c)\"}",
            "{\"kind\":\"formula\",\"expression\":\"a | b\",\"variables\":[\"b\",\"a\"],\"weights\":\"unit\"}",
            "{\"kind\":\"tree\",\"function\":\"maj(a,b,c)\",\"diagram\":true,\"order\":[\"c\"]}",
            "{\"kind\":\"tree\",\"function\":\"0111\",\"variables\":[\"p\",\"q\"],\"weights\":\"unit\"}",
            "{\"kind\":\"host\",\"family\":\"grid\",\"size\":[2,3],\"s\":\"r1c1\",\"t\":\"r2c3\"}",
            "{\"kind\":\"host\",\"family\":\"hypercube\",\"size\":3,\"atMostMissing\":1}",
            "{\"kind\":\"host\",\"family\":\"random\",\"size\":[6,8],\"seed\":3}"};
        for (String req : requests) {
            Scenario sc = scenarioOf(answer(req));
            assertEquals(Boolean.TRUE, Analysis.run(sc).correct(), req);
        }
    }

    @Test
    void composeAndGivenTakeEmbeddedScenarios() {
        String outer = JsonFacade.build("{\"kind\":\"formula\",\"expression\":\"y1 & y2\"}");
        String inner = JsonFacade.build("{\"kind\":\"formula\",\"expression\":\"a | b\"}");
        String o = Json.write(((Map<?, ?>) Json.parse(outer)).get("scenario"));
        String i = Json.write(((Map<?, ?>) Json.parse(inner)).get("scenario"));
        Scenario sc = scenarioOf(answer("{\"kind\":\"compose\",\"outer\":" + o + ",\"inner\":" + i + "}"));
        assertEquals(Boolean.TRUE, Analysis.run(sc).correct());
        Scenario h = scenarioOf(answer("{\"kind\":\"host\",\"family\":\"given\",\"scenario\":" + o + "}"));
        assertEquals(Boolean.TRUE, Analysis.run(h).correct());
    }

    @Test
    @SuppressWarnings("unchecked")
    void errorsComeBackInTheEnvelopeWithTheirPath() {
        String[][] cases = {{"{\"kind\":\"formula\",\"expression\":\"a $ b\"}", "$.expression"},
            {"{\"kind\":\"shape\"}", "$.kind"}, {"{\"expression\":\"a\"}", "$.kind"},
            {"{\"kind\":\"host\",\"family\":\"grid\",\"size\":[1,4]}", "$.size"},
            {"{\"kind\":\"host\",\"family\":\"grid\",\"size\":[2.5,4]}", "$.size[0]"},
            {"{\"kind\":\"host\",\"family\":\"grid\"}", "$.size"},
            {"{\"kind\":\"tree\",\"function\":\"a\",\"diagram\":\"yes\"}", "$.diagram"},
            {"{\"kind\":\"formula\",\"expression\":\"a\",\"weights\":\"heavy\"}", "$.weights"},
            {"{\"kind\":\"compose\",\"outer\":{\"format\":\"x\"},\"inner\":{}}", "$.outer.format"},
            {"{\"kind\":\"compose\",\"outer\":{}}", "$.inner"}, {"not json", "$"}};
        for (String[] c : cases) {
            Map<String, Object> a = answer(c[0]);
            assertEquals(false, a.get("ok"), c[0]);
            Map<String, Object> err = (Map<String, Object>) a.get("error");
            assertEquals(c[1], err.get("path"), c[0] + " → " + err);
            assertTrue(!((String) err.get("message")).isEmpty());
            assertTrue(!"internal".equals(err.get("code")), c[0] + " → " + err);
        }
    }
}
