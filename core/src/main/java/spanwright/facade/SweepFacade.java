package spanwright.facade;

import spanwright.model.ScenarioException;
import spanwright.io.Json;
import spanwright.io.ScenarioReader;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.analysis.Summary;
import spanwright.sweep.BuiltInFamilies;
import spanwright.sweep.Family;
import spanwright.sweep.SizeList;
import spanwright.sweep.SweepDocument;
import spanwright.sweep.SweepOptions;
import spanwright.sweep.SweepSize;
import spanwright.sweep.SweepTables;

/**
 * The JSON side of family sweeps, behind the {@code sweep…} methods of {@link JsonFacade} (see
 * there for the contract). Single-threaded; jobs live in a static table like the analysis jobs.
 */
final class SweepFacade {
    /** At most this many unfinished size jobs are kept; starting another drops the oldest. */
    static final int MAX_JOBS = 4;
    /**
     * The page's sweep options where the request leaves a key out: the engine's defaults, but ADV±
     * only up to 6 variables (the page's limit for the SDP; beyond it one size takes minutes).
     */
    static final SweepOptions PAGE_DEFAULTS = SweepOptions.defaults().withBounds(true, 6);
    private static final Map<Integer, Job> JOBS = new LinkedHashMap<>();
    private static int nextJob = 1;

    private SweepFacade() {}

    /** One size being evaluated step by step. */
    private static final class Job {
        final SweepSize size;
        final long total;
        long cursor;
        Summary acc;

        Job(SweepSize size) {
            this.size = size;
            this.total = size.units();
        }
    }

    static Map<String, Object> object(Object o, String path) {
        return ScenarioReader.object(o, path);
    }

    static Family family(Map<String, Object> request) {
        Object f = request.get("family");
        if (f == null) {
            throw new ScenarioException("missing", "$.family", "name the family: {\"family\": {\"family\": \"or\"}}");
        }
        return BuiltInFamilies.fromSpec(f, "$.family");
    }

    static SweepOptions options(Map<String, Object> request) {
        Object o = request.get("options");
        return o == null || o == Json.NULL ? PAGE_DEFAULTS : SweepDocument.options(o, "$.options", PAGE_DEFAULTS);
    }

    static int fit(Map<String, Object> request, String key) {
        Object o = request.get(key);
        if (o == null || o == Json.NULL) {
            return 0;
        }
        if (!(o instanceof Double) || (Double) o < 0 || (Double) o != Math.rint((Double) o)) {
            throw new ScenarioException("option", "$." + key, key + " is a whole number ≥ 0");
        }
        return (int) (double) (Double) o;
    }

    static Map<String, Object> families() {
        List<Object> list = new ArrayList<>();
        for (String name : BuiltInFamilies.NAMES) {
            if (name.equals("power")) {
                Map<String, Object> m = new LinkedHashMap<>();
                m.put("family", "power");
                m.put("title", "composition powers F^(d) of a given scenario");
                m.put("parameter", "d");
                m.put("meaning", "power");
                m.put("defaultSizes", "1..3");
                m.put("options", JsonFacade.list("scenario"));
                list.add(m);
                continue;
            }
            Map<String, Object> spec = new LinkedHashMap<>();
            spec.put("family", name);
            Family f = BuiltInFamilies.fromSpec(spec, "$");
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("family", name);
            m.put("title", f.title());
            m.put("parameter", f.parameterName());
            m.put("meaning", f.parameterMeaning());
            m.put("defaultSizes", f.defaultSizes());
            Map<String, Object> defaults = f.spec();
            defaults.remove("family");
            m.put("options", new ArrayList<Object>(defaults.keySet()));
            list.add(m);
        }
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("families", list);
        m.put("sweepOptions", PAGE_DEFAULTS.toJson());
        return m;
    }

