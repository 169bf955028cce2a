package spanwright.expr;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import spanwright.io.Json;
import spanwright.facade.JsonFacade;
import spanwright.io.ScenarioReader;
import spanwright.model.Scenario;

class ExprRenameTest {
    @Test
    void renamesOnlyWholeNamesThatAreNotCalls() {
        // Common practice, no source: a rename touches whole identifiers only.
        // "ab" and "a.1" are other names and stay as they are
        assertEquals("thr(2, b, ab, a.1) | !b", ExprRename.rename("thr(2, a, ab, a.1) | !a", "a", "b"));
        assertEquals("maj(q, b, c)", ExprRename.rename("maj(a, b, c)", "a", "q"));
        assertEquals("maj (x, y)", ExprRename.rename("maj (x, y)", "maj", "z"));
    }

    @Test
    @SuppressWarnings("unchecked")
    void facadeRenamesEverywhereAndKeepsTheMeaning() {
        String text = "{\"format\":\"spanwright-scenario\",\"version\":1,\"variables\":[\"a\",\"b\"],"
                + "\"function\":\"a & !b\",\"promise\":\"a | b\",\"graph\":{\"s\":\"s\",\"t\":\"t\","
                + "\"vertices\":[{\"id\":\"s\"},{\"id\":\"m\"},{\"id\":\"t\"}],\"edges\":["
                + "{\"u\":\"s\",\"v\":\"m\",\"when\":\"a\"},{\"u\":\"m\",\"v\":\"t\",\"when\":\"!b\"}]}}";
        Map<String, Object> r = (Map<String, Object>) Json.parse(JsonFacade.renameVariable(text, "a", "left"));
        assertEquals(Boolean.TRUE, r.get("ok"));
        Scenario sc = ScenarioReader.read((String) r.get("scenario"));
        assertEquals(List.of("left", "b"), sc.variables());
        assertEquals("left & !b", sc.functionText());
        assertEquals("left", sc.edges().get(0).when().toString());
        // same truth table (derived: renaming is a bijection on names)
        Scenario old = ScenarioReader.read(text);
        for (long x = 0; x < 4; x++) {
            assertEquals(old.function().eval(x), sc.function().eval(x));
        }
        Map<String, Object> bad = (Map<String, Object>) Json.parse(JsonFacade.renameVariable(text, "a", "b"));
        assertEquals(Boolean.FALSE, bad.get("ok"));
        assertTrue(((Map<String, Object>) bad.get("error")).get("message").toString().contains("already exists"));
    }
}
