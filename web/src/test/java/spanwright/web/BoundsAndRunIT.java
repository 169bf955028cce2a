package spanwright.web;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import spanwright.io.Json;
import spanwright.facade.JsonFacade;

/**
 * The "Bounds" and "Run" sheets in real Chromium from file://. Expected values come from the JVM:
 * {@link JsonFacade#bounds} and {@link JsonFacade#simulate} on the same scenario text with the same
 * options the page sent (the façade the command-line {@code bounds --json} and
 * {@code simulate --json} print).
 */
class BoundsAndRunIT extends PageTestBase {
    private static final Duration WAIT = Duration.ofSeconds(120);
    /** Iterative solvers (the SDP for ADV±, eigendecompositions) on doubles: the JVM's and the
     *  browser's elementary functions may differ in the last bit; 1e-8 relative allows for that
     *  (common practice, no source). Whole numbers must agree exactly. */
    private static final double TOL = 1e-8;


    @BeforeEach
    void clean() {
        openClean();
    }


    private static void assertValue(Object expected, String shown, String what) {
        if (expected == null || expected == Json.NULL) {
            assertEquals("", shown, what + " is not computed");
            return;
        }
        double e = ((Number) expected).doubleValue();
        assertTrue(shown != null && !shown.isEmpty(), what + " shown");
        assertEquals(e, Double.parseDouble(shown), TOL * Math.max(1, Math.abs(e)), what);
    }

    @Test
    @SuppressWarnings("unchecked")
    void boundsSheetShowsTheJvmNumbers() {
        String scenario = scenarioText();
        page.$("tab-bounds").click();
        page.waitFor("bounds computed", WAIT, () -> "ready".equals(page.js("return document.body.dataset.bounds;")));
        Map<String, Object> answer = (Map<String, Object>) Json.parse(JsonFacade.bounds(scenario));
        assertEquals(Boolean.TRUE, answer.get("ok"), () -> "JVM bounds failed: " + answer);
        Map<String, Object> r = (Map<String, Object>) answer.get("result");
        Map<String, Object> adv = (Map<String, Object>) r.get("adversary");
        Map<String, Object> cl = (Map<String, Object>) r.get("classical");
        // Source: JsonFacade.bounds on the JVM, same text.
        // ADV± and ADV come from iterative solvers (an interior-point SDP; a work-budgeted
        // minimax optimisation) whose iterates depend on the last bits of exp/log/sqrt, which
        // differ between the JVM and the browser. Each side returns certified values, so the page's
        // lower bound may differ from the JVM's by at most the JVM's own certified gap
        // (upper − lower), or 1e-8 relative where that gap is smaller.
        assertWithinGap(adv.get("general"), adv.get("generalDual"), adv.get("general"), page.$("bounds-general").getAttribute("data-value"), "adversary.general");
        assertWithinGap(adv.get("general"), adv.get("generalDual"), adv.get("generalDual"), page.$("bounds-generalDual").getAttribute("data-value"), "adversary.generalDual");
        assertWithinGap(adv.get("positive"), adv.get("positiveUpper"), adv.get("positive"), page.$("bounds-positive").getAttribute("data-value"), "adversary.positive");
        assertWithinGap(adv.get("positive"), adv.get("positiveUpper"), adv.get("positiveUpper"), page.$("bounds-positiveUpper").getAttribute("data-value"), "adversary.positiveUpper");
        for (String k : new String[] {"D", "C0", "C1", "C", "s", "bs", "deg"}) {
            assertValue(cl.get(k), page.$("bounds-" + k).getAttribute("data-value"), "classical." + k);
            Map<String, Object> reasons = (Map<String, Object>) cl.get("reasons");
            if (cl.get(k) == Json.NULL) {
                assertEquals(String.valueOf(reasons.get(k)), page.$("bounds-" + k).getAttribute("data-reason"), "reason for " + k);
            }
        }
        assertValue(r.get("complexity"), page.$("bounds-complexity").getAttribute("data-value"), "complexity");
        assertValue(r.get("speedup"), page.$("bounds-speedup").getAttribute("data-value"), "speedup");
        double gapSlack = (num(adv.get("generalDual")) - num(adv.get("general"))) / num(adv.get("general"));
        for (String k : new String[] {"optimalityGap", "optimisedGap"}) {
            assertEquals(num(r.get(k)), Double.parseDouble(page.$("bounds-" + k).getAttribute("data-value")),
                    Math.max(TOL, 2 * gapSlack) * num(r.get(k)), k + " (a bound / ADV±)");
        }
        assertValue(r.get("optimisedComplexity"), page.$("bounds-optimisedComplexity").getAttribute("data-value"), "optimisedComplexity");
        assertTrue(page.driver.findElement(By.cssSelector("#sheet-bounds .caution")).isDisplayed(), "the caution is shown");
        // The summary's bound and this sheet's agree (both are the engine's).
        WorkbenchIT.assertClose(page.value("sum-bound"), Double.parseDouble(page.$("bounds-complexity").getAttribute("data-value")), "same bound");
    }