    static Map<String, Object> start(String requestJson) {
        Map<String, Object> r = object(Json.parse(requestJson), "$");
        Family f = family(r);
        Object so = r.get("size");
        if (!(so instanceof Double) || (Double) so != Math.rint((Double) so) || (Double) so < 0 || (Double) so > 1e6) {
            throw new ScenarioException("size", "$.size", "\"size\" is the family parameter's value, a whole number");
        }
        SweepSize s = SweepSize.build(f, (int) (double) (Double) so, options(r));
        s.prepare();
        Job job = new Job(s);
        int id = nextJob++;
        while (JOBS.size() >= MAX_JOBS) {
            JOBS.remove(JOBS.keySet().iterator().next());
        }
        JOBS.put(id, job);
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("job", id);
        m.put("status", s.status().name().toLowerCase());
        m.put("total", job.total);
        m.put("metadata", s.metadata());
        m.put("timing", s.timing());
        return m;
    }

    static Job job(int id) {
        Job j = JOBS.get(id);
        if (j == null) {
            throw new ScenarioException("no-job", "$", "no sweep job " + id + " (finished or cancelled)");
        }
        return j;
    }

    static Map<String, Object> step(int id, long maxUnits) {
        Job j = job(id);
        try {
            advance(j, Math.max(0, maxUnits));
        } catch (Throwable e) { // an Error too: a failed job must not stay in the table
            JOBS.remove(id);
            throw e;
        }
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("done", j.cursor >= j.total);
        m.put("processed", j.cursor);
        m.put("total", j.total);
        return m;
    }

    private static void advance(Job j, long maxUnits) {
        if (j.total == 0 || j.cursor >= j.total) {
            return;
        }
        long end = j.cursor + Math.min(maxUnits, j.total - j.cursor);
        if (end == j.cursor) {
            return;
        }
        Summary s = j.size.evaluate(j.cursor, end);
        j.acc = j.acc == null ? s : Summary.merge(j.acc, s);
        j.cursor = end;
    }

    static Map<String, Object> finish(int id) {
        Job j = job(id);
        JOBS.remove(id);
        advance(j, Long.MAX_VALUE);
        Map<String, Object> m = new LinkedHashMap<>();
        Map<String, Object> row = SweepSize.row(j.size.metadata(), j.acc);
        row.put("timing", j.size.timing());
        m.put("row", row);
        return m;
    }

    static void cancel(int id) {
        JOBS.remove(id);
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> report(String requestJson) {
        Map<String, Object> r = object(Json.parse(requestJson), "$");
        Family f = family(r);
        Object sizes = r.get("sizes");
        List<Integer> list = SizeList.parse(sizes instanceof String ? (String) sizes : f.defaultSizes(), "$.sizes");
        Object rows = r.get("rows");
        if (!(rows instanceof List)) {
            throw new ScenarioException("missing", "$.rows", "\"rows\" lists the finished rows (from sweepFinish)");
        }
        List<Map<String, Object>> rl = new ArrayList<>();
        for (int i = 0; i < ((List<Object>) rows).size(); i++) {
            rl.add(object(((List<Object>) rows).get(i), "$.rows[" + i + "]"));
        }
        return tables(SweepDocument.result(f, list, options(r), rl, fit(r, "fitFrom"), fit(r, "fitLast"), null));
    }

    static Map<String, Object> sweep(String requestJson) {
        Map<String, Object> r = object(Json.parse(requestJson), "$");
        Family f = family(r);
        Object sizes = r.get("sizes");
        List<Integer> list = SizeList.parse(sizes instanceof String ? (String) sizes : f.defaultSizes(), "$.sizes");
        SweepOptions o = options(r);
        List<Map<String, Object>> rows = new ArrayList<>();
        for (int size : list) {
            SweepSize s = SweepSize.build(f, size, o);
            s.prepare();
            Summary sum = s.units() > 0 ? s.evaluate(0, s.units()) : null;
            Map<String, Object> row = SweepSize.row(s.metadata(), sum);
            row.put("timing", s.timing());
            rows.add(row);
        }
        return tables(SweepDocument.result(f, list, o, rows, fit(r, "fitFrom"), fit(r, "fitLast"), null));
    }

    private static Map<String, Object> tables(Map<String, Object> doc) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("result", doc);
        m.put("csv", SweepTables.csv(doc));
        m.put("latex", SweepTables.latex(doc));
        m.put("text", SweepTables.text(doc));
        return m;
    }
}
