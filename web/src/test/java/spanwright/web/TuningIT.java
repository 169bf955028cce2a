package spanwright.web;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebElement;
import spanwright.io.Json;
import spanwright.facade.JsonFacade;

/**
 * The "Weights" sheet (weight optimiser) in real Chromium from file://. Expected numbers come from
 * the JVM: {@link JsonFacade#optimize} with the same scenario text and the same options the page
 * sent (the same façade the command-line {@code optimize --json} prints), and
 * {@link JsonFacade#analyze} for the numbers before and after accepting.
 */
class TuningIT extends PageTestBase {
    private static final Duration WAIT = Duration.ofSeconds(120);
    /** The optimiser iterates (Newton steps, line searches) on doubles; the JVM's and the
     *  browser's Math.exp/log may differ in the last bit, which such iterations can amplify a
     *  little. The search stops at 1e-10 relative gain, so 1e-8 relative is a safe agreement
     *  margin (common practice, no source). */
    private static final double OPT_TOL = 1e-8;


    @BeforeEach
    void clean() {
        openClean();
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> jvmOptimize(String scenarioText, String options) {
        Map<String, Object> answer = (Map<String, Object>) Json.parse(JsonFacade.optimize(scenarioText, options));
        assertEquals(Boolean.TRUE, answer.get("ok"), () -> "JVM optimisation failed: " + answer);
        return answer;
    }

    static double num(Object o) {
        return ((Number) o).doubleValue();
    }

    static void assertNear(double expected, double actual, String what) {
        assertEquals(expected, actual, OPT_TOL * Math.max(1, Math.abs(expected)), what);
    }


    private void runOptimiser() {
        page.$("tab-weights").click();
        page.waitFor("weights sheet shown", WAIT, () -> page.$("sheet-weights").isDisplayed());
        page.waitFor("optimiser available", WAIT, () -> page.$("opt-run").isEnabled());
        page.$("opt-run").click();
        page.waitFor("optimiser result", WAIT, () -> "result".equals(page.js("return document.body.dataset.optimiser;")));
    }

    @Test
    @SuppressWarnings("unchecked")
    void afterNumbersEqualTheJvmOptimiser() {
        String before = scenarioText();
        runOptimiser();
        String options = page.$("opt-result").getAttribute("data-options");
        Map<String, Object> jvm = jvmOptimize(before, options);
        Map<String, Object> r = (Map<String, Object>) jvm.get("result");
        // Source: JsonFacade.optimize on the JVM, same text and options.
        assertNear(num(r.get("complexity")), page.value("opt-after-bound"), "bound after");
        assertNear(num(((Map<String, Object>) r.get("positive")).get("maxResistance")), page.value("opt-after-wplus"), "W+ after");
        assertNear(num(((Map<String, Object>) r.get("negative")).get("maxCapacitance")), page.value("opt-after-wminus"), "W- after");
        Map<String, Object> weights = (Map<String, Object>) r.get("weights");
        for (Map.Entry<String, Object> w : weights.entrySet()) {
            WebElement cell = page.driver.findElement(By.cssSelector("#opt-weights tr[data-edge='" + w.getKey() + "'] td.after"));
            assertNear(num(w.getValue()), Double.parseDouble(cell.getAttribute("data-value")), "weight of " + w.getKey());
        }
        List<Object> trace = (List<Object>) r.get("trace");
        List<Object> shown = (List<Object>) Json.parse((String) page.js("return document.getElementById('opt-trace').dataset.trace;"));
        assertEquals(trace.size(), shown.size(), "trace length");
        for (int i = 0; i < trace.size(); i++) {
            assertNear(num(trace.get(i)), num(shown.get(i)), "trace[" + i + "]");
        }
        // Before: the JVM's analysis of the same text (JsonFacade.analyze).
        Map<String, Object> analysed = WorkbenchIT.jvmResult(before);
        assertNear(num(analysed.get("complexity")), page.value("opt-before-bound"), "bound before");
        assertNear(WorkbenchIT.side(analysed, "positive", "maxResistance"), page.value("opt-before-wplus"), "W+ before");
        assertEquals(String.valueOf(r.get("status")), page.$("opt-status").getAttribute("data-status"));
        String note = page.$("opt-note").getText();
        assertTrue(note.contains(String.valueOf(r.get("note"))), note);
        assertTrue(page.driver.findElement(By.cssSelector("#sheet-weights .caution")).isDisplayed(), "the caution is shown");
        assertEquals(before, scenarioText(), "nothing changes before accepting");
        // The trace was drawn while the search ran: one engine step per call (optimizeStep).
        assertTrue(Integer.parseInt((String) page.js("return document.body.dataset.optimiserSteps || '0';")) >= 1,
                "live steps shown");
    }

    @Test
    @SuppressWarnings("unchecked")
    void lockAndGroupSetInTheEdgeListReachTheOptimiser() {
        // The edge list's lock box and tie-group field write the format's "locked" and "group"
        // keys; the search keeps the locked weight exactly and gives the group one weight.
        page.js("document.querySelectorAll('details').forEach(function (d) { d.open = true; });");
        int serial = page.serial();
        WebElement lock = page.driver.findElement(By.cssSelector("#edge-table tr[data-edge='pump'] .edge-locked"));
        page.js("arguments[0].scrollIntoView();", lock);
        lock.click();
        page.waitForAnalysis(serial, WAIT);
        for (String id : new String[] {"n1", "n2"}) {
            WebElement g = page.driver.findElement(By.cssSelector("#edge-table tr[data-edge='" + id + "'] .edge-group"));
            page.js("arguments[0].scrollIntoView();", g);
            g.sendKeys("north", Keys.TAB);
        }
        page.waitFor("hints written", WAIT, () -> {
            String t = scenarioText();
            return t.contains("\"locked\":true") && t.split("\"group\":\"north\"", -1).length == 3;
        });
        String before = scenarioText();
        runOptimiser();
        Map<String, Object> r = (Map<String, Object>) jvmOptimize(before, page.$("opt-result").getAttribute("data-options")).get("result");
        Map<String, Object> weights = (Map<String, Object>) r.get("weights");
        // Derived: a locked weight is returned as given; tied weights are equal.
        assertEquals(0.5, num(weights.get("pump")), "JVM keeps the locked weight");
        assertEquals(num(weights.get("n1")), num(weights.get("n2")), "JVM ties the group");
        double pump = Double.parseDouble(page.driver.findElement(By.cssSelector("#opt-weights tr[data-edge='pump'] td.after")).getAttribute("data-value"));
        double n1 = Double.parseDouble(page.driver.findElement(By.cssSelector("#opt-weights tr[data-edge='n1'] td.after")).getAttribute("data-value"));
        double n2 = Double.parseDouble(page.driver.findElement(By.cssSelector("#opt-weights tr[data-edge='n2'] td.after")).getAttribute("data-value"));
        assertEquals(0.5, pump, "the page keeps the locked weight");
        assertEquals(n1, n2, "the page ties the group");
        assertNear(num(weights.get("n1")), n1, "tied weight (JsonFacade.optimize on the JVM, same text)");
        assertNear(num(r.get("complexity")), page.value("opt-after-bound"), "bound after (JsonFacade.optimize on the JVM)");
    }

    @Test
    @SuppressWarnings("unchecked")
    void acceptIsAnUndoableEditAndDiscardKeepsTheScenario() {
        String before = scenarioText();
        Map<String, Object> original = WorkbenchIT.jvmResult(before);

        runOptimiser();
        page.$("opt-discard").click();
        page.waitFor("discarded", WAIT, () -> "discarded".equals(page.js("return document.body.dataset.optimiser;")));
        assertEquals(before, scenarioText(), "discard leaves the scenario alone");
        assertFalse(page.$("opt-result").isDisplayed());

        runOptimiser();
        String options = page.$("opt-result").getAttribute("data-options");
        Map<String, Object> jvm = jvmOptimize(before, options);
        int serial = page.serial();
        page.$("opt-accept").click();
        page.waitForAnalysis(serial, WAIT);
        String accepted = scenarioText();
        assertNotEquals(before, accepted);
        // Source: the JVM optimiser's scenario (JsonFacade.optimize "scenario"), analysed on the JVM.
        Map<String, Object> expectedDoc = (Map<String, Object>) Json.parse((String) jvm.get("scenario"));
        Map<String, Object> pageDoc = (Map<String, Object>) Json.parse(accepted);
        List<Object> ee = (List<Object>) ((Map<String, Object>) expectedDoc.get("graph")).get("edges");
        List<Object> pe = (List<Object>) ((Map<String, Object>) pageDoc.get("graph")).get("edges");
        assertEquals(ee.size(), pe.size());
        for (int i = 0; i < ee.size(); i++) {
            assertNear(num(((Map<String, Object>) ee.get(i)).get("weight")), num(((Map<String, Object>) pe.get(i)).get("weight")), "accepted weight " + i);
        }
        Map<String, Object> after = WorkbenchIT.jvmResult(accepted);
        assertNear(num(after.get("complexity")), page.value("sum-bound"), "summary bound after accepting");
        assertNear(WorkbenchIT.side(after, "positive", "maxResistance"), page.value("sum-wplus"), "summary W+ after accepting");
        assertNear(WorkbenchIT.side(after, "negative", "maxCapacitance"), page.value("sum-wminus"), "summary W- after accepting");
        assertTrue(page.$("opt-done").isDisplayed());

        serial = page.serial();
        page.driver.findElement(By.tagName("body")).sendKeys(Keys.chord(Keys.CONTROL, "z"));
        page.waitForAnalysis(serial, WAIT);
        assertEquals(before, scenarioText(), "undo brings the old weights back");
        WorkbenchIT.assertClose(num(original.get("complexity")), page.value("sum-bound"), "bound after undo");
    }

    /**
     * Opens a 2^18-input ladder (our own bench scenario) and starts a search with 50 starts (the
     * sheet's maximum), which runs far longer than a click takes. Returns the scenario text.
     */
    private String startLongSearch(java.nio.file.Path file) throws IOException {
        java.nio.file.Files.writeString(file, BenchIT.ladder(9));
        int serial = page.serial();
        page.$("open-file").sendKeys(file.toString());
        page.waitForAnalysis(serial, WAIT);
        String work = scenarioText();
        page.$("tab-weights").click();
        page.waitFor("optimiser available", WAIT, () -> page.$("opt-run").isEnabled());
        page.$("opt-starts").sendKeys(Keys.chord(Keys.CONTROL, "a"), "50");
        page.$("opt-run").click();
        return work;
    }

    /**
     * Clicks a button of the running search until the page shows it was taken. The sheet's live
     * trace and timer re-lay the sheet out while the search runs, so a click aimed at the button's
     * centre can land beside it once in a while; the button's own state says whether it arrived.
     */
    private void pressDuringSearch(String id, String taken) {
        for (int attempt = 1; attempt <= 3; attempt++) {
            page.$(id).click();
            try {
                page.waitFor(id + " taken", Duration.ofSeconds(3), () -> Boolean.TRUE.equals(page.js(taken)));
                return;
            } catch (org.openqa.selenium.TimeoutException e) {
                System.out.println("[TuningIT] " + id + ": click " + attempt + " not taken, clicking again");
            }
        }
        throw new AssertionError(id + " was clicked three times and the page never took it");
    }

    @Test
    void cancelEndsTheSearchAndKeepsTheWork() throws IOException {
        java.nio.file.Path file = java.nio.file.Files.createTempFile("ladder18-", ".json");
        try {
            String work = startLongSearch(file);
            page.waitFor("progress shown", WAIT, () -> page.$("opt-progress").isDisplayed());
            pressDuringSearch("opt-cancel", "return document.body.dataset.optimiser !== 'running';");
            page.waitFor("cancelled", WAIT, () -> "cancelled".equals(page.js("return document.body.dataset.optimiser;")));
            assertFalse(page.$("opt-progress").isDisplayed());
            assertEquals(work, scenarioText(), "the work is kept");
            assertTrue(page.$("opt-run").isEnabled(), "a new search can start");
            // The main worker still answers: an edit is analysed.
            page.$("tab-summary").click();
            page.js("document.querySelectorAll('.editors details').forEach(function(d){d.open=true;});");
            WebElement weight = page.driver.findElements(By.cssSelector("#edge-table .edge-weight")).get(0);
            int serial = page.serial();
            weight.sendKeys(Keys.chord(Keys.CONTROL, "a"), "2", Keys.TAB);
            page.waitForAnalysis(serial, WAIT);
            assertEquals("ready", page.js("return document.body.dataset.analysis;"));
        } finally {
            java.nio.file.Files.deleteIfExists(file);
        }
    }

    @Test
    void stopKeepsTheBestWeightsSoFar() throws IOException {
        java.nio.file.Path file = java.nio.file.Files.createTempFile("ladder18s-", ".json");
        try {
            String work = startLongSearch(file);
            double start = num(WorkbenchIT.jvmResult(work).get("complexity"));
            page.waitFor("first step drawn", WAIT, () -> !"0".equals(String.valueOf(page.js("return document.body.dataset.optimiserSteps || '0';"))));
            pressDuringSearch("opt-stop", "return document.getElementById('opt-stop').disabled || document.body.dataset.optimiser !== 'running';");
            page.waitFor("stopped with a result", WAIT, () -> "result".equals(page.js("return document.body.dataset.optimiser;")));
            assertEquals("cancelled", page.$("opt-status").getAttribute("data-status"));
            assertTrue(page.$("opt-status").getText().contains("stopped by you"), page.$("opt-status").getText());
            assertEquals(work, scenarioText(), "nothing changes before accepting");
            double after = page.value("opt-after-bound");
            // The optimiser never returns a point worse than its start (monotone descent).
            assertTrue(after <= start * (1 + OPT_TOL), after + " vs " + start);
            int serial = page.serial();
            page.$("opt-accept").click();
            page.waitForAnalysis(serial, WAIT);
            // Source: the JVM analysis of the accepted text (JsonFacade.analyze) and the page's own
            // fresh analysis both give the bound the stopped search reported.
            Map<String, Object> jvm = WorkbenchIT.jvmResult(scenarioText());
            assertNear(num(jvm.get("complexity")), after, "stopped bound vs JVM analysis of the accepted weights");
            assertNear(num(jvm.get("complexity")), page.value("sum-bound"), "summary bound after accepting");
        } finally {
            java.nio.file.Files.deleteIfExists(file);
        }
    }
}
