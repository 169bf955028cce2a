package spanwright.web;

import spanwright.io.ScenarioWriter;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.time.Duration;
import org.junit.jupiter.api.Test;

/**
 * In-browser benchmark (prints, never asserts a time): first render of the default scenario, and
 * inputs per second for a 2^16-input scenario in the JavaScript and WebAssembly-GC engines. Also
 * checks that a 2^20-input analysis shows progress and can be cancelled. Figures are appended to
 * target/bench-browser.txt.
 */
class BenchIT {
    private static final Duration WAIT = Duration.ofSeconds(180);

    /** A ladder of our own invention: n rungs joined in series, two literal edges per rung, and
     *  negated shortcuts that skip a rung. 2·rungs variables. */
    static String ladder(int rungs) {
        StringBuilder vars = new StringBuilder();
        StringBuilder vertices = new StringBuilder("{\"id\":\"s\",\"x\":0,\"y\":0}");
        StringBuilder edges = new StringBuilder();
        for (int i = 0; i < 2 * rungs; i++) {
            vars.append(i == 0 ? "" : ",").append("\"x").append(i).append('"');
        }
        for (int i = 1; i < rungs; i++) {
            vertices.append(",{\"id\":\"m").append(i).append("\",\"x\":").append(90 * i).append(",\"y\":").append(i % 2 * 60).append('}');
        }
        vertices.append(",{\"id\":\"t\",\"x\":").append(90 * rungs).append(",\"y\":0}");
        int e = 0;
        for (int i = 0; i < rungs; i++) {
            String u = i == 0 ? "s" : "m" + i;
            String v = i == rungs - 1 ? "t" : "m" + (i + 1);
            edges.append(e == 0 ? "" : ",").append(edge(++e, u, v, "x" + (2 * i), 1));
            edges.append(',').append(edge(++e, u, v, "x" + (2 * i + 1), 2));
            if (i + 2 <= rungs) {
                String w = i + 2 == rungs ? "t" : "m" + (i + 2);
                edges.append(',').append(edge(++e, u, w, "!x" + (2 * i + 1), 3));
            }
        }
        return "{\"format\":\"spanwright-scenario\",\"version\":1,\"title\":\"Bench ladder " + rungs + " rungs\","
                + "\"variables\":[" + vars + "],\"promise\":null,\"graph\":{\"s\":\"s\",\"t\":\"t\","
                + "\"vertices\":[" + vertices + "],\"edges\":[" + edges + "]}}";
    }

    private static String edge(int id, String u, String v, String when, double w) {
        return "{\"id\":\"e" + id + "\",\"u\":\"" + u + "\",\"v\":\"" + v + "\",\"when\":\"" + when + "\",\"weight\":" + w + "}";
    }

    private static void record(String line) throws IOException {
        System.out.println("[bench] " + line);
        Path out = Paths.get("target/bench-browser.txt");
        Files.writeString(out, line + "\n", StandardCharsets.UTF_8,
                java.nio.file.StandardOpenOption.CREATE, java.nio.file.StandardOpenOption.APPEND);
    }

    @Test
    void firstRenderAndThroughput() throws IOException {
        Path file = Files.createTempFile("ladder16-", ".json");
        Files.writeString(file, ladder(8), StandardCharsets.UTF_8);
        try (PageDriver page = new PageDriver(1280, 900)) {
            for (String engine : new String[] {"js", "wasm"}) {
                page.driver.get(PageDriver.pageUrl(null));
                page.js("localStorage.clear();");
                page.driver.get("about:blank");
                page.openFresh("?engine=" + engine);
                assertEquals(engine, page.data("engine-badge", "engine"));
                record("engine=" + engine + " first render of the default scenario: "
                        + page.js("return document.body.dataset.firstRenderMs;") + " ms after navigation start");
                int serial = page.serial();
                page.$("open-file").sendKeys(file.toString());
                page.waitForAnalysis(serial, WAIT);
                assertEquals("ready", page.js("return document.body.dataset.analysis;"), page.$("error-box").getText());
                String total = page.$("counts").getText();
                assertTrue(total.startsWith("65,536 inputs"), total);
                double ms = Double.parseDouble(page.data("timing", "ms"));
                double rate = Double.parseDouble(page.data("timing", "rate"));
                record("engine=" + engine + " 2^16 inputs (ladder of 8 rungs: " + ladderSize() + "): "
                        + Math.round(ms) + " ms in the worker, " + Math.round(rate) + " inputs/s"
                        + ("true".equals(page.data("timing", "retried")) ? " (includes a second, one-call pass after the stepped finish failed in core)" : ""));
            }
        } finally {
            Files.deleteIfExists(file);
        }
    }

