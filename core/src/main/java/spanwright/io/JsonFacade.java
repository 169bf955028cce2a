package spanwright.io;

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
 */
public final class JsonFacade {
    private JsonFacade() {}

    private static String notReady() {
        return "{\"ok\":false,\"error\":{\"code\":\"not-ready\",\"message\":\"engine not built yet\",\"path\":\"$\"}}";
    }

    public static String validate(String scenarioJson) { return notReady(); }
    public static String analyze(String scenarioJson, boolean withInputs) { return notReady(); }
    public static String startAnalysis(String scenarioJson) { return notReady(); }
    public static String stepAnalysis(int job, int maxInputs) { return notReady(); }
    public static String finishAnalysis(int job, boolean withInputs) { return notReady(); }
    public static String cancelAnalysis(int job) { return notReady(); }
    public static String detail(String scenarioJson, String input) { return notReady(); }
    public static String encodeShare(String scenarioJson) { return notReady(); }
    public static String decodeShare(String fragment) { return notReady(); }
}
