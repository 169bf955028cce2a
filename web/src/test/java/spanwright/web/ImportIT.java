package spanwright.web;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.time.Duration;
import java.util.LinkedHashMap;
import java.util.Map;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.support.ui.Select;
import spanwright.facade.JsonFacade;
import spanwright.io.Json;

/**
 * Graph files opened in the page (Open… with GraphML or DOT), in real headless Chromium from
 * file://. The page reads them with the engine's own readers compiled by TeaVM; the expected
 * witness sizes come from the JVM: {@link JsonFacade#analyze} on the equivalent JSON scenario (the
 * fixture bridge.json, typed by hand: W+ = 5, W- = 3, derived in HostGraphImportTest), and on
 * {@link JsonFacade#importGraph}'s scenario for the same file and choices. A malformed file is
 * reported with its line and column and leaves the work alone; an import is one undo step.
 */
class ImportIT extends PageTestBase {
    private static final Duration WAIT = Duration.ofSeconds(60);

    @BeforeEach
    void clean() {
        openClean();
    }

    private static String fixture(String name) throws IOException {
        Path p = Paths.get(System.getProperty("spanwright.graphs", "../core/src/test/resources/graphs")).resolve(name);
        return Files.readString(p, StandardCharsets.UTF_8);
    }

    /** Writes {@code text} to a temporary file with the given ending and picks it with Open…. */
    private static Path pick(String text, String ending) throws IOException {
        Path file = Files.createTempFile("import-", ending);
        Files.writeString(file, text, StandardCharsets.UTF_8);
        page.$("open-file").sendKeys(file.toString());
        return file;
    }

    private static boolean dialogOpen() {
        return Boolean.TRUE.equals(page.js("return document.getElementById('import-dialog').open;"));
    }

    private static String shownTitle() {
        return page.$("title").getAttribute("value");
    }

    /** Opens a graph file through the dialog with its defaults (or the given s and t) and waits for its analysis. */
    private static void importWithDialog(String text, String ending, String s, String t) throws IOException {
        Path file = pick(text, ending);
        page.waitFor("the import dialog", WAIT, ImportIT::dialogOpen);
        if (s != null) {
            new Select(page.$("import-s")).selectByValue(s);
        }
        if (t != null) {
            new Select(page.$("import-t")).selectByValue(t);
        }
        int serial = page.serial();
        page.$("import-open").click();
        page.waitFor("import opened", WAIT, () -> "opened".equals(page.js("return document.body.dataset.importStatus;")));
        page.waitForAnalysis(serial, WAIT);
        assertFalse(dialogOpen(), "the dialog closes");
        Files.deleteIfExists(file);
    }

    @SuppressWarnings("unchecked")
    private static String jvmImport(String text, Map<String, Object> options) {
        Map<String, Object> r = (Map<String, Object>) Json.parse(JsonFacade.importGraph(text, Json.write(options)));
        assertEquals(Boolean.TRUE, r.get("ok"), () -> "JVM import failed: " + r);
        return Json.write(r.get("scenario"));
    }

    private static void assertWitnessSizes(Map<String, Object> expected, String where) {
        WorkbenchIT.assertClose(WorkbenchIT.side(expected, "positive", "maxResistance"), page.value("sum-wplus"), "W+ " + where);
        WorkbenchIT.assertClose(WorkbenchIT.side(expected, "negative", "maxCapacitance"), page.value("sum-wminus"), "W- " + where);
    }

    @Test
    void networkxGraphMLAndGraphvizDotOpenWithTheJvmsWitnessSizes() throws IOException {
        // the equivalent JSON scenario, analysed on the JVM (derived: W+ = 5, W- = 3)
        Map<String, Object> typed = WorkbenchIT.jvmResult(fixture("bridge.json"));
        assertEquals(5, WorkbenchIT.side(typed, "positive", "maxResistance"), 1e-12);
        assertEquals(3, WorkbenchIT.side(typed, "negative", "maxCapacitance"), 1e-12);
        for (String engine : new String[] {"js", "wasm"}) {
            page.js("localStorage.clear();");
            page.openFresh("?engine=" + engine);
            assertEquals(engine, page.data("engine-badge", "engine"), "engine running");
            openBridges(typed, engine);
        }
    }

