package spanwright.facade;

import spanwright.model.ScenarioException;
import spanwright.io.Json;
import spanwright.io.ScenarioReader;
import spanwright.io.ScenarioWriter;
import spanwright.io.ShareCodec;
import spanwright.reduction.BuildRequest;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisRun;
import spanwright.analysis.StructuralAnalysis;
import spanwright.domain.InputDomain;
import spanwright.model.Scenario;

/**
 * The one JSON-level entry to the engine. The command-line tool and the page's TeaVM exports both
 * call these methods, so they can never disagree. Every method takes JSON text and returns JSON
 * text; it never throws (bad input, a bug, a StackOverflowError or OutOfMemoryError alike).
 * Errors come back as {@code {"ok": false, "error": {"code", "message", "path"}}}.
 *
 * <p>Contract (stable; web code relies on it):
 * <ul>
 *   <li>{@code validate(scenario)} → {@code {"ok":true,"warnings":[...],"variables":[...],
 *       "domainSize":N,"method":"enumerate"|"structure","methodReason":"…"}} (the method
 *       {@code analyze} would use, and why)</li>
 *   <li>{@code analyze(scenario, withInputs)} → {@code {"ok":true,"result":{...}}}, result having
 *       the keys of {@code analyze --json} (title, variables, vertices, edges, domainSize,
 *       reduction, positive, negative, complexity, histogram; and inputs when asked).</li>
 *   <li>{@code startAnalysis(scenario)} → {@code {"ok":true,"job":ID,"domainSize":N,
 *       "maxListedInputs":L,"method":"enumerate","methodReason":"…"}} (inputs are listed only
 *       when N ≤ L; otherwise withInputs is refused with code {@code too-many-inputs}); when
 *       {@link Analysis#choose} picks structure there is nothing to step: {@code "job":null,
 *       "method":"structure"}, and the caller runs {@code analyze} (one call);
 *       {@code stepAnalysis(ID, maxInputs)} → {@code {"ok":true,"done":bool,"processed":k,
 *       "total":N}}; {@code finishAnalysis(ID, withInputs)} → like analyze;
 *       {@code cancelAnalysis(ID)}. Single-threaded; for a worker that reports progress.</li>
 *   <li>{@code detail(scenario, input)} → one input's witness: {@code {"ok":true,"x","connected",
 *       "f","value","edges":[{"id","present","current","energy"}],"potentials":{vertexId: p}}}</li>
 *   <li>{@code build(request)} → {@code {"ok":true,"scenario":{...},"stats":{...}}}: a scenario
 *       built from a formula, a function, a host graph or a composition (request format on
 *       {@link #build}).</li>
 *   <li>{@code importGraph(text, options)} → {@code {"ok":true,"vertices":[…],"s","t",
 *       "scenario":{...},…}}: a GraphML or DOT file opened as a host graph (on {@link #importGraph}).</li>
 *   <li>{@code tikz(scenario, options)} → {@code {"ok":true,"standalone":"...","body":"..."}}: the
 *       drawing as a TikZ figure (a document for pdflatex, and the picture for {@code \input});
 *       options on {@link #tikz}.</li>
 *   <li>{@code encodeShare(scenario)} → {@code {"ok":true,"fragment":"..."}};
 *       {@code decodeShare(fragment)} → {@code {"ok":true,"scenario":"...json text..."}}</li>
 * </ul>
 *
 * <p>Not thread-safe (jobs live in a static table); the page calls it from one worker.
 */
public final class JsonFacade {
    /** At most this many unfinished analysis jobs are kept; starting another drops the oldest. */
    public static final int MAX_JOBS = 4;
    private static final Map<Integer, AnalysisRun> JOBS = new java.util.LinkedHashMap<>();
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

