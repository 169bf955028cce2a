package spanwright.web;

import org.teavm.jso.JSExport;
import spanwright.facade.JsonFacade;

/**
 * The functions the page calls, compiled by TeaVM to JavaScript and to WebAssembly-GC.
 * Each one hands a JSON string to {@link JsonFacade} and returns its JSON answer unchanged:
 * no mathematics lives here, so the page, the worker and the command-line tool cannot disagree.
 * Single-threaded, like the façade; the page calls it from one Web Worker.
 */
public final class Exports {
    private Exports() {}

    @JSExport
    public static String validate(String scenarioJson) {
        return JsonFacade.validate(scenarioJson);
    }

    @JSExport
    public static String analyze(String scenarioJson, boolean withInputs) {
        return JsonFacade.analyze(scenarioJson, withInputs);
    }

    @JSExport
    public static String startAnalysis(String scenarioJson) {
        return JsonFacade.startAnalysis(scenarioJson);
    }

    @JSExport
    public static String stepAnalysis(int job, int maxInputs) {
        return JsonFacade.stepAnalysis(job, maxInputs);
    }

    @JSExport
    public static String finishAnalysis(int job, boolean withInputs) {
        return JsonFacade.finishAnalysis(job, withInputs);
    }

    @JSExport
    public static String cancelAnalysis(int job) {
        return JsonFacade.cancelAnalysis(job);
    }

    @JSExport
    public static String detail(String scenarioJson, String input) {
        return JsonFacade.detail(scenarioJson, input);
    }

    @JSExport
    public static String renameVariable(String scenarioJson, String from, String to) {
        return JsonFacade.renameVariable(scenarioJson, from, to);
    }

    @JSExport
    public static String optimize(String scenarioJson, String optionsJson) {
        return JsonFacade.optimize(scenarioJson, optionsJson);
    }

    @JSExport
    public static String optimizeStart(String scenarioJson, String optionsJson) {
        return JsonFacade.optimizeStart(scenarioJson, optionsJson);
    }

    @JSExport
    public static String optimizeStep(int job, int steps) {
        return JsonFacade.optimizeStep(job, steps);
    }

    @JSExport
    public static String optimizeFinish(int job) {
        return JsonFacade.optimizeFinish(job);
    }

    @JSExport
    public static String optimizeStop(int job) {
        return JsonFacade.optimizeStop(job);
    }

    @JSExport
    public static String optimizeCancel(int job) {
        return JsonFacade.optimizeCancel(job);
    }

    @JSExport
    public static String build(String requestJson) {
        return JsonFacade.build(requestJson);
    }

    @JSExport
    public static String importGraph(String text, String optionsJson) {
        return JsonFacade.importGraph(text, optionsJson);
    }

    @JSExport
    public static String bounds(String scenarioJson) {
        return JsonFacade.bounds(scenarioJson);
    }

    @JSExport
    public static String simulate(String scenarioJson, String optionsJson) {
        return JsonFacade.simulate(scenarioJson, optionsJson);
    }

    @JSExport
    public static String encodeShare(String scenarioJson) {
        return JsonFacade.encodeShare(scenarioJson);
    }

    @JSExport
    public static String decodeShare(String fragment) {
        return JsonFacade.decodeShare(fragment);
    }

    @JSExport
    public static String sweepFamilies() {
        return JsonFacade.sweepFamilies();
    }

    @JSExport
    public static String sweepStart(String requestJson) {
        return JsonFacade.sweepStart(requestJson);
    }

    @JSExport
    public static String sweepStep(int job, int maxInputs) {
        return JsonFacade.sweepStep(job, maxInputs);
    }

    @JSExport
    public static String sweepFinish(int job) {
        return JsonFacade.sweepFinish(job);
    }

    @JSExport
    public static String sweepCancel(int job) {
        return JsonFacade.sweepCancel(job);
    }

    @JSExport
    public static String sweepReport(String requestJson) {
        return JsonFacade.sweepReport(requestJson);
    }

    /** The drawing as a TikZ figure ({@link JsonFacade#tikz}). */
    @JSExport
    public static String tikz(String scenarioJson, String optionsJson) {
        return JsonFacade.tikz(scenarioJson, optionsJson);
    }
}
