package spanwright.web;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.Select;
import spanwright.analysis.StructuralAnalysis;
import spanwright.facade.JsonFacade;
import spanwright.io.Json;
import spanwright.io.ScenarioReader;

/**
 * The page beyond enumeration, in real Chromium from file:// at 1280×720: host graphs with one
 * variable per edge (K12: 66 variables, a 6×6 grid: 60) are analysed by the engine's structural
 * method in a worker, with the elapsed time shown and Cancel; the Inputs panel lists the engine's
 * candidates (the worst path and the worst bond); focusing one draws its witness; the TikZ button
 * writes the engine's figure; the weight search runs on the structural path. Expected numbers come
 * from the JVM in this process: {@link StructuralAnalysis#run} and {@link JsonFacade} (the same
 * façade the command line uses) on the very scenario text the page holds. Times are printed and
 * appended to target/bench-browser.txt, never asserted.
 */
class StructureIT {
    private static final Duration WAIT = Duration.ofSeconds(180);
    /** The same Java code on the JVM and in TeaVM's JavaScript/wasm: the structural values are sums
     *  of weights and eliminations on doubles; 1e-9 relative (common practice, no source). */
    private static final double TOL = 1e-9;
    private static PageDriver page;

    @BeforeAll
    static void start() throws IOException {
        page = new PageDriver(1280, 720);
        page.driver.get(PageDriver.pageUrl(null));
        page.js("localStorage.clear();");
        page.openFresh(null);
        int frames = ((Number) page.js("return window.outerHeight - window.innerHeight;")).intValue();
        page.driver.manage().window().setSize(new Dimension(1280, 720 + frames));
    }

    @AfterAll
    static void stop() {
        if (page != null) {
            page.close();
        }
    }

    private static void record(String line) throws IOException {
        System.out.println("[bench] " + line);
        Files.writeString(Paths.get("target/bench-browser.txt"), line + "\n", StandardCharsets.UTF_8,
                java.nio.file.StandardOpenOption.CREATE, java.nio.file.StandardOpenOption.APPEND);
    }

    private static void key(String k) {
        page.driver.findElement(By.tagName("body")).sendKeys(k);
    }

    private static void mode(String m) {
        if (!m.equals(page.js("return document.body.dataset.mode;"))) {
            key(m.equals("present") ? "m" : Keys.ESCAPE.toString());
        }
        page.waitFor("mode " + m, WAIT, () -> m.equals(page.js("return document.body.dataset.mode;")));
        page.js("return new Promise(function (r) { setTimeout(r, 400); });");
    }