    private static String ladderSize() {
        return "9 vertices, 23 edges, 16 variables";
    }

    /** A read-once AND/OR formula on 16 variables of our own, lopsided so that unit weights are
     *  not optimal. */
    static final String READ_ONCE_16 = "(a | (b & (c | d))) & ((e & f) | g | (h & (i | j | k))) & (l | (m & n & (o | p)))";

    /**
     * The weight optimiser in the page: wall time from the click to the shown result, for the
     * default scenario and for the 16-variable read-once formula built with unit weights in the
     * "New from…" dialog (ADV = √16 = 4 for read-once formulas: Barnum & Saks 2004; the reached
     * bound is printed next to it).
     */
    @Test
    void optimiserInThePage() throws IOException {
        try (PageDriver page = new PageDriver(1280, 900)) {
            for (String engine : new String[] {"wasm", "js"}) {
                page.driver.get(PageDriver.pageUrl(null));
                page.js("localStorage.clear();");
                page.driver.get("about:blank");
                page.openFresh("?engine=" + engine);
                record("engine=" + engine + " optimiser, default scenario: " + optimise(page));

                page.$("new-from").click();
                page.driver.findElement(org.openqa.selenium.By.cssSelector("input[name=bkind][value=formula]")).click();
                new org.openqa.selenium.support.ui.Select(page.$("b-formula-weights")).selectByValue("unit");
                page.$("b-expression").sendKeys(org.openqa.selenium.Keys.chord(org.openqa.selenium.Keys.CONTROL, "a"), READ_ONCE_16);
                page.waitFor("16-variable formula built", WAIT, () -> String.valueOf(page.js("return document.getElementById('builder').dataset.request;")).contains("(o | p)))")
                        && String.valueOf(page.js("return document.getElementById('builder').dataset.request;")).contains("unit")
                        && "built".equals(page.js("return document.getElementById('builder').dataset.preview;")));
                int serial = page.serial();
                page.$("builder-create").click();
                page.waitForAnalysis(serial, WAIT);
                record("engine=" + engine + " optimiser, 16-variable read-once formula, unit weights (" + page.value("sum-bound")
                        + " before): " + optimise(page) + "; target sqrt(16) = 4");
            }
        }
    }

    /**
     * Beyond enumeration: K12 (66 edge variables) and a 6×6 grid (60) opened as files and analysed
     * by the structural engine in its task worker, and the 6×6 grid's weight search (the working-set
     * optimiser), in both engines. Numbers are checked against the JVM in StructureIT.
     */
    @Test
    void structureInThePage() throws IOException {
        Path k12 = Files.createTempFile("k12-", ".json");
        Path grid = Files.createTempFile("grid6x6-", ".json");
        Files.writeString(k12, hostText("{\"kind\":\"host\",\"family\":\"complete\",\"size\":[12]}"), StandardCharsets.UTF_8);
        Files.writeString(grid, hostText("{\"kind\":\"host\",\"family\":\"grid\",\"size\":[6,6]}"), StandardCharsets.UTF_8);
        try (PageDriver page = new PageDriver(1280, 900)) {
            for (String engine : new String[] {"wasm", "js"}) {
                page.driver.get(PageDriver.pageUrl(null));
                page.js("localStorage.clear();");
                page.driver.get("about:blank");
                page.openFresh("?engine=" + engine);
                for (Path f : new Path[] {k12, grid}) {
                    int serial = page.serial();
                    long t0 = System.nanoTime();
                    page.$("open-file").sendKeys(f.toString());
                    page.waitForAnalysis(serial, WAIT);
                    long wall = (System.nanoTime() - t0) / 1_000_000;
                    assertEquals("structure", page.js("return document.body.dataset.method;"), page.$("error-box").getText());
                    record("engine=" + engine + " " + (f == k12 ? "K12 (66 edge variables)" : "6x6 grid (60 edge variables)")
                            + " analysed by structure: " + Math.round(Double.parseDouble(page.data("timing", "ms")))
                            + " ms in the task worker (including its start), " + wall + " ms from opening the file to the summary");
                }
                record("engine=" + engine + " optimiser, 6x6 grid (working set on the structural engine, "
                        + page.value("sum-bound") + " before): " + optimise(page));
            }
        } finally {
            Files.deleteIfExists(k12);
            Files.deleteIfExists(grid);
        }
    }

