package spanwright.io;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisRun;
import spanwright.domain.InputDomain;
import spanwright.model.Inputs;
import spanwright.model.Scenario;

/**
 * The one JSON-level entry to the engine. The command-line tool and the page's TeaVM exports both
 * call these methods, so they can never disagree. Every method takes JSON text and returns JSON
 * text; it never throws for bad input. Errors come back as
 * {@code {"ok": false, "error": {"code", "message", "path"}}}.
 *
 * <p>Contract (stable; web code relies on it):
 * <ul>
 *   <li>{@code validate(scenario)} → {@code {"ok":true,"warnings":[...],"variables":[...],
 *       "domainSize":N}}</li>
 *   <li>{@code analyze(scenario, withInputs)} → {@code {"ok":true,"result":{...}}}, result having
 *       the keys of {@code analyze --json} (title, variables, vertices, edges, domainSize,
 *       reduction, positive, negative, complexity, histogram; and inputs when asked).</li>
 *   <li>{@code startAnalysis(scenario)} → {@code {"ok":true,"job":ID,"domainSize":N}};
 *       {@code stepAnalysis(ID, maxInputs)} → {@code {"ok":true,"done":bool,"processed":k,
 *       "total":N}}; {@code finishAnalysis(ID, withInputs)} → like analyze;
 *       {@code cancelAnalysis(ID)}. Single-threaded; for a worker that reports progress.</li>
 *   <li>{@code detail(scenario, input)} → one input's witness: {@code {"ok":true,"x","connected",
 *       "f","value","edges":[{"id","present","current","energy"}],"potentials":{vertexId: p}}}</li>
 *   <li>{@code encodeShare(scenario)} → {@code {"ok":true,"fragment":"..."}};
 *       {@code decodeShare(fragment)} → {@code {"ok":true,"scenario":"...json text..."}}</li>
 * </ul>
 *
 * <p>Not thread-safe (jobs live in a static table); the page calls it from one worker.
 */
public final class JsonFacade {
    private static final Map<Integer, AnalysisRun> JOBS = new HashMap<>();
    private static int nextJob = 1;

    private JsonFacade() {}

    /** Error envelope. */
    public static String error(String code, String path, String message) {
        Map<String, Object> err = new LinkedHashMap<>();
        err.put("code", code);
        err.put("message", message);
        err.put("path", path);
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("ok", false);
        m.put("error", err);
        return Json.write(m);
    }

    private static String fail(RuntimeException e) {
        if (e instanceof ScenarioException) {
            ScenarioException se = (ScenarioException) e;
            return error(se.code(), se.path(), se.getMessage());
        }
        return error("internal", "$", "internal error: " + e);
    }

    private static String ok(String key, Object value) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("ok", true);
        if (key != null) {
            m.put(key, value);
        }
        return Json.write(m);
    }

    public static String validate(String scenarioJson) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            InputDomain d = InputDomain.of(sc);
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.put("warnings", new ArrayList<Object>(sc.warnings()));
            m.put("variables", new ArrayList<Object>(sc.variables()));
            m.put("domainSize", d.size());
            return Json.write(m);
        } catch (RuntimeException e) {
            return fail(e);
        }
    }

    public static String analyze(String scenarioJson, boolean withInputs) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            return ok("result", ResultJson.analysis(Analysis.run(sc), withInputs));
        } catch (RuntimeException e) {
            return fail(e);
        }
    }

    public static String startAnalysis(String scenarioJson) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            AnalysisRun run = Analysis.start(sc);
            int id = nextJob++;
            JOBS.put(id, run);
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.put("job", id);
            m.put("domainSize", run.total());
            return Json.write(m);
        } catch (RuntimeException e) {
            return fail(e);
        }
    }

    public static String stepAnalysis(int job, int maxInputs) {
        AnalysisRun run = JOBS.get(job);
        if (run == null) {
            return error("no-job", "$", "no analysis job " + job + " (finished or cancelled)");
        }
        try {
            boolean done = run.step(maxInputs);
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.put("done", done);
            m.put("processed", run.processed());
            m.put("total", run.total());
            return Json.write(m);
        } catch (RuntimeException e) {
            JOBS.remove(job);
            return fail(e);
        }
    }

    public static String finishAnalysis(int job, boolean withInputs) {
        AnalysisRun run = JOBS.get(job);
        if (run == null) {
            return error("no-job", "$", "no analysis job " + job + " (finished or cancelled)");
        }
        try {
            run.step(Long.MAX_VALUE);
            JOBS.remove(job);
            return ok("result", ResultJson.analysis(run.result(), withInputs));
        } catch (RuntimeException e) {
            JOBS.remove(job);
            return fail(e);
        }
    }

    public static String cancelAnalysis(int job) {
        JOBS.remove(job);
        return ok(null, null);
    }

    public static String detail(String scenarioJson, String input) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            long mask = Inputs.parse(input, sc.variableCount());
            if (mask < 0) {
                return error("input-string", "$.input", "\"" + input + "\" is not an input: write "
                        + sc.variableCount() + " characters 0 or 1 (" + String.join(", ", sc.variables()) + ")");
            }
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.putAll(ResultJson.detail(sc, Analysis.detail(sc, mask)));
            return Json.write(m);
        } catch (RuntimeException e) {
            return fail(e);
        }
    }

    public static String encodeShare(String scenarioJson) {
        try {
            // validate first: a link to a broken scenario helps nobody
            ScenarioReader.read(scenarioJson);
            return ok("fragment", ShareCodec.encode(scenarioJson));
        } catch (RuntimeException e) {
            return fail(e);
        }
    }

    public static String decodeShare(String fragment) {
        try {
            String text = ShareCodec.decode(fragment);
            ScenarioReader.read(text);
            return ok("scenario", text);
        } catch (IllegalArgumentException e) {
            return error("share-link", "$", "the link is damaged or not a Spanwright link: " + e.getMessage());
        } catch (RuntimeException e) {
            return fail(e);
        }
    }

    /** Helper for callers that hold a list of inputs. */
    static List<Object> list(Object... items) {
        List<Object> l = new ArrayList<>();
        for (Object o : items) {
            l.add(o);
        }
        return l;
    }
}