    /** Opens the bridge as networkx GraphML and as Graphviz DOT, then undoes both imports. */
    private static void openBridges(Map<String, Object> typed, String engine) throws IOException {
        String before = scenarioText();
        String beforeTitle = shownTitle();
        String[][] files = {{"bridge-networkx.graphml", ".graphml"}, {"bridge-graphviz.dot", ".dot"}};
        for (String[] f0 : files) {
            String[] f = {f0[0] + " (" + engine + " engine)", f0[1]};
            String text = fixture(f0[0]);
            Path file = pick(text, f[1]);
            page.waitFor("the import dialog for " + f[0], WAIT, ImportIT::dialogOpen);
            // no role marks in these files: s and t default to the first and the last vertex
            assertEquals("s", new Select(page.$("import-s")).getFirstSelectedOption().getAttribute("value"), f[0]);
            assertEquals("t", new Select(page.$("import-t")).getFirstSelectedOption().getAttribute("value"), f[0]);
            assertEquals("weight", new Select(page.$("import-weight")).getFirstSelectedOption().getAttribute("value"), f[0]);
            int serial = page.serial();
            page.$("import-open").click();
            page.waitFor("import opened", WAIT, () -> "opened".equals(page.js("return document.body.dataset.importStatus;")));
            page.waitForAnalysis(serial, WAIT);
            Files.deleteIfExists(file);
            assertWitnessSizes(typed, f[0] + " against bridge.json");
            Map<String, Object> opts = new LinkedHashMap<>();
            opts.put("fileName", f0[0]);
            opts.put("s", "s");
            opts.put("t", "t");
            opts.put("weightKey", "weight");
            String jvm = jvmImport(text, opts);
            assertWitnessSizes(WorkbenchIT.jvmResult(jvm), f[0] + " against the JVM's import");
            // the page's scenario is the JVM's, field for field
            assertEquals(Json.parse(jvm), Json.parse(scenarioText()), f[0]);
        }
        // each import was one undo step: two undos bring back the work as it was
        for (int i = 0; i < files.length; i++) {
            page.driver.findElement(By.tagName("body")).sendKeys(Keys.chord(Keys.CONTROL, "z"));
        }
        page.waitFor("undone to the start", WAIT, () -> beforeTitle.equals(shownTitle()));
        assertEquals(Json.parse(before), Json.parse(scenarioText()));
    }

    @Test
    void theFileMarksOfADotFileAreTheDefaultsAndOtherEndsCanBeChosen() throws IOException {
        String text = fixture("harbour-features.dot");
        Path file = pick(text, ".gv");
        page.waitFor("the import dialog", WAIT, ImportIT::dialogOpen);
        assertEquals("quay & slip", new Select(page.$("import-s")).getFirstSelectedOption().getAttribute("value"));
        assertEquals("far shore", new Select(page.$("import-t")).getFirstSelectedOption().getAttribute("value"));
        page.screenshot("import-dialog");
        page.$("import-cancel").click();
        page.waitFor("cancelled", WAIT, () -> "cancelled".equals(page.js("return document.body.dataset.importStatus;")));
        Files.deleteIfExists(file);

        importWithDialog(text, ".dot", "isle", "buoy");
        Map<String, Object> opts = new LinkedHashMap<>();
        opts.put("fileName", "harbour-features.dot");
        opts.put("s", "isle");
        opts.put("t", "buoy");
        opts.put("weightKey", "weight");
        String jvm = jvmImport(text, opts);
        assertWitnessSizes(WorkbenchIT.jvmResult(jvm), "harbour, s = isle, t = buoy");
        assertEquals(Json.parse(jvm), Json.parse(scenarioText()));
    }

    @Test
    void aMalformedFileIsReportedWithItsPlaceAndTheWorkStays() throws IOException {
        String before = scenarioText();
        Path file = pick("graph harbour {\n  quay -- isle;\n  isle -- ;\n}\n", ".dot");
        page.waitFor("message shown", WAIT, () -> page.$("notice").isDisplayed()
                && "refused".equals(page.js("return document.body.dataset.importStatus;")));
        String message = page.$("notice-text").getText();
        assertTrue(message.contains(file.getFileName().toString()) && message.contains("line 3, column 11")
                && message.contains("unchanged"), message);
        assertFalse(dialogOpen());
        assertEquals(before, scenarioText());
        Files.deleteIfExists(file);

        file = pick("<graphml><graph><node id=\"a\"/><node id=\"b\">\n</graph></graphml>", ".graphml");
        page.waitFor("GraphML message shown", WAIT, () -> page.$("notice-text").getText().contains("line 2, column 1"));
        assertTrue(page.$("notice-text").getText().contains("</node>"), page.$("notice-text").getText());
        assertEquals(before, scenarioText());
        Files.deleteIfExists(file);

        // a choice the builder refuses is shown in the dialog, which stays open; the work stays too
        file = pick(fixture("bridge-networkx.graphml"), ".xml");
        page.waitFor("the import dialog", WAIT, ImportIT::dialogOpen);
        new Select(page.$("import-t")).selectByValue("s");
        page.$("import-open").click();
        page.waitFor("error in the dialog", WAIT, () -> page.$("import-error").isDisplayed());
        assertTrue(page.$("import-error").getText().contains("same vertex"), page.$("import-error").getText());
        assertTrue(dialogOpen());
        assertEquals(before, scenarioText());
        page.$("import-cancel").click();
        page.waitFor("dialog closed", WAIT, () -> !dialogOpen());
        assertEquals(before, scenarioText());
        Files.deleteIfExists(file);
    }
}
