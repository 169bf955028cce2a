package spanwright.facade;

import spanwright.io.Json;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import spanwright.sweep.SweepDocument;

/**
 * The page's entry to sweeps: envelopes, stepwise equals one call (bit for bit, times aside), and
 * bad requests answered with a path. Expected values derived: AND_n as a path has the optimum
 * sqrt(n) (W+ = Σ w, W- = 1/min w; equal weights).
 */
class JsonFacadeSweepTest {

    @SuppressWarnings("unchecked")
    static Map<String, Object> parse(String s) {
        return (Map<String, Object>) Json.parse(s);
    }

    @Test
    void familiesAreListed() {
        Map<String, Object> m = parse(JsonFacade.sweepFamilies());
        assertEquals(true, m.get("ok"));
        List<Object> fams = (List<Object>) m.get("families");
        assertEquals(spanwright.sweep.BuiltInFamilies.NAMES.size(), fams.size());
        assertEquals(11, fams.size(), "nine families, then complete and hypercube (host graphs beyond enumeration)");
        Map<?, ?> tree = (Map<?, ?>) fams.get(4);
        assertEquals("and-or-tree", tree.get("family"));
        assertEquals(List.of("fanIn", "root"), tree.get("options"));
    }

    @Test
    @SuppressWarnings("unchecked")
    void stepwiseEqualsOneCall() {
        String family = "{\"family\": \"and\"}";
        String options = "{\"bounds\": false, \"optimizeIterations\": 20}";
        List<Object> rows = new ArrayList<>();
        for (int size = 2; size <= 6; size++) {
            Map<String, Object> start = parse(JsonFacade.sweepStart("{\"family\": " + family + ", \"size\": " + size
                    + ", \"options\": " + options + "}"));
            assertEquals(true, start.get("ok"), start.toString());
            int job = ((Double) start.get("job")).intValue();
            int total = ((Double) start.get("total")).intValue();
            Map<String, Object> step = parse(JsonFacade.sweepStep(job, 3));
            assertEquals(Math.min(3, total), ((Double) step.get("processed")).intValue());
            Map<String, Object> fin = parse(JsonFacade.sweepFinish(job));
            Map<String, Object> row = (Map<String, Object>) fin.get("row");
            assertEquals(Math.sqrt(size), (Double) row.get("complexity"), 1e-6 * size);
            rows.add(row);
            assertEquals(false, parse(JsonFacade.sweepFinish(job)).get("ok"), "a finished job is gone");
        }
        Map<String, Object> report = parse(JsonFacade.sweepReport("{\"family\": " + family + ", \"sizes\": \"2..6\","
                + " \"options\": " + options + ", \"rows\": " + Json.write(rows) + "}"));
        Map<String, Object> once = parse(JsonFacade.sweep("{\"family\": " + family + ", \"sizes\": \"2..6\", \"options\": "
                + options + "}"));
        assertEquals(true, once.get("ok"), once.toString());
        assertEquals(Json.write(SweepDocument.resultsOnly(once.get("result"))),
                Json.write(SweepDocument.resultsOnly(report.get("result"))));
        assertTrue(((String) once.get("csv")).startsWith("size,variables,"));
        assertTrue(((String) once.get("latex")).contains("\\begin{tabular}"));
        Map<String, Object> fits = (Map<String, Object>) ((Map<String, Object>) once.get("result")).get("fits");
        Map<String, Object> c = (Map<String, Object>) ((Map<String, Object>) fits.get("series")).get("complexity");
        assertEquals(0.5, (Double) c.get("exponent"), 1e-6);
    }

    @Test
    @SuppressWarnings("unchecked")
    void thePagesBoundLimitHoldsWhereTheRequestIsSilent() {
        // The page sends only the fields the user filled in; ADV± must still stop at the page's 6
        // variables (an 8-variable SDP takes minutes), whether options is absent, empty or partial.
        for (String options : new String[] {"", ", \"options\": {}", ", \"options\": {\"optimizeIterations\": 5}"}) {
            Map<String, Object> once = parse(JsonFacade.sweep("{\"family\": {\"family\": \"or\"}, \"sizes\": \"2\""
                    + options + "}"));
            assertEquals(true, once.get("ok"), once.toString());
            Map<String, Object> opts = (Map<String, Object>) ((Map<String, Object>) once.get("result")).get("options");
            assertEquals(6.0, opts.get("boundsMaxVariables"), options);
        }
        Map<String, Object> given = parse(JsonFacade.sweep("{\"family\": {\"family\": \"or\"}, \"sizes\": \"2\","
                + " \"options\": {\"boundsMaxVariables\": 3}}"));
        assertEquals(3.0, ((Map<String, Object>) ((Map<String, Object>) given.get("result")).get("options"))
                .get("boundsMaxVariables"));
        Map<String, Object> fams = parse(JsonFacade.sweepFamilies());
        assertEquals(6.0, ((Map<String, Object>) fams.get("sweepOptions")).get("boundsMaxVariables"));
    }

    @Test
    void badRequestsNameThePath() {
        Map<String, Object> e = parse(JsonFacade.sweepStart("{\"family\": {\"family\": \"spiral\"}, \"size\": 3}"));
        assertEquals(false, e.get("ok"));
        assertEquals("$.family.family", ((Map<?, ?>) e.get("error")).get("path"));
        e = parse(JsonFacade.sweepStart("{\"family\": {\"family\": \"or\"}, \"size\": \"big\"}"));
        assertEquals("$.size", ((Map<?, ?>) e.get("error")).get("path"));
        e = parse(JsonFacade.sweep("{\"family\": {\"family\": \"or\"}, \"sizes\": \"2..\"}"));
        assertEquals("$.sizes", ((Map<?, ?>) e.get("error")).get("path"));
        e = parse(JsonFacade.sweep("{\"family\": {\"family\": \"or\"}, \"options\": {\"colour\": 1}}"));
        assertEquals("$.options.colour", ((Map<?, ?>) e.get("error")).get("path"));
        e = parse(JsonFacade.sweep("{\"family\": {\"family\": \"and-or-tree\", \"fanIn\": 1}}"));
        assertEquals("$.family.fanIn", ((Map<?, ?>) e.get("error")).get("path"));
        e = parse(JsonFacade.sweepStep(98765, 10));
        assertEquals("no-job", ((Map<?, ?>) e.get("error")).get("code"));
        // a size the builder refuses is a row with status error, not a failed call
        Map<String, Object> ok = parse(JsonFacade.sweep("{\"family\": {\"family\": \"or\"}, \"sizes\": \"65\","
                + " \"options\": {\"bounds\": false}}"));
        assertEquals(true, ok.get("ok"));
        Map<?, ?> row = (Map<?, ?>) ((List<?>) ((Map<?, ?>) ok.get("result")).get("rows")).get(0);
        assertEquals("error", row.get("status"));
    }
}