    /**
     * A 6x6 grid host graph (60 edge variables, beyond enumeration): the Bounds sheet shows this
     * graph's sqrt(W+ W-) from the structural engine as the JVM's JsonFacade.bounds does (the
     * source), the optimised weights' value, and the lower bounds as not computed with their reason.
     */
    @Test
    @SuppressWarnings("unchecked")
    void boundsSheetOfAHostGraphBeyondEnumeration() throws java.io.IOException {
        String grid = spanwright.io.ScenarioWriter.write(spanwright.reduction.HostGraphBuilder
                .family("grid", new int[] {6, 6}, null, null, 1, -1).scenario());
        java.nio.file.Path file = java.nio.file.Files.createTempFile("grid6-bounds-", ".json");
        try {
            java.nio.file.Files.writeString(file, grid);
            int serial = page.serial();
            page.$("open-file").sendKeys(file.toString());
            page.waitForAnalysis(serial, WAIT);
            page.$("tab-bounds").click();
            page.waitFor("bounds computed", WAIT, () -> "ready".equals(page.js("return document.body.dataset.bounds;")));
            Map<String, Object> answer = (Map<String, Object>) Json.parse(JsonFacade.bounds(scenarioText()));
            assertEquals(Boolean.TRUE, answer.get("ok"), () -> "JVM bounds failed: " + answer);
            Map<String, Object> r = (Map<String, Object>) answer.get("result");
            assertEquals("structure", r.get("method"));
            // derived (as on the JVM's analyze): unit-weight 6x6 grid, W+ = 34, W- = 26
            assertEquals(Math.sqrt(34 * 26), num(r.get("complexity")), 1e-9);
            assertValue(r.get("complexity"), page.$("bounds-complexity").getAttribute("data-value"), "complexity");
            // the weight search runs under a 20 s budget in both, so the page may stop elsewhere on a
            // loaded machine: shown, and no worse than the weights it started from
            String optimised = page.$("bounds-optimisedComplexity").getAttribute("data-value");
            assertTrue(!optimised.isEmpty() && Double.parseDouble(optimised) <= num(r.get("complexity")) * (1 + 1e-9), optimised);
            assertTrue(page.$("bounds-general").getAttribute("data-reason").contains("60 variables"),
                    page.$("bounds-general").getAttribute("data-reason"));
            page.screenshot("grid-6x6-bounds");
        } finally {
            java.nio.file.Files.deleteIfExists(file);
        }
    }

    static double num(Object o) {
        return ((Number) o).doubleValue();
    }

    private static void assertWithinGap(Object lower, Object upper, Object expected, String shown, String what) {
        if (expected == null || expected == Json.NULL) {
            assertEquals("", shown, what + " is not computed");
            return;
        }
        double e = num(expected);
        double gap = upper == null || upper == Json.NULL ? 0 : Math.abs(num(upper) - num(lower));
        assertTrue(shown != null && !shown.isEmpty(), what + " shown");
        assertEquals(e, Double.parseDouble(shown), Math.max(TOL * Math.max(1, Math.abs(e)), gap), what);
    }