    private static void assertClose(double expected, double actual, String what) {
        assertEquals(expected, actual, TOL * Math.max(1, Math.abs(expected)), what);
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> map(Object o) {
        return (Map<String, Object>) o;
    }

    /** The JVM's façade answer for this text (the command line's analyze --json). */
    private static Map<String, Object> jvmAnalysis(String text) {
        Map<String, Object> answer = map(Json.parse(JsonFacade.analyze(text, false)));
        assertEquals(Boolean.TRUE, answer.get("ok"), () -> "JVM analysis failed: " + answer);
        return map(answer.get("result"));
    }

    private static String scenarioText() {
        return (String) page.js("return window.Spanwright.scenarioText();");
    }

    /** W+, W- and the bound shown equal the JVM's structural engine on the page's text. */
    private static StructuralAnalysis.Result assertSummaryMatchesTheJvm(String what) {
        String text = scenarioText();
        StructuralAnalysis.Result jvm = StructuralAnalysis.run(ScenarioReader.read(text));
        assertTrue(jvm.exact(), jvm.method());
        assertEquals("structure", page.js("return document.body.dataset.method;"), what + ": the structural method ran");
        assertClose(jvm.positive().value(), page.value("sum-wplus"), what + " W+ (JVM StructuralAnalysis.run)");
        assertClose(jvm.negative().value(), page.value("sum-wminus"), what + " W- (JVM StructuralAnalysis.run)");
        assertClose(jvm.complexity(), page.value("sum-bound"), what + " bound (JVM StructuralAnalysis.run)");
        // the Summary's method line is the façade's reason, word for word
        String reason = (String) jvmAnalysis(text).get("methodReason");
        assertEquals("Method: " + reason + ".", page.$("method-line").getText(), what + ": method line");
        return jvm;
    }

    /** The candidates listed are the JVM's worst inputs, labelled, with the counts the engine found. */
    private static void assertCandidates(StructuralAnalysis.Result jvm, String what) {
        assertEquals("candidates", page.js("return document.body.dataset.inputsList;"), what);
        List<WebElement> rows = page.driver.findElements(By.cssSelector("#candidates .cand"));
        assertEquals(2, rows.size(), what + ": the worst path and the worst bond");
        WebElement path = rows.get(0);
        WebElement bond = rows.get(1);
        assertEquals("pos", path.getAttribute("data-kind"));
        assertEquals("neg", bond.getAttribute("data-kind"));
        assertEquals(jvm.positive().worst().input, path.getAttribute("data-x"), what + ": worst path input (JVM)");
        assertEquals(jvm.negative().worst().input, bond.getAttribute("data-x"), what + ": worst bond input (JVM)");
        assertTrue(path.getText().contains("worst path (W₊)"), path.getText());
        assertTrue(bond.getText().contains("worst bond (W₋)"), bond.getText());
        String paths = String.format("%,d", jvm.positive().extremeInputs());
        String bonds = String.format("%,d", jvm.negative().extremeInputs());
        assertTrue(path.getText().contains(paths + " simple s–t paths"), path.getText() + " / " + paths);
        assertTrue(bond.getText().contains(bonds + " s–t bonds"), bond.getText() + " / " + bonds);
        assertClose(jvm.positive().value(), Double.parseDouble(path.getAttribute("data-value")), what + " path R");
        assertClose(jvm.negative().value(), Double.parseDouble(bond.getAttribute("data-value")), what + " bond C");
    }

    /** Focuses the worst input of one side by its key and waits for the drawing. */
    private static void focusWorst(String k, String x) {
        page.js("document.body.dataset.focusDrawn = '';");
        key(k);
        page.waitFor("focus drawn " + k, WAIT, () -> x.equals(page.js("return document.body.dataset.focusDrawn || '';")));
    }

    @Test
    void k12FromTheBuilderMatchesTheJvmListsItsCandidatesAndExportsTikz() throws IOException {
        page.$("new-from").click();
        page.waitFor("dialog open", WAIT, () -> page.$("builder").isDisplayed());
        page.driver.findElement(By.cssSelector("input[name=bkind][value=host]")).click();
        page.waitFor("host kind", WAIT, () -> "host".equals(page.$("builder").getAttribute("data-kind")));
        new Select(page.$("b-family")).selectByValue("complete");
        WebElement size = page.$("b-size1");
        size.sendKeys(Keys.chord(Keys.CONTROL, "a"), "12");
        page.waitFor("K12 previewed", WAIT, () -> String.valueOf(page.$("builder").getAttribute("data-request")).contains("\"size\":[12]")
                && "built".equals(page.$("builder").getAttribute("data-preview")));
        // the preview analyses by structure too (66 variables); source: the JVM on the built text
        page.waitFor("preview figures", WAIT, () -> "ready".equals(page.$("builder").getAttribute("data-preview-figures")));
        Map<String, Object> built = map(Json.parse(JsonFacade.build(page.$("builder").getAttribute("data-request"))));
        String builtText = Json.write(built.get("scenario"));
        StructuralAnalysis.Result expected = StructuralAnalysis.run(ScenarioReader.read(builtText));
        assertClose(expected.positive().value(), page.value("builder-wplus"), "preview W+");
        assertClose(expected.negative().value(), page.value("builder-wminus"), "preview W-");

        int serial = page.serial();
        long t0 = System.nanoTime();
        page.$("builder-create").click();
        page.waitForAnalysis(serial, WAIT);
        long wall = (System.nanoTime() - t0) / 1_000_000;
        assertEquals("ready", page.js("return document.body.dataset.analysis;"), page.$("error-box").getText());
        assertOpenedTheEnginesScenario(builtText);
        StructuralAnalysis.Result jvm = assertSummaryMatchesTheJvm("K12");
        // derived: K_n with unit weights has W+ = n - 1 (a Hamiltonian path), W- = ⌊n²/4⌋ (a balanced cut)
        assertEquals(11.0, page.value("sum-wplus"), 1e-9);
        assertEquals(36.0, page.value("sum-wminus"), 1e-9);
        record("engine=" + page.data("engine-badge", "engine") + " K12 (66 edge variables) analysed by structure in the page: "
                + Math.round(Double.parseDouble(page.data("timing", "ms"))) + " ms in the task worker, " + wall
                + " ms from 'Open as new scenario' to the finished summary");
        assertCandidates(jvm, "K12");

        // the worst bond in focus: potentials (vertex colours), its absent edges dashed
        focusWorst("0", jvm.negative().worst().input);
        assertClose(jvm.negative().value(), page.value("focus-value"), "focused bond's C");
        assertEquals(12L, page.js("return window.SpanwrightView.cy.nodes('.ramp').length;"), "every vertex coloured by its potential");
        long absent = jvm.negative().worst().input.chars().filter(c -> c == '0').count();
        assertEquals(absent, page.js("return window.SpanwrightView.cy.edges('.absent').length;"), "the bond's edges are the absent ones");
        assertTrue(page.$("focus-info").getText().contains("worst bond"), page.$("focus-info").getText());

        // TikZ: the engine's figure of the drawing with this input and the Summary's W+, W-
        page.js("window.__tex = null; window.__texName = null; window.SwFormat.download = function (name, blob) {"
                + " window.__texName = name; blob.text().then(function (t) { window.__tex = t; }); };");
        page.$("export-tikz").click();
        page.waitFor("TikZ written", WAIT, () -> page.js("return window.__tex;") != null);
        String tex = (String) page.js("return window.__tex;");
        assertTrue(tex.startsWith("\\documentclass"), tex.substring(0, Math.min(60, tex.length())));
        assertTrue(String.valueOf(page.js("return window.__texName;")).endsWith(".tex"));
        // source: JsonFacade.tikz on the JVM with the same input and bound
        Map<String, Object> jvmTikz = map(Json.parse(JsonFacade.tikz(scenarioText(), "{\"input\":\"" + jvm.negative().worst().input
                + "\",\"positive\":11,\"negative\":36}")));
        assertEquals(jvmTikz.get("standalone"), tex, "the page's .tex is the engine's figure");
        assertTrue(tex.contains("C = 36"), "caption with the focused bond's C");

        // the worst path: currents along it
        focusWorst("1", jvm.positive().worst().input);
        assertClose(jvm.positive().value(), page.value("focus-value"), "focused path's R");
        assertEquals(11L, page.js("return window.SpanwrightView.cy.edges('.flow').length;"), "a Hamiltonian path: 11 edges carry the current");
    }

    /** Builds a host family in the New from… dialog and opens it; returns the JVM's build of the same request. */
    private static String buildInDialog(String family, String a, String b) {
        page.$("new-from").click();
        page.waitFor("dialog open", WAIT, () -> page.$("builder").isDisplayed());
        page.driver.findElement(By.cssSelector("input[name=bkind][value=host]")).click();
        page.waitFor("host kind", WAIT, () -> "host".equals(page.$("builder").getAttribute("data-kind")));
        new Select(page.$("b-family")).selectByValue(family);
        page.js("var v = [arguments[0], arguments[1]]; ['b-size1', 'b-size2'].forEach(function (id, i) { var e = document.getElementById(id);"
                + " e.value = v[i]; e.dispatchEvent(new Event('input')); e.dispatchEvent(new Event('change')); });", a, b == null ? "" : b);
        String size = b == null ? "[" + a + "]" : "[" + a + "," + b + "]";
        page.waitFor(family + " " + size + " previewed", WAIT, () -> String.valueOf(page.$("builder").getAttribute("data-request")).contains(size)
                && "built".equals(page.$("builder").getAttribute("data-preview")));
        page.waitFor("preview figures", WAIT, () -> "ready".equals(page.$("builder").getAttribute("data-preview-figures")));
        Map<String, Object> built = map(Json.parse(JsonFacade.build(page.$("builder").getAttribute("data-request"))));
        return Json.write(built.get("scenario"));
    }

    /** The builder's limits are the structural engine's: an 8×8 grid (112 edges) and K16 (120) are
     *  built, previewed and analysed in the page, drawn where the engine placed them (grid rows and
     *  columns, a circle). Source of the numbers: StructuralAnalysis.run on the JVM. */
    @Test
    @SuppressWarnings("unchecked")
    void largeHostsFromTheBuilder() throws IOException {
        for (String[] f : new String[][] {{"grid", "8", "8"}, {"complete", "16", null}}) {
            String builtText = buildInDialog(f[0], f[1], f[2]);
            StructuralAnalysis.Result expected = StructuralAnalysis.run(ScenarioReader.read(builtText));
            assertClose(expected.positive().value(), page.value("builder-wplus"), f[0] + " preview W+");
            assertClose(expected.negative().value(), page.value("builder-wminus"), f[0] + " preview W-");
            int serial = page.serial();
            long t0 = System.nanoTime();
            page.$("builder-create").click();
            page.waitForAnalysis(serial, WAIT);
            long wall = (System.nanoTime() - t0) / 1_000_000;
            assertEquals("ready", page.js("return document.body.dataset.analysis;"), page.$("error-box").getText());
            assertOpenedTheEnginesScenario(builtText);
            StructuralAnalysis.Result jvm = assertSummaryMatchesTheJvm(f[0] + " " + f[1]);
            assertCandidates(jvm, f[0] + " " + f[1]);
            record("engine=" + page.data("engine-badge", "engine") + " " + f[0] + " " + f[1] + (f[2] == null ? "" : "x" + f[2])
                    + " analysed by structure in the page: " + Math.round(Double.parseDouble(page.data("timing", "ms"))) + " ms in the task worker, "
                    + wall + " ms from 'Open as new scenario' to the finished summary");
            // the drawing keeps the engine's positions
            Object moved = page.js("var sc = JSON.parse(window.Spanwright.scenarioText()), cy = window.SpanwrightView.cy, out = [];"
                    + " sc.graph.vertices.forEach(function (v) { var p = cy.getElementById(v.id).position();"
                    + "   if (Math.abs(p.x - v.x) > 1e-6 || Math.abs(p.y - v.y) > 1e-6) out.push(v.id); }); return out.join(' ');");
            assertEquals("", moved, "vertices drawn where the engine placed them");
            List<Object> vertices = (List<Object>) map(map(Json.parse(builtText)).get("graph")).get("vertices");
            if (f[0].equals("grid")) {
                // r2c3 sits one row down and two columns right of r1c1 (the builder's 100-unit grid)
                Map<String, Object> v = map(vertices.get(8 + 2));
                assertEquals("r2c3", v.get("id"));
                assertEquals(200.0, ((Number) v.get("x")).doubleValue() - ((Number) map(vertices.get(0)).get("x")).doubleValue(), 1e-9);
                assertEquals(100.0, ((Number) v.get("y")).doubleValue() - ((Number) map(vertices.get(0)).get("y")).doubleValue(), 1e-9);
            } else {
                double r0 = Math.hypot(((Number) map(vertices.get(0)).get("x")).doubleValue(), ((Number) map(vertices.get(0)).get("y")).doubleValue());
                for (Object o : vertices) {
                    assertEquals(r0, Math.hypot(((Number) map(o).get("x")).doubleValue(), ((Number) map(o).get("y")).doubleValue()), 1e-6,
                            "K16 on a circle");
                }
            }
            assertEquals("0", page.js("return document.getElementById('graph').dataset.crowdedLabels;"), "no crowded labels");
        }
        // derived: K16, unit weights: W+ = 15 (Hamiltonian path), W- = ⌊16²/4⌋ = 64 (balanced cut)
        assertEquals(15.0, page.value("sum-wplus"), 1e-9);
        assertEquals(64.0, page.value("sum-wminus"), 1e-9);
    }

    /** A 60-edge grid opened as a file (validate must accept it), analysed, drawn readably at
     *  1280×720 in both modes, then optimised in the Weights sheet on the structural path. */
    @Test
    void grid6x6OpensAsAFileIsReadableAndOptimises() throws IOException {
        String text = Json.write(map(Json.parse(JsonFacade.build("{\"kind\":\"host\",\"family\":\"grid\",\"size\":[6,6]}"))).get("scenario"));
        // validate of a 60-edge host scenario: ok on the JVM ...
        Map<String, Object> v = map(Json.parse(JsonFacade.validate(text)));
        assertEquals(Boolean.TRUE, v.get("ok"), v.toString());
        Path file = Files.createTempFile("grid6x6-", ".json");
        Files.writeString(file, text, StandardCharsets.UTF_8);
        try {
            mode("edit");
            int serial = page.serial();
            page.$("open-file").sendKeys(file.toString());
            // ... and in the page, which opens a file only after the engine's validate
            page.waitForAnalysis(serial, WAIT);
            assertEquals("ready", page.js("return document.body.dataset.analysis;"), page.$("error-box").getText() + " / "
                    + page.$("notice-text").getText());
            Object validated = page.js("return new Promise(function (r) { window.SwApp.bridge().call('validate', window.Spanwright.scenarioText())"
                    + ".then(function (v) { r(v.ok + ' ' + v.method + ' ' + v.variables.length); }); });");
            assertEquals("true structure 60", validated, "the engine's validate in the page");
            StructuralAnalysis.Result jvm = assertSummaryMatchesTheJvm("6x6 grid");
            assertCandidates(jvm, "6x6 grid");
            // the counting fact: 1,262,816 corner-to-corner simple paths in the 6×6 grid (OEIS A007764)
            assertTrue(page.driver.findElement(By.cssSelector("#candidates .cand[data-kind=pos]")).getText().contains("1,262,816"));
            record("engine=" + page.data("engine-badge", "engine") + " 6x6 grid (60 edge variables) analysed by structure in the page: "
                    + Math.round(Double.parseDouble(page.data("timing", "ms"))) + " ms");

            focusWorst("1", jvm.positive().worst().input);
            assertLabelsReadable("6x6 grid, worst path, edit");
            page.screenshot("grid-6x6-worst-path-1280x720");
            mode("present");
            assertLabelsReadable("6x6 grid, worst path, presentation");
            page.screenshot("grid-6x6-present-worst-path-1280x720");
            focusWorst("0", jvm.negative().worst().input);
            assertLabelsReadable("6x6 grid, worst bond, presentation");
            page.screenshot("grid-6x6-present-worst-bond-1280x720");
            mode("edit");

            // the weight search on the structural path (the engine's working-set optimiser)
            key("w");
            page.waitFor("optimiser available", WAIT, () -> page.$("opt-run").isEnabled());
            long t0 = System.nanoTime();
            page.$("opt-run").click();
            page.waitFor("optimiser result", Duration.ofSeconds(300), () -> {
                Object s = page.js("return document.body.dataset.optimiser;");
                return "result".equals(s) || "error".equals(s);
            });
            long wall = (System.nanoTime() - t0) / 1_000_000;
            assertEquals("result", page.js("return document.body.dataset.optimiser;"), page.$("opt-error").getText());
            double after = page.value("opt-after-bound");
            record("engine=" + page.$("opt-status").getAttribute("data-engine") + " 6x6 grid weight search in the page: " + wall
                    + " ms from the click to the result (" + page.$("opt-result").getAttribute("data-ms") + " ms in the task worker), "
                    + page.$("opt-status").getAttribute("data-iterations") + " iterations, status "
                    + page.$("opt-status").getAttribute("data-status") + ", bound " + jvm.complexity() + " -> " + after);
            assertClose(jvm.complexity(), page.value("opt-before-bound"), "bound before (JVM)");
            assertTrue(after < jvm.complexity(), "the search lowers the bound: " + after);
            // source: JsonFacade.optimize on the JVM with the same text and options (the working-set
            // optimiser, chosen beyond enumeration); the search iterates on doubles, so 1e-6 relative
            // (common practice, no source), as TuningIT
            String options = page.$("opt-result").getAttribute("data-options");
            Map<String, Object> jvmOpt = map(Json.parse(JsonFacade.optimize(text, options)));
            assertEquals(Boolean.TRUE, jvmOpt.get("ok"), jvmOpt.toString());
            Map<String, Object> jvmResult = map(jvmOpt.get("result"));
            assertEquals("working-set", jvmResult.get("method"));
            assertEquals(((Number) jvmResult.get("complexity")).doubleValue(), after,
                    1e-6 * ((Number) jvmResult.get("complexity")).doubleValue(), "bound after (JVM JsonFacade.optimize)");
            // the certificate: the accepted weights analysed again by the structural engine give the
            // bound the search reported (source: the engine's own analysis, in the page and on the JVM)
            serial = page.serial();
            page.$("opt-accept").click();
            page.waitForAnalysis(serial, WAIT);
            assertClose(after, page.value("sum-bound"), "bound of the accepted weights");
            StructuralAnalysis.Result accepted = StructuralAnalysis.run(ScenarioReader.read(scenarioText()));
            assertClose(accepted.complexity(), after, "bound of the accepted weights (JVM StructuralAnalysis.run)");
            key("s");
        } finally {
            Files.deleteIfExists(file);
        }
    }

    /** A function the graph does not decide, beyond enumeration: the verdict gives the engine's count
     *  and first counterexamples; one clicked is listed and focused with the JVM's witness. */
    @Test
    @SuppressWarnings("unchecked")
    void aWrongReductionListsItsCounterexamplesOnDemand() throws IOException {
        Map<String, Object> doc = map(map(Json.parse(JsonFacade.build("{\"kind\":\"host\",\"family\":\"grid\",\"size\":[5,5]}"))).get("scenario"));
        doc.put("function", "r1c1_r1c2 | r1c1_r2c1");   // s has an edge: necessary for s ~ t, not sufficient
        String text = Json.write(doc);
        Path file = Files.createTempFile("grid5x5-wrong-", ".json");
        Files.writeString(file, text, StandardCharsets.UTF_8);
        try {
            int serial = page.serial();
            page.$("open-file").sendKeys(file.toString());
            page.waitForAnalysis(serial, WAIT);
            assertSummaryMatchesTheJvm("5x5 grid, wrong f");
            Map<String, Object> red = map(jvmAnalysis(text).get("reduction"));
            assertEquals("fails", red.get("status"));
            WebElement verdict = page.$("verdict");
            assertEquals("no", verdict.getAttribute("data-correct"));
            String count = String.format("%,d", new java.math.BigInteger((String) red.get("counterexamples")));
            assertTrue(verdict.getText().contains(count + " counterexamples"), verdict.getText() + " / " + count);
            assertTrue(verdict.getText().contains("not a bound for f"), verdict.getText());
            String first = (String) ((List<Object>) red.get("first")).get(0);
            page.js("document.body.dataset.focusDrawn = '';");
            verdict.findElement(By.cssSelector("button.linkish")).click();
            page.waitFor("counterexample drawn", WAIT, () -> first.equals(page.js("return document.body.dataset.focusDrawn || '';")));
            page.waitFor("counterexample valued", WAIT, () -> !Double.isNaN(page.value("focus-value")));
            WebElement row = page.driver.findElement(By.cssSelector("#candidates .cand[data-x='" + first + "']"));
            assertEquals("other", row.getAttribute("data-kind"));
            assertTrue(row.getText().startsWith("counterexample"), row.getText());
            assertTrue(row.getAttribute("class").contains("bad"), "marked as a counterexample");
            // source: JsonFacade.detail on the JVM for the same input
            Map<String, Object> d = map(Json.parse(JsonFacade.detail(text, first)));
            assertClose(((Number) d.get("value")).doubleValue(), page.value("focus-value"), "counterexample's witness size");
        } finally {
            Files.deleteIfExists(file);
        }
    }

    /** A structural analysis that runs long (branch and bound: a shared variable makes the grid more
     *  than a host graph) shows its elapsed time and is cancelled; the next analysis runs. */
    @Test
    @SuppressWarnings("unchecked")
    void aLongStructuralAnalysisShowsItsTimeAndCancels() throws IOException {
        Map<String, Object> doc = map(map(Json.parse(JsonFacade.build("{\"kind\":\"host\",\"family\":\"grid\",\"size\":[8,8]}"))).get("scenario"));
        // the last edge switched by the first edge's variable: no longer one variable per edge
        List<Object> edges = (List<Object>) map(doc.get("graph")).get("edges");
        String first = (String) map(edges.get(0)).get("when");
        String last = (String) map(edges.get(edges.size() - 1)).get("when");
        map(edges.get(edges.size() - 1)).put("when", first);
        ((List<Object>) doc.get("variables")).remove(last);
        doc.remove("function");
        Path file = Files.createTempFile("grid8x8-shared-", ".json");
        Files.writeString(file, Json.write(doc), StandardCharsets.UTF_8);
        try {
            String before = page.$("sum-bound").getText();
            String work = scenarioText();
            page.$("open-file").sendKeys(file.toString());
            page.waitFor("working shown", WAIT, () -> page.$("progress-row").isDisplayed()
                    && page.$("progress-text").getText().startsWith("working…"));
            page.waitFor("elapsed time grows", WAIT, () -> {
                String e = page.$("progress-text").getAttribute("data-elapsed");
                return e != null && Double.parseDouble(e) >= 1.0;
            });
            // the main worker still answers while the structural engine runs in its own
            long r0 = System.nanoTime();
            Object answer = page.js("return new Promise(function (r) { window.SwApp.bridge().call('validate', window.Spanwright.scenarioText())"
                    + ".then(function (v) { r(v.ok + ' ' + v.method); }); });");
            assertEquals("true structure", answer);
            record("validate answered by the main worker during a structural analysis in " + (System.nanoTime() - r0) / 1_000_000 + " ms");
            page.$("cancel").click();
            page.waitFor("cancelled", WAIT, () -> "cancelled".equals(page.js("return document.body.dataset.analysis;")));
            assertEquals(before, page.$("sum-bound").getText(), "numbers of the last finished analysis are kept");
            assertTrue(page.$("status").getText().startsWith("cancelled"), page.$("status").getText());
            // a fresh analysis afterwards (undo brings back the previous work): the structural worker restarts
            int serial = page.serial();
            page.driver.findElement(By.tagName("body")).sendKeys(Keys.chord(Keys.CONTROL, "z"));
            page.waitForAnalysis(serial, WAIT);
            assertEquals(work, scenarioText());
            assertEquals("ready", page.js("return document.body.dataset.analysis;"), page.$("error-box").getText());
        } finally {
            Files.deleteIfExists(file);
        }
    }

    /** Every label shown is at least 11 px on screen, and the edge labels shown do not pile up:
     *  the drawing reports no crowded label (see graphview.js placeLabels). */
    private static void assertLabelsReadable(String what) {
        Object small = page.js("var cy = window.SpanwrightView.cy, z = cy.zoom(), out = [];"
                + " var lb = {includeNodes:false, includeEdges:false, includeLabels:true, includeMainLabels:true, includeSourceLabels:false, includeTargetLabels:false, includeOverlays:false, includeUnderlays:false, useCache:false};"
                + " cy.edges().forEach(function (e) { if (!e.data('shown')) return; var fs = parseFloat(e.style('font-size')) * z, h = e.renderedBoundingBox(lb).h;"
                + "   if (fs < 11 - 1e-6 || h < 11) out.push(e.id() + ' ' + fs.toFixed(1) + 'px/' + h.toFixed(1) + 'px'); });"
                + " cy.nodes().forEach(function (n) { var fs = parseFloat(n.style('font-size')) * z; if (fs < 11 - 1e-6) out.push(n.id() + ' ' + fs.toFixed(1) + 'px'); });"
                + " return out.join('; ');");
        assertEquals("", small, "labels under 11 px on screen: " + what);
        assertEquals("0", page.js("return document.getElementById('graph').dataset.crowdedLabels;"), "crowded edge labels: " + what);
    }

    /**
     * The page holds the scenario the engine built: equal as JSON, numbers to TOL (vertex positions
     * come from the layout's Math.sin/cos, which the browser computes, so they may differ from the
     * JVM's in the last bit).
     */
    private void assertOpenedTheEnginesScenario(String builtText) {
        assertSameJson(Json.parse(builtText), Json.parse(scenarioText()), "$");
    }

    private static void assertSameJson(Object expected, Object actual, String path) {
        if (expected instanceof Double && actual instanceof Double) {
            assertClose((Double) expected, (Double) actual, "the page opened the engine's scenario, at " + path);
        } else if (expected instanceof Map && actual instanceof Map) {
            Map<?, ?> e = (Map<?, ?>) expected;
            Map<?, ?> a = (Map<?, ?>) actual;
            assertEquals(e.keySet(), a.keySet(), "the page opened the engine's scenario, keys at " + path);
            e.forEach((k, v) -> assertSameJson(v, a.get(k), path + "." + k));
        } else if (expected instanceof List && actual instanceof List) {
            List<?> e = (List<?>) expected;
            List<?> a = (List<?>) actual;
            assertEquals(e.size(), a.size(), "the page opened the engine's scenario, length at " + path);
            for (int k = 0; k < e.size(); k++) {
                assertSameJson(e.get(k), a.get(k), path + "[" + k + "]");
            }
        } else {
            assertEquals(expected, actual, "the page opened the engine's scenario, at " + path);
        }
    }
}