    private static String hostText(String request) {
        java.util.Map<?, ?> m = (java.util.Map<?, ?>) spanwright.io.Json.parse(spanwright.facade.JsonFacade.build(request));
        return spanwright.io.Json.write(m.get("scenario"));
    }

    /** The bounds and algorithm-run sheets on the default scenario: wall time of the engine call. */
    @Test
    void boundsAndSimulationInThePage() throws IOException {
        try (PageDriver page = new PageDriver(1280, 900)) {
            for (String engine : new String[] {"wasm", "js"}) {
                page.driver.get(PageDriver.pageUrl(null));
                page.js("localStorage.clear();");
                page.driver.get("about:blank");
                page.openFresh("?engine=" + engine);
                page.$("tab-bounds").click();
                page.waitFor("bounds computed", WAIT, () -> "ready".equals(page.js("return document.body.dataset.bounds;")));
                record("engine=" + engine + " bounds of the default scenario (6 variables): " + page.$("bounds-body").getAttribute("data-ms") + " ms"
                        + (page.$("bounds-fallback").isDisplayed() ? " (" + page.$("bounds-fallback").getText() + ")" : ""));
                page.driver.findElement(org.openqa.selenium.By.tagName("body")).sendKeys("1");
                page.$("tab-run").click();
                page.waitFor("simulated", WAIT, () -> "ready".equals(page.js("return document.body.dataset.simulation;")));
                record("engine=" + engine + " simulation of the default scenario (64 inputs, 6 edges): " + page.$("run-body").getAttribute("data-ms") + " ms");
            }
        }
    }

    private static String optimise(PageDriver page) {
        page.$("tab-weights").click();
        page.waitFor("optimiser available", WAIT, () -> page.$("opt-run").isEnabled());
        page.$("opt-run").click();
        page.waitFor("optimiser result", WAIT, () -> "result".equals(page.js("return document.body.dataset.optimiser;")));
        String out = page.$("opt-result").getAttribute("data-ms") + " ms, " + page.$("opt-status").getAttribute("data-iterations")
                + " iterations, status " + page.$("opt-status").getAttribute("data-status") + ", bound " + page.value("opt-after-bound")
                + " (engine " + page.$("opt-status").getAttribute("data-engine") + ")";
        page.$("opt-discard").click();
        page.$("tab-summary").click();
        return out;
    }

    @Test
    void aLargeAnalysisShowsProgressAndCanBeCancelled() throws IOException {
        // 2^20 inputs in the JavaScript engine take tens of seconds, so the job is still running
        // when Cancel is pressed (a 2^18 job could finish first on a fast machine).
        Path file = Files.createTempFile("ladder20c-", ".json");
        Files.writeString(file, ladder(10), StandardCharsets.UTF_8);
        try (PageDriver page = new PageDriver(1280, 900)) {
            page.openFresh("?engine=js");
            String before = page.$("sum-bound").getText();
            page.$("open-file").sendKeys(file.toString());
            page.waitFor("progress bar shown", WAIT, () -> page.$("progress-row").isDisplayed());
            // The page stays responsive while the worker runs: a script round trip is answered.
            long t0 = System.nanoTime();
            page.js("return 1;");
            record("page script round trip during a 2^20 analysis: " + (System.nanoTime() - t0) / 1_000_000 + " ms");
            page.$("cancel").click();
            page.waitFor("cancelled", WAIT, () -> "cancelled".equals(page.js("return document.body.dataset.analysis;")));
            assertEquals(before, page.$("sum-bound").getText(), "numbers of the last finished analysis are kept");
        } finally {
            Files.deleteIfExists(file);
        }
    }

