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
 * In-browser benchmark (prints, never asserts a time): first render of the default scenario,
 * inputs per second for a 2^16-input scenario in the JavaScript and WebAssembly-GC engines, the
 * optimiser, the structural engine, bounds and simulation in the page. Figures are appended to
 * target/bench-browser.txt. Not part of {@code mvn verify} (failsafe excludes it; the numbers it
 * reads are checked by the other browser tests): run it with {@code mvn -B verify -pl web -am
 * -Dtest=NONE -Dsurefire.failIfNoSpecifiedTests=false -Dit.test=BenchIT}. The 2^20-input progress,
 * Cancel and responsiveness checks are in {@link LargeAnalysisIT}.
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

    static void record(String line) throws IOException {
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