    /**
     * The envelope for anything a façade call threw: a {@link ScenarioException} keeps its code,
     * path and message; any other Throwable (a bug, {@link StackOverflowError},
     * {@link OutOfMemoryError}, …) becomes code {@code internal} with a message, so no exception
     * ever escapes to the page or the command line.
     */
    static String fail(Throwable e) {
        if (e instanceof ScenarioException) {
            ScenarioException se = (ScenarioException) e;
            return error(se.code(), se.path(), se.getMessage());
        }
        if (e instanceof OutOfMemoryError) {
            return error("internal", "$", "internal error: out of memory (" + e.getMessage() + "); the scenario is"
                    + " too large for this engine: see the limits in docs/scenario-format.md, or use the"
                    + " command-line tool with more memory (java -Xmx…)");
        }
        if (e instanceof StackOverflowError) {
            return error("internal", "$", "internal error: stack overflow (nesting too deep for this engine);"
                    + " please report the scenario");
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

    /**
     * Reads and checks a scenario without analysing it. The domain is built (and an empty promise
     * refused) only when {@link Analysis#choose} would enumerate it; beyond enumeration (a host
     * graph of 60 edge variables, say) {@code domainSize} is 2^n, never listed, and
     * {@code method} says {@code "structure"}. Answer {@code {"ok":true,"warnings":[…],
     * "variables":[…],"domainSize":N,"method":"enumerate"|"structure","methodReason":"…"}}
     * ({@code domainSize} null beyond a double's range) or the error envelope.
     */
    public static String validate(String scenarioJson) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            Analysis.Choice choice = Analysis.choose(sc, Analysis.Method.AUTO);
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.put("warnings", new ArrayList<Object>(sc.warnings()));
            m.put("variables", new ArrayList<Object>(sc.variables()));
            m.put("domainSize", domainSize(sc, choice));
            m.put("method", choice.method().word);
            m.put("methodReason", choice.reason());
            return Json.write(m);
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /**
     * The number of inputs: the enumerated domain's size, or 2^n (as a JSON number, null beyond
     * the range of a double) when the structural method runs on the whole cube.
     */
    private static Object domainSize(Scenario sc, Analysis.Choice choice) {
        if (choice.method() == Analysis.Method.ENUMERATE) {
            return InputDomain.of(sc).size();
        }
        return ResultJson.num(Math.pow(2, sc.variableCount()));
    }

    public static String analyze(String scenarioJson, boolean withInputs) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            Analysis.Choice choice = Analysis.choose(sc, Analysis.Method.AUTO);
            if (choice.method() == Analysis.Method.STRUCTURE) {
                return ok("result", StructureJson.analysis(StructuralAnalysis.run(sc), choice));
            }
            if (withInputs) {
                Analysis.checkListable(InputDomain.of(sc).size()); // before the analysis, not after
            }
            return ok("result", ResultJson.analysis(Analysis.run(sc), withInputs));
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /**
     * Starts a stepped enumeration ({@link #stepAnalysis}, {@link #finishAnalysis},
     * {@link #cancelAnalysis}): answer {@code {"ok":true,"job":K,"domainSize":N,"maxListedInputs":M,
     * "method":"enumerate","methodReason":"…"}}. When {@link Analysis#choose} picks the structural
     * engine there is nothing to step: {@code job} is null, {@code method} is {@code "structure"},
     * and the caller runs {@link #analyze} (one call) instead.
     */
    public static String startAnalysis(String scenarioJson) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            Analysis.Choice choice = Analysis.choose(sc, Analysis.Method.AUTO);
            if (choice.method() == Analysis.Method.STRUCTURE) {
                // nothing to step through: the caller runs analyze (one call, the structural engine)
                Map<String, Object> m = new LinkedHashMap<>();
                m.put("ok", true);
                m.put("job", Json.NULL);
                m.put("domainSize", domainSize(sc, choice));
                m.put("maxListedInputs", Analysis.MAX_LISTED_INPUTS);
                m.put("method", choice.method().word);
                m.put("methodReason", choice.reason());
                return Json.write(m);
            }
            AnalysisRun run = Analysis.start(sc);
            int id = nextJob++;
            // a page that forgets to finish or cancel must not hold every old run's arrays
            while (JOBS.size() >= MAX_JOBS) {
                JOBS.remove(JOBS.keySet().iterator().next());
            }
            JOBS.put(id, run);
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.put("job", id);
            m.put("domainSize", run.total());
            // finishAnalysis lists rows only up to this many inputs (the page asks for them only then)
            m.put("maxListedInputs", Analysis.MAX_LISTED_INPUTS);
            m.put("method", choice.method().word);
            m.put("methodReason", choice.reason());
            return Json.write(m);
        } catch (Throwable e) {
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
        } catch (Throwable e) {
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
        } catch (Throwable e) {
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
            // any number of variables: one input's witness never needs the domain
            boolean[] x = SimulationJson.bits(input, sc, "$.input");
            spanwright.analysis.InputDetail d = StructuralAnalysis.detail(sc, x);
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.putAll(ResultJson.detail(sc, d));
            // an input outside the promise can still be inspected, but say so (a promise has at
            // most 63 variables, so an input of more has a mask only without one)
            m.put("inDomain", d.mask < 0 || sc.promise().allows(d.mask));
            return Json.write(m);
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /**
     * The drawing as a TikZ figure ({@link TikzFigure}). Options (JSON object, all keys optional):
     * {@code "input"}: the focused input ("0110"; null or absent for none); {@code "positive"},
     * {@code "negative"}: W₊ and W₋ when the caller has them (both, or the analysis is run for the
     * caption; a side with no input is null); {@code "note"}: with them, the analysis's
     * {@code complexityNote} when √(W₊W₋) is not a bound for f. Answer {@code {"ok":true,
     * "standalone":"…","body":"…","caption":[{"role":"input","text":"…"},…]}} (the caption lines, which
     * the page's PNG and SVG exports show too)
     * or the error envelope ({@code $.input}, {@code $options.…}). Cost: the analysis when W₊, W₋ are
     * not given, plus one input's witness.
     */
    public static String tikz(String scenarioJson, String optionsJson) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            boolean[] x = null;
            double positive = Double.NaN;
            double negative = Double.NaN;
            String note = null;
            boolean given = false;
            for (Map.Entry<String, Object> e : ScenarioReader.options(optionsJson).entrySet()) {
                Object v = e.getValue();
                String path = "$options." + e.getKey();
                switch (e.getKey()) {
                    case "input":
                        if (v != Json.NULL) {
                            x = SimulationJson.bits(ScenarioReader.string(v, path), sc, "$.input");
                        }
                        break;
                    case "positive":
                    case "negative": {
                        double d = v == Json.NULL ? Double.NaN : v instanceof Double ? (Double) v : -1;
                        if (v != Json.NULL && !(d >= 0)) {
                            throw new ScenarioException("option", path, e.getKey() + " is W" + (e.getKey().equals("positive")
                                    ? "+" : "-") + ", a number >= 0, or null when there is no such input");
                        }
                        given = true;
                        if (e.getKey().equals("positive")) {
                            positive = d;
                        } else {
                            negative = d;
                        }
                        break;
                    }
                    case "note":
                        note = v == Json.NULL ? null : ScenarioReader.string(v, path);
                        break;
                    default:
                        throw ScenarioReader.unknownOption(e.getKey(), "input, positive, negative, note");
                }
            }
            TikzFigure.Text t = TikzFigure.draw(sc, x, given ? new double[] {positive, negative} : null,
                    given ? note : null);
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.put("standalone", t.standalone);
            m.put("body", t.body);
            List<Object> caption = new ArrayList<>();
            for (TikzFigure.Line l : t.caption) {
                Map<String, Object> line = new LinkedHashMap<>();
                line.put("role", l.role);
                line.put("text", l.text);
                caption.add(line);
            }
            m.put("caption", caption);
            return Json.write(m);
        } catch (RuntimeException e) {
            return fail(e);
        }
    }