    /**
     * 2^20 inputs (a ladder of 10 rungs, 20 variables) analysed to the end in the page's default
     * engine: progress is shown, the page answers scripts while the worker runs, and the finished
     * W+, W- and bound equal the JVM's JsonFacade.analyze for the same file (the source of the
     * expected numbers). Times are recorded in bench-browser.txt.
     */
    @Test
    void aMillionInputsFinishWithThePageResponsive() throws IOException {
        Path file = Files.createTempFile("ladder20-", ".json");
        String text = ladder(10);
        Files.writeString(file, text, StandardCharsets.UTF_8);
        java.util.Map<String, Object> expected = WorkbenchIT.jvmResult(text);
        try (PageDriver page = new PageDriver(1280, 900)) {
            page.openFresh("");
            int serial = page.serial();
            long t0 = System.nanoTime();
            page.$("open-file").sendKeys(file.toString());
            page.waitFor("progress bar shown", WAIT, () -> page.$("progress-row").isDisplayed());
            long worst = 0;
            for (int k = 0; k < 5 && "running".equals(page.js("return document.body.dataset.analysis;")); k++) {
                long r0 = System.nanoTime();
                page.js("return document.getElementById('progress-row') !== null;");
                worst = Math.max(worst, (System.nanoTime() - r0) / 1_000_000);
                try {
                    Thread.sleep(300);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
            page.waitForAnalysis(serial, Duration.ofSeconds(300));
            long wall = (System.nanoTime() - t0) / 1_000_000;
            assertEquals("ready", page.js("return document.body.dataset.analysis;"), page.$("error-box").getText());
            assertTrue(page.$("counts").getText().startsWith("1,048,576 inputs"), page.$("counts").getText());
            WorkbenchIT.assertClose(WorkbenchIT.side(expected, "positive", "maxResistance"), page.value("sum-wplus"), "W+");
            WorkbenchIT.assertClose(WorkbenchIT.side(expected, "negative", "maxCapacitance"), page.value("sum-wminus"), "W-");
            WorkbenchIT.assertClose(((Number) expected.get("complexity")).doubleValue(), page.value("sum-bound"), "bound");
            // Layout (no computed value): a 20-character input string fits its column, whole, left
            // of the f column, and the list does not scroll sideways.
            Object layout = page.js("var r = document.querySelector('#list .row:not([hidden])'), x = r.children[0], f = r.children[1], l = document.getElementById('list');"
                    + "return [x.textContent.length, x.scrollWidth <= x.clientWidth + 1, x.getBoundingClientRect().right <= f.getBoundingClientRect().left + 0.5, l.scrollWidth <= l.clientWidth + 1].join(' ');");
            assertEquals("20 true true true", layout, "input column of the list (length, whole, clear of f, no sideways scroll)");
            record("engine=" + page.data("engine-badge", "engine") + " 2^20 inputs (ladder of 10 rungs, 20 variables): "
                    + Math.round(Double.parseDouble(page.data("timing", "ms"))) + " ms in the worker, "
                    + Math.round(Double.parseDouble(page.data("timing", "rate"))) + " inputs/s, " + wall
                    + " ms from opening the file to the finished summary; slowest script round trip while running "
                    + worst + " ms");
        } finally {
            Files.deleteIfExists(file);
        }
    }

    /**
     * The simulation benchmark scenario of `simulate --bench` (seed 1: 10 variables, 24 vertices,
     * 60 edges, all 1024 inputs) simulated in the page's Run sheet in both engines; the figure goes
     * next to the JVM's in bench-browser.txt.
     */
    @Test
    void simulationBenchmarkInThePage() throws IOException {
        spanwright.model.Scenario sc = spanwright.model.RandomScenarios.generate(new java.util.Random(1), 10, 24, 60,
                0.0, 0.5, 0.5, 2.0);
        Path file = Files.createTempFile("simulate-bench-", ".json");
        Files.writeString(file, spanwright.io.ScenarioWriter.write(sc), StandardCharsets.UTF_8);
        try (PageDriver page = new PageDriver(1280, 900)) {
            for (String engine : new String[] {"wasm", "js"}) {
                page.driver.get(PageDriver.pageUrl(null));
                page.js("localStorage.clear();");
                page.driver.get("about:blank");
                page.openFresh("?engine=" + engine);
                int serial = page.serial();
                page.$("open-file").sendKeys(file.toString());
                page.waitForAnalysis(serial, WAIT);
                page.$("tab-run").click();
                page.waitFor("simulated", WAIT, () -> "ready".equals(page.js("return document.body.dataset.simulation;")));
                record("engine=" + engine + " simulation of the simulate --bench scenario (1024 inputs, 60 edges): "
                        + page.$("run-body").getAttribute("data-ms") + " ms");
            }
        } finally {
            Files.deleteIfExists(file);
        }
    }
}