    /*
     * Source: the JVM's JsonFacade.simulate for the same scenario. (Core writes 2^-52 out instead
     * of calling Math.ulp, which TeaVM 0.16.0 computes wrongly.)
     */
    @Test
    @SuppressWarnings("unchecked")
    void runSheetShowsTheJvmSimulationOfTheFocusedInput() {
        String scenario = scenarioText();
        for (String key : new String[] {"1", "0"}) {
            page.js("document.body.dataset.focusDrawn = '';");
            page.driver.findElement(By.tagName("body")).sendKeys(key);
            page.waitFor("focus drawn", WAIT, () -> !"".equals(page.js("return document.body.dataset.focusDrawn || '';")));
            String x = (String) page.js("return window.Spanwright.focus();");
            page.$("tab-run").click();
            page.waitFor("simulated for " + x, WAIT, () -> "ready".equals(page.js("return document.body.dataset.simulation;"))
                    && x.equals(page.$("run-focus").getAttribute("data-x")));
            String options = page.$("run-body").getAttribute("data-options");
            assertTrue(options.contains(x), options);
            Map<String, Object> answer = (Map<String, Object>) Json.parse(JsonFacade.simulate(scenario, options));
            assertEquals(Boolean.TRUE, answer.get("ok"), () -> "JVM simulation failed: " + answer);
            Map<String, Object> r = (Map<String, Object>) answer.get("result");
            // Source: JsonFacade.simulate on the JVM, same text and options.
            for (String k : new String[] {"bits", "queries", "qubits"}) {
                assertValue(r.get(k), page.$("run-" + k).getAttribute("data-value"), k + " (focus " + x + ")");
            }
            Map<String, Object> focus = (Map<String, Object>) r.get("focus");
            assertValue(focus.get("phaseZeroWeight"), page.$("run-focus").getAttribute("data-phase-zero-weight"), "weight of |0> on phase 0");
            assertEquals(String.valueOf(((List<Object>) focus.get("spectrum")).size()), page.$("run-circle").getAttribute("data-phases"), "eigenphases drawn");
            Map<String, Object> curves = (Map<String, Object>) r.get("curves");
            List<Object> minPos = (List<Object>) curves.get("minPositive");
            List<Object> shown = (List<Object>) Json.parse(page.$("run-curves").getAttribute("data-min-positive"));
            assertEquals(minPos.size(), shown.size());
            for (int i = 0; i < minPos.size(); i++) {
                assertValue(minPos.get(i), shown.get(i) == Json.NULL ? "" : String.valueOf(shown.get(i)), "min positive acceptance at b = " + (i + 1));
            }
            assertTrue(page.driver.findElement(By.cssSelector("#sheet-run .caution")).isDisplayed(), "the caution is shown");
            page.$("tab-summary").click();
        }
    }

    /*
     * Beyond the whole-domain limit (2^18 inputs > 65,536: the ladder of 9 rungs, 18 variables, our
     * own bench scenario), the Run sheet simulates the input in focus alone. Source of the expected
     * numbers: the JVM's JsonFacade.simulate for the same text and the options the page sent.
     */
    @Test
    @SuppressWarnings("unchecked")
    void runSheetSimulatesOneInputOfALargeDomain() throws java.io.IOException {
        java.nio.file.Path file = java.nio.file.Files.createTempFile("ladder18-run-", ".json");
        try {
            java.nio.file.Files.writeString(file, BenchIT.ladder(9));
            int serial = page.serial();
            page.$("open-file").sendKeys(file.toString());
            page.waitForAnalysis(serial, WAIT);
            assertEquals("ready", page.js("return document.body.dataset.analysis;"), page.$("error-box").getText());
            String scenario = scenarioText();
            page.js("document.body.dataset.focusDrawn = '';");
            page.driver.findElement(By.tagName("body")).sendKeys("1");
            page.waitFor("focus drawn", WAIT, () -> !"".equals(page.js("return document.body.dataset.focusDrawn || '';")));
            String x = (String) page.js("return window.Spanwright.focus();");
            assertEquals(18, x.length());
            page.$("tab-run").click();
            page.waitFor("simulated for " + x, WAIT, () -> "ready".equals(page.js("return document.body.dataset.simulation;"))
                    && x.equals(page.$("run-focus").getAttribute("data-x")));
            assertEquals("input", page.$("run-body").getAttribute("data-scope"));
            String options = page.$("run-body").getAttribute("data-options");
            Map<String, Object> answer = (Map<String, Object>) Json.parse(JsonFacade.simulate(scenario, options));
            assertEquals(Boolean.TRUE, answer.get("ok"), () -> "JVM simulation failed: " + answer);
            Map<String, Object> r = (Map<String, Object>) answer.get("result");
            assertEquals("input", r.get("scope"));
            Map<String, Object> focus = (Map<String, Object>) r.get("focus");
            assertValue(focus.get("phaseZeroWeight"), page.$("run-focus").getAttribute("data-phase-zero-weight"), "weight of |0> on phase 0");
            assertEquals(String.valueOf(((List<Object>) focus.get("spectrum")).size()), page.$("run-circle").getAttribute("data-phases"), "eigenphases drawn");
            for (String k : new String[] {"bits", "queries", "qubits"}) {
                assertValue(r.get(k), page.$("run-" + k).getAttribute("data-value"), k + " (none for one input)");
            }
            String summary = page.$("run-summary").getText();
            assertTrue(summary.contains("Only the input in focus is simulated") && summary.contains("65536"), summary);
            assertTrue(page.$("run-error").getAttribute("hidden") != null, "no error shown");
        } finally {
            java.nio.file.Files.deleteIfExists(file);
        }
    }
}