    /**
     * Builds a scenario from a formula, a function (decision tree or diagram), a host graph or a
     * composition; the command-line {@code build} command sends the same requests. Request, one of:
     * <ul>
     *   <li>{@code {"kind":"formula","expression":"a & (b | !c)","variables":["a","b","c"],
     *       "weights":"rule"}} — series–parallel network; {@code variables} optional (default: the
     *       expression's, in order of first appearance), {@code weights} {@code "rule"} (default,
     *       the read-once-exact rule) or {@code "unit"};</li>
     *   <li>{@code {"kind":"tree","function":"maj(a,b,c)" or "00010111","variables":[…],
     *       "diagram":false,"order":["b","a"],"weights":"guess"}} — decision tree of minimum depth,
     *       or along {@code order}; {@code diagram: true} merges equal subfunctions; a function made
     *       only of 2^n characters 0/1 is a truth table in input order (variables x1 … xn unless
     *       given); {@code weights} {@code "guess"} (default) or {@code "unit"};</li>
     *   <li>{@code {"kind":"host","family":"grid","size":[3,4],"s":"r1c1","t":"r3c4","seed":1,
     *       "atMostMissing":2}} — families path [n], cycle [n], grid [k,l], complete [n],
     *       bipartite [a,b], hypercube [d], random [n,m] (with {@code seed}); {@code s}, {@code t},
     *       {@code seed}, {@code atMostMissing} optional; or {@code {"kind":"host","family":"given",
     *       "scenario":{…}}} to use a drawn graph; or {@code {"kind":"host","family":"import",
     *       "text":"…GraphML or DOT…","fileName":"h.graphml","format":"graphml","s":…,"t":…,
     *       "literalKey":"literal","weightKey":"weight","atMostMissing":k}} to read a graph file
     *       (everything but {@code text} optional; see {@link #importGraph});</li>
     *   <li>{@code {"kind":"compose","outer":{scenario},"inner":{scenario}}}; {@code inner} may instead
     *       name a built-in gadget ({@code "either-of-2"}, {@code "both-of-2"}, {@code "two-of-3"};
     *       {@link spanwright.reduction.Gadgets}).</li>
     * </ul>
     * Answer: {@code {"ok":true,"scenario":{format v1 object},"stats":{"vertices","edges",
     * "variables", …builder facts}}} (keys in {@code docs/builders.md}), or the error envelope
     * with the request path at fault (e.g. {@code $.size}, {@code $.outer.graph.edges[2].u}).
     * Cost: that of the builder (the composition analyses both parts).
     */
    public static String build(String requestJson) {
        try {
            spanwright.reduction.Built b = BuildRequest.run(Json.parse(requestJson));
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.put("scenario", ScenarioWriter.toJson(b.scenario()));
            m.put("stats", b.stats());
            return Json.write(m);
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /**
     * Opens a GraphML or DOT file as a host graph, for the page (the command line's
     * {@code build host import} reads the same files through jgrapht-io). It runs the build request
     * {@code {"kind":"host","family":"import","text":…, …options}} through {@link BuildRequest},
     * like {@link #build}, after filling in s and t, and also describes the file so that the page
     * can offer choices. Options (all optional): {@code fileName} (its ending names the format),
     * {@code format} ({@code graphml}, {@code dot}; without either the text tells), {@code s},
     * {@code t} (default: the vertices the file marks {@code role = s} / {@code t}, else the first
     * and the last vertex), {@code literalKey} (the edge attribute holding each edge's literal;
     * default one variable per edge), {@code weightKey} (default {@code weight}; {@code ""}: every
     * weight 1), {@code atMostMissing}, {@code build} ({@code false}: describe only).
     *
     * <p>Answer: {@code {"ok":true,"format":"graphml"|"dot","formatTitle","vertices":[ids in file
     * order],"edges":m,"edgeAttributes":[{"name","edges":how many edges have it}],"marked":{"s","t"}
     * (ids or null),"s","t","scenario":{format v1},"stats":{…}}} (scenario and stats unless
     * {@code build} is false), or the error envelope: {@code graph-file} at {@code $.text} with the
     * line and column, or a build error at its option path ({@code $.s}, {@code $.graph.edges[3]}).
     * Cost: O(file size) plus the host builder's.
     */
    public static String importGraph(String text, String optionsJson) {
        try {
            Map<String, Object> request = new LinkedHashMap<>(ScenarioReader.options(optionsJson));
            for (String k : request.keySet()) {
                if (!List.of("fileName", "format", "s", "t", "literalKey", "weightKey", "atMostMissing", "build")
                        .contains(k)) {
                    throw new ScenarioException("option", "$." + k, "unknown import option \"" + k + "\" (known:"
                            + " fileName, format, s, t, literalKey, weightKey, atMostMissing, build)");
                }
            }
            boolean build = !Boolean.FALSE.equals(request.remove("build"));
            request.put("kind", "host");
            request.put("family", "import");
            request.put("text", text);
            spanwright.io.GraphFile file = BuildRequest.graphFile(request);
            if (file.vertexCount() < 2) {
                throw new ScenarioException("graph-file", "$.text", "the file has " + file.vertexCount() + " vert"
                        + (file.vertexCount() == 1 ? "ex" : "ices") + "; st-connectivity needs at least two, s and t");
            }
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.put("format", file.format().name().toLowerCase(java.util.Locale.ROOT));
            m.put("formatTitle", file.format().title());
            m.put("vertices", new ArrayList<Object>(file.vertexIds()));
            m.put("edges", file.edges().size());
            Map<String, Integer> counts = new LinkedHashMap<>();
            for (spanwright.io.GraphFile.Link l : file.edges()) {
                for (String k : l.attributes().keySet()) {
                    counts.put(k, counts.getOrDefault(k, 0) + 1);
                }
            }
            List<Object> attributes = new ArrayList<>();
            for (Map.Entry<String, Integer> e : counts.entrySet()) {
                Map<String, Object> a = new LinkedHashMap<>();
                a.put("name", e.getKey());
                a.put("edges", e.getValue());
                attributes.add(a);
            }
            m.put("edgeAttributes", attributes);
            String[] marked = new String[2];
            Map<String, Object> mk = new LinkedHashMap<>();
            for (int i = 0; i < 2; i++) {
                String end = i == 0 ? "s" : "t";
                String v = file.vertexWith(spanwright.io.GraphFile.ROLE, end);
                marked[i] = v == null || v.startsWith("?") ? null : v;
                mk.put(end, marked[i]);
            }
            m.put("marked", mk);
            String s = request.get("s") == null || request.get("s") == Json.NULL ? null
                    : ScenarioReader.string(request.get("s"), "$.s");
            String t = request.get("t") == null || request.get("t") == Json.NULL ? null
                    : ScenarioReader.string(request.get("t"), "$.t");
            s = s != null ? s : marked[0] != null ? marked[0] : file.vertexIds().get(0);
            t = t != null ? t : marked[1] != null ? marked[1] : file.vertexIds().get(file.vertexCount() - 1);
            m.put("s", s);
            m.put("t", t);
            if (build) {
                request.put("s", s);
                request.put("t", t);
                spanwright.reduction.Built b = BuildRequest.run(request);
                m.put("scenario", ScenarioWriter.toJson(b.scenario()));
                m.put("stats", b.stats());
            }
            return Json.write(m);
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /**
     * Optimises the edge weights. {@code optionsJson} may be null or
     * {@code {"starts": 1, "seed": 1, "iterations": 200, "seconds": 60, "tie": "groups"|"literal",
     * "mode": "auto"|"domain"|"working-set"}} (auto: the working set when the analysis would choose
     * structure; then iterations count working-set rounds).
     * Answer: {@code {"ok":true,"result":{… as optimize --json …},"scenario":"…scenario text with the
     * new weights…"}}.
     */
    public static String optimize(String scenarioJson, String optionsJson) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            spanwright.optimize.OptimizerOptions opt = optimizerOptions(optionsJson);
            spanwright.optimize.OptimizationResult r = spanwright.optimize.WeightOptimizer.optimize(sc, opt, null);
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.put("result", ResultJson.optimization(r));
            m.put("scenario", ResultJson.withWeights(scenarioJson, r.scenario));
            return Json.write(m);
        } catch (Throwable e) {
            return fail(e);
        }
    }

    private static final Map<Integer, Object[]> OPT_JOBS = new java.util.LinkedHashMap<>();

    /**
     * Stepwise optimisation, for a page that draws the trace as it grows. {@code optimizeStart(
     * scenario, options)} → {@code {"ok":true,"job":ID,"initialComplexity","method"}} (method
     * "domain" or "working-set"); {@code optimizeStep(ID, steps)} runs up to {@code steps} outer
     * steps (working-set rounds beyond enumeration) → {@code {"ok":true,"done","start","iteration",
     * "complexity","method","workingSet"(working set only),"trace":[…]}} (the trace of the start
     * in progress);
     * {@code optimizeFinish(ID)} → exactly what {@link #optimize} answers for the same input (it
     * is the same loop); {@link #optimizeStop}(ID) ends the search now and answers the same way
     * for the best point so far (status cancelled); {@code optimizeCancel(ID)} forgets the job. At most {@link #MAX_JOBS} unfinished jobs are kept.
     */
    public static String optimizeStart(String scenarioJson, String optionsJson) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            spanwright.optimize.WeightOptimizer.Run run = spanwright.optimize.WeightOptimizer.start(sc, null,
                    optimizerOptions(optionsJson));
            while (OPT_JOBS.size() >= MAX_JOBS) {
                OPT_JOBS.remove(OPT_JOBS.keySet().iterator().next());
            }
            int id = nextJob++;
            OPT_JOBS.put(id, new Object[] {run, scenarioJson});
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.put("job", id);
            m.put("initialComplexity", ResultJson.num(run.initialComplexity()));
            m.put("method", run.method());
            return Json.write(m);
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /** See {@link #optimizeStart}. */
    public static String optimizeStep(int job, int steps) {
        Object[] j = OPT_JOBS.get(job);
        if (j == null) {
            return error("no-job", "$", "no optimisation job " + job + " (finished or cancelled)");
        }
        try {
            spanwright.optimize.WeightOptimizer.Run run = (spanwright.optimize.WeightOptimizer.Run) j[0];
            boolean done = run.done();
            for (int k = 0; k < Math.max(1, steps) && !done; k++) {
                done = run.step();
            }
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.put("done", done);
            m.put("start", run.currentStart());
            m.put("iteration", run.currentIteration());
            m.put("complexity", ResultJson.num(run.currentComplexity()));
            m.put("method", run.method());
            if (run.workingSetSize() > 0) {
                m.put("workingSet", run.workingSetSize());
            }
            List<Object> trace = new ArrayList<>();
            for (double d : run.currentTrace()) {
                trace.add(ResultJson.num(d));
            }
            m.put("trace", trace);
            return Json.write(m);
        } catch (Throwable e) {
            OPT_JOBS.remove(job);
            return fail(e);
        }
    }

    /** See {@link #optimizeStart}. */
    public static String optimizeFinish(int job) {
        return endOptimization(job, false);
    }

    /**
     * See {@link #optimizeStart}: ends the search now, at the best point found so far, and answers
     * like {@link #optimizeFinish} with status {@code cancelled} (the weights, the bound and the
     * certificate of that point), so a user who stops a long search keeps what it found.
     */
    public static String optimizeStop(int job) {
        return endOptimization(job, true);
    }

    private static String endOptimization(int job, boolean stopNow) {
        Object[] j = OPT_JOBS.remove(job);
        if (j == null) {
            return error("no-job", "$", "no optimisation job " + job + " (finished or cancelled)");
        }
        try {
            spanwright.optimize.WeightOptimizer.Run run = (spanwright.optimize.WeightOptimizer.Run) j[0];
            if (stopNow) {
                run.cancel();
            }
            while (!run.step()) {
                // run to the end
            }
            spanwright.optimize.OptimizationResult r = run.result();
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("ok", true);
            m.put("result", ResultJson.optimization(r));
            m.put("scenario", ResultJson.withWeights((String) j[1], r.scenario));
            return Json.write(m);
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /** See {@link #optimizeStart}. */
    public static String optimizeCancel(int job) {
        OPT_JOBS.remove(job);
        return ok(null, null);
    }

    /** Parses optimiser options (JSON object, all keys optional). */
    public static spanwright.optimize.OptimizerOptions optimizerOptions(String optionsJson) {
        spanwright.optimize.OptimizerOptions opt = spanwright.optimize.OptimizerOptions.defaults();
        for (Map.Entry<String, Object> e : ScenarioReader.options(optionsJson).entrySet()) {
            String path = "$options." + e.getKey();
            Object v = e.getValue();
            if (e.getKey().equals("tie")) {
                String t = ScenarioReader.string(v, path);
                if (t.equals("groups")) {
                    opt = opt.withTie(spanwright.optimize.OptimizerOptions.Tie.GROUPS);
                } else if (t.equals("literal")) {
                    opt = opt.withTie(spanwright.optimize.OptimizerOptions.Tie.LITERAL);
                } else {
                    throw new ScenarioException("option", path, "tie is \"groups\" or \"literal\", got \"" + t + "\"");
                }
                continue;
            }
            if (e.getKey().equals("mode")) {
                String t = ScenarioReader.string(v, path);
                spanwright.optimize.OptimizerOptions.Mode mode = spanwright.optimize.OptimizerOptions.Mode.of(t);
                if (mode == null) {
                    throw new ScenarioException("option", path, "mode is \"auto\", \"domain\" (every input that can"
                            + " be worst, enumerable domains only) or \"working-set\" (worst inputs from the structural"
                            + " engine), got \"" + t + "\"");
                }
                opt = opt.withMode(mode);
                continue;
            }
            long max;
            switch (e.getKey()) {
                case "starts": max = spanwright.optimize.OptimizerOptions.MAX_STARTS; break;
                case "seed": max = spanwright.optimize.OptimizerOptions.MAX_SEED; break;
                case "iterations": max = spanwright.optimize.OptimizerOptions.MAX_ITERATIONS; break;
                case "seconds": max = spanwright.optimize.OptimizerOptions.MAX_SECONDS; break;
                default:
                    throw ScenarioReader.unknownOption(e.getKey(), "starts, seed, iterations, seconds, tie, mode");
            }
            // the command line's ranges (OptimizerOptions), refused rather than clamped
            if (!(v instanceof Double) || (Double) v < 1 || (Double) v > max || (Double) v != Math.rint((Double) v)) {
                throw new ScenarioException("option", path, e.getKey() + " must be a whole number from 1 to " + max
                        + ", got " + ScenarioReader.show(v));
            }
            long k = (long) (double) (Double) v;
            switch (e.getKey()) {
                case "starts": opt = opt.withStarts((int) k); break;
                case "seed": opt = opt.withSeed(k); break;
                case "iterations": opt = opt.withMaxIterations((int) k); break;
                default: opt = opt.withMaxMillis(k * 1000); break;
            }
        }
        return opt;
    }

    /**
     * Renames variable {@code from} to {@code to} everywhere in a scenario: the variable list,
     * every edge condition, the function and an expression promise (token by token, keeping the
     * user's layout; see {@link spanwright.expr.ExprRename}). The scenario must be valid before and
     * after. Answer {@code {"ok":true,"scenario":"…text…"}} or the error envelope (the input is not
     * changed).
     */
    @SuppressWarnings("unchecked")
    public static String renameVariable(String scenarioJson, String from, String to) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            if (!sc.variables().contains(from)) {
                return error("unknown-variable", "$.variables", "there is no variable \"" + from + "\" to rename");
            }
            if (!spanwright.expr.ExprParser.isName(to)) {
                return error("variable-name", "$.variables", "\"" + to + "\" is not a valid variable name "
                        + "(a letter or _, then letters, digits, _ or .)");
            }
            if (!from.equals(to) && sc.variables().contains(to)) {
                return error("duplicate-id", "$.variables", "a variable named \"" + to + "\" already exists");
            }
            Map<String, Object> doc = (Map<String, Object>) Json.parse(scenarioJson);
            List<Object> vars = (List<Object>) doc.get("variables");
            for (int i = 0; i < vars.size(); i++) {
                if (from.equals(vars.get(i))) {
                    vars.set(i, to);
                }
            }
            if (doc.get("function") instanceof String) {
                doc.put("function", spanwright.expr.ExprRename.rename((String) doc.get("function"), from, to));
            }
            if (doc.get("promise") instanceof String) {
                doc.put("promise", spanwright.expr.ExprRename.rename((String) doc.get("promise"), from, to));
            }
            List<Object> edges = (List<Object>) ((Map<String, Object>) doc.get("graph")).get("edges");
            for (Object o : edges) {
                Map<String, Object> e = (Map<String, Object>) o;
                String when = ((String) e.get("when")).trim();
                if (when.equals(from)) {
                    e.put("when", to);
                } else if (when.startsWith("!") && when.substring(1).trim().equals(from)) {
                    e.put("when", "!" + to);
                }
            }
            String text = Json.writePretty(doc);
            ScenarioReader.read(text);
            return ok("scenario", text);
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /**
     * Simulates the span-program algorithm exactly on every input of the domain (the command-line
     * {@code simulate --json} gives the same object). {@code optionsJson} may be null or
     * {@code {"epsilon": 0.1, "alpha2": 2.5 | null, "input": "0110" | null}}: the error ε in (0, 1),
     * the scale α² (default W₊) and a focused input whose whole spectrum is returned.
     * Answer: {@code {"ok":true,"result":{"alpha2","epsilon","bits","queries","qubits",
     * "repetitions","totalQueries","curves","textbook","inputs":[{"x","positive","phaseZeroWeight",
     * "acceptance",…}],"focus",…}}} (keys in docs/simulation.md), or the error envelope (code
     * {@code too-large-to-simulate} beyond the size guard, {@code option}/{@code input-string} at
     * {@code $options.…}). Cost: |domain| dense decompositions of size |E|+1.
     */
    public static String simulate(String scenarioJson, String optionsJson) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            spanwright.quantum.SimulationOptions opt = SimulationJson.options(optionsJson, sc);
            return ok("result", SimulationJson.result(spanwright.quantum.Simulation.run(sc, opt)));
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /**
     * Lower bounds and classical measures of the scenario's function on its domain, with the page's
     * size limits ({@link spanwright.bounds.Bounds.Limits#PAGE}). Answer: {@code {"ok":true,
     * "result":{...}}}, result being the object of {@code bounds --json} (keys in docs/bounds.md),
     * or the error envelope: {@code no-function} at {@code $.function}, the reader's codes, or
     * {@code bound-violated} if a certified bound contradicts a theorem (a bug). Cost: the SDP for
     * n ≤ 6 takes up to a few seconds; the rest is faster.
     */
    public static String bounds(String scenarioJson) {
        try {
            Scenario sc = ScenarioReader.read(scenarioJson);
            spanwright.bounds.BoundsReport r = spanwright.bounds.Bounds.compute(sc, spanwright.bounds.Bounds.Limits.PAGE);
            return ok("result", BoundsJson.report(r));
        } catch (spanwright.bounds.Bounds.BoundViolation e) {
            return error("bound-violated", "$", e.getMessage());
        } catch (Throwable e) {
            return fail(e);
        }
    }

    public static String encodeShare(String scenarioJson) {
        try {
            // validate first: a link to a broken scenario helps nobody
            ScenarioReader.read(scenarioJson);
            return ok("fragment", ShareCodec.encode(scenarioJson));
        } catch (IllegalArgumentException e) { // too large for a link, or a lone surrogate
            return error("share-link", "$", e.getMessage() + " Save the scenario as a file instead.");
        } catch (Throwable e) {
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
        } catch (Throwable e) {
            return fail(e);
        }
    }

    // ------------------------------------------------------------------ family sweeps

    /**
     * Family sweeps (keys in docs/sweeps.md). A {@code family} spec is {@code {"family": NAME,
     * …options}} for a built-in family ({@code or}, {@code and}, {@code parity}, {@code threshold}
     * with {@code "k": "n / 2"}, {@code and-or-tree} with {@code "fanIn", "root"},
     * {@code majority-tree}, {@code grid}, {@code path-one-missing}, {@code power} with
     * {@code "scenario"}) or {@code {"family": "template", "template": {…family file…}}};
     * {@code options} (optional) are the sweep options of {@code sweep --json} ({@code method},
     * {@code optimizeIterations}, {@code optimizeSeconds}, {@code starts}, {@code seed},
     * {@code bounds}, {@code boundsMaxVariables}, {@code maxInputs}; the page's default bound limit
     * is 6 variables). Step by step, for a worker that reports progress, cancels and keeps
     * finished rows itself:
     * <ul>
     *   <li>{@code sweepFamilies()} → {@code {"ok":true,"families":[{"family","title","parameter",
     *       "meaning","defaultSizes","options"}],"sweepOptions":{…defaults…}}};</li>
     *   <li>{@code sweepStart({"family":…,"size":12,"options":…})} builds the instance, checks the
     *       reduction, optimises within the budget and computes the lower bounds (one call, the
     *       slow part), → {@code {"ok":true,"job":ID,"status":"ok"|"skipped"|"error","total":N,
     *       "metadata":{…},"timing":{…}}};</li>
     *   <li>{@code sweepStep(ID, maxInputs)} → {@code {"ok":true,"done","processed","total"}};</li>
     *   <li>{@code sweepFinish(ID)} → {@code {"ok":true,"row":{…}}} (a row of the result);</li>
     *   <li>{@code sweepCancel(ID)} → {@code {"ok":true}};</li>
     *   <li>{@code sweepReport({"family","sizes","options","rows":[…],"fitFrom","fitLast"})} →
     *       {@code {"ok":true,"result":{…the result document…},"csv","latex","text"}} with the
     *       fitted exponents over the tail (n ≥ fitFrom, then the last fitLast sizes).</li>
     * </ul>
     * And in one call, {@code sweep({"family","sizes":"2..8","options","fitFrom","fitLast"})} →
     * as {@code sweepReport}. Single-threaded; bad input gives the error envelope with the path.
     */
    public static String sweepFamilies() {
        try {
            return okAll(SweepFacade.families());
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /** See {@link #sweepFamilies()}. */
    public static String sweepStart(String requestJson) {
        try {
            return okAll(SweepFacade.start(requestJson));
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /** See {@link #sweepFamilies()}. */
    public static String sweepStep(int job, int maxInputs) {
        try {
            return okAll(SweepFacade.step(job, maxInputs));
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /** See {@link #sweepFamilies()}. */
    public static String sweepFinish(int job) {
        try {
            return okAll(SweepFacade.finish(job));
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /** See {@link #sweepFamilies()}. */
    public static String sweepCancel(int job) {
        SweepFacade.cancel(job);
        return ok(null, null);
    }

    /** See {@link #sweepFamilies()}. */
    public static String sweepReport(String requestJson) {
        try {
            return okAll(SweepFacade.report(requestJson));
        } catch (Throwable e) {
            return fail(e);
        }
    }

    /** See {@link #sweepFamilies()}. */
    public static String sweep(String requestJson) {
        try {
            return okAll(SweepFacade.sweep(requestJson));
        } catch (Throwable e) {
            return fail(e);
        }
    }

    private static String okAll(Map<String, Object> body) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("ok", true);
        m.putAll(body);
        return Json.write(m);
    }

    /** A mutable JSON list of the given items. */
    static List<Object> list(Object... items) {
        List<Object> l = new ArrayList<>();
        for (Object o : items) {
            l.add(o);
        }
        return l;
    }
}
