package spanwright.web;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.Map;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.Select;
import spanwright.io.Json;
import spanwright.facade.JsonFacade;

/**
 * The "New from…" dialog in real Chromium from file://. Expected values come from the JVM:
 * {@link JsonFacade#build} with the very request the page sent (the same façade the command-line
 * {@code build} command uses) and {@link JsonFacade#analyze} of the built scenario.
 */
class BuilderIT extends PageTestBase {
    private static final Duration WAIT = Duration.ofSeconds(60);

    @BeforeEach
    void clean() {
        openClean();
    }

    private String dialog(String key) {
        return (String) page.js("return document.getElementById('builder').dataset[arguments[0]] || '';", key);
    }

    private void openDialog() {
        page.$("new-from").click();
        page.waitFor("dialog open", WAIT, () -> page.$("builder").isDisplayed());
    }

    private void chooseKind(String kind) {
        By radio = By.cssSelector("input[name=bkind][value=" + kind + "]");
        page.driver.findElement(radio).click();
        // the kind's fields are shown by the page's change handler; on a loaded machine that can
        // lag behind the click, so wait for the dialog to say it switched
        page.waitFor("builder kind " + kind, WAIT, () -> {
            if (!page.driver.findElement(radio).isSelected()) {
                page.driver.findElement(radio).click();
            }
            return kind.equals(page.$("builder").getAttribute("data-kind"));
        });
    }

    /** Types into a field and waits until a request holding {@code fragment} has been previewed. */
    private void type(String id, String text, String fragment) {
        WebElement f = page.$(id);
        page.waitFor(id + " shown", WAIT, () -> f.isDisplayed() && f.isEnabled());
        f.sendKeys(Keys.chord(Keys.CONTROL, "a"), text);
        page.waitFor("preview of a request with " + fragment, WAIT,
                () -> dialog("request").contains(fragment) && !"running".equals(dialog("preview")));
    }

    private void waitPreview() {
        page.waitFor("preview finished", WAIT, () -> {
            String p = dialog("preview");
            return "built".equals(p) || "error".equals(p);
        });
    }

    @SuppressWarnings("unchecked")
    private Map<String, Object> jvmBuild(String request) {
        Map<String, Object> answer = (Map<String, Object>) Json.parse(JsonFacade.build(request));
        assertEquals(Boolean.TRUE, answer.get("ok"), () -> "JVM build failed: " + answer);
        return answer;
    }

    @SuppressWarnings("unchecked")
    private void assertStatsShown(Map<String, Object> jvm) {
        Map<String, Object> stats = (Map<String, Object>) jvm.get("stats");
        for (String key : new String[] {"vertices", "edges", "variables"}) {
            WebElement v = page.driver.findElement(By.cssSelector("#builder-stats [data-stat='" + key + "']"));
            assertEquals(((Number) stats.get(key)).longValue(), Long.parseLong(v.getText().replace(",", "")), key);
        }
    }

    @Test
    @SuppressWarnings("unchecked")
    void aFormulaPreviewsAndOpensAsAnUndoableDocument() {
        String work = (String) page.js("return window.Spanwright.scenarioText();");
        openDialog();
        chooseKind("formula");
        type("b-expression", "(a | b) & (c | d | e)", "(c | d | e)");
        waitPreview();
        assertEquals("built", dialog("preview"), page.$("builder-error").getText());
        String request = dialog("request");
        Map<String, Object> jvm = jvmBuild(request);
        assertStatsShown(jvm);
        // Preview numbers. Source: JsonFacade.analyze on the JVM of the JVM-built scenario.
        page.waitFor("preview figures", WAIT, () -> "ready".equals(dialog("previewFigures")));
        String builtText = Json.write(jvm.get("scenario"));
        Map<String, Object> expected = WorkbenchIT.jvmResult(builtText);
        WorkbenchIT.assertClose(((Number) expected.get("complexity")).doubleValue(), page.value("builder-bound"), "preview bound");
        WorkbenchIT.assertClose(WorkbenchIT.side(expected, "positive", "maxResistance"), page.value("builder-wplus"), "preview W+");
        WorkbenchIT.assertClose(WorkbenchIT.side(expected, "negative", "maxCapacitance"), page.value("builder-wminus"), "preview W-");
        assertEquals(work, page.js("return window.Spanwright.scenarioText();"), "the preview changes nothing");

        int serial = page.serial();
        page.$("builder-create").click();
        page.waitForAnalysis(serial, WAIT);
        assertFalse(page.$("builder").isDisplayed(), "dialog closed");
        String opened = (String) page.js("return window.Spanwright.scenarioText();");
        assertEquals(Json.parse(builtText), Json.parse(opened), "the page opened the engine's scenario");
        WorkbenchIT.assertClose(((Number) expected.get("complexity")).doubleValue(), page.value("sum-bound"), "summary bound");

        serial = page.serial();
        page.driver.findElement(By.tagName("body")).sendKeys(Keys.chord(Keys.CONTROL, "z"));
        page.waitForAnalysis(serial, WAIT);
        assertEquals(work, page.js("return window.Spanwright.scenarioText();"), "undo brings the previous work back");
    }

    @Test
    void aBadFormulaNamesTheFieldAndKeepsTheWork() {
        String work = (String) page.js("return window.Spanwright.scenarioText();");
        openDialog();
        chooseKind("formula");
        type("b-expression", "a & (b | ", "\"a & (b | \"");
        waitPreview();
        assertEquals("error", dialog("preview"));
        String message = page.$("builder-error").getText();
        assertTrue(message.contains("formula field") && message.contains("$.expression"), message);
        assertFalse(page.$("builder-create").isEnabled(), "nothing to open");
        assertEquals("true", page.$("b-expression").getAttribute("aria-invalid"));
        // Source: JsonFacade.build on the JVM gives the same refusal.
        @SuppressWarnings("unchecked")
        Map<String, Object> jvm = (Map<String, Object>) Json.parse(JsonFacade.build(dialog("request")));
        assertEquals(Boolean.FALSE, jvm.get("ok"));
        @SuppressWarnings("unchecked")
        String jvmMessage = String.valueOf(((Map<String, Object>) jvm.get("error")).get("message"));
        assertTrue(message.contains(jvmMessage), message + " / " + jvmMessage);
        page.$("builder-close").click();
        assertEquals(work, page.js("return window.Spanwright.scenarioText();"));
    }

    @Test
    void aHostGridATreeAndADiagramPreviewTheEnginesSizes() {
        openDialog();
        chooseKind("host");
        new Select(page.$("b-family")).selectByValue("grid");
        type("b-size1", "2", "[2,");
        type("b-size2", "4", "[2,4]");
        waitPreview();
        assertEquals("built", dialog("preview"), page.$("builder-error").getText());
        assertStatsShown(jvmBuild(dialog("request")));

        chooseKind("tree");
        type("b-function", "parity(a, b, c, d)", "parity(a, b, c, d)");
        waitPreview();
        assertEquals("built", dialog("preview"), page.$("builder-error").getText());
        assertStatsShown(jvmBuild(dialog("request")));
        String tree = page.driver.findElement(By.cssSelector("#builder-stats [data-stat='vertices']")).getText();

        String before = dialog("request");
        page.$("b-diagram").click();
        page.waitFor("diagram preview", WAIT, () -> !before.equals(dialog("request")) && "built".equals(dialog("preview")));
        assertStatsShown(jvmBuild(dialog("request")));
        String diagram = page.driver.findElement(By.cssSelector("#builder-stats [data-stat='vertices']")).getText();
        assertTrue(Integer.parseInt(diagram) < Integer.parseInt(tree), "the diagram is smaller: " + diagram + " < " + tree);

        chooseKind("host");
        type("b-size1", "1", "[1,4]");
        waitPreview();
        assertEquals("error", dialog("preview"));
        assertTrue(page.$("builder-error").getText().contains("$.size"), page.$("builder-error").getText());
    }

    /**
     * The dialog's default composition (the current scenario as the outer one, the first built-in
     * gadget as the inner one) builds, previews and analyses: 6 × 2 = 12 variables. Source of the
     * expected numbers: JsonFacade.build with the very request the page sent, and JsonFacade.analyze
     * of the JVM-built scenario. Every other built-in gadget builds the JVM's sizes too.
     */
    @Test
    @SuppressWarnings("unchecked")
    void theDefaultCompositionBuildsAndAnalyses() {
        openDialog();
        chooseKind("compose");
        page.waitFor("composition previewed", WAIT, () -> dialog("request").contains("\"compose\"") && !"running".equals(dialog("preview")));
        waitPreview();
        assertEquals("built", dialog("preview"), page.$("builder-error").getText());
        String request = dialog("request");
        assertTrue(request.contains("\"inner\":\"either-of-2\""), request);
        Map<String, Object> jvm = jvmBuild(request);
        assertStatsShown(jvm);
        assertEquals(12L, ((Number) ((Map<String, Object>) jvm.get("stats")).get("variables")).longValue());
        page.waitFor("preview figures", WAIT, () -> "ready".equals(dialog("previewFigures")));
        String builtText = Json.write(jvm.get("scenario"));
        Map<String, Object> expected = WorkbenchIT.jvmResult(builtText);
        WorkbenchIT.assertClose(((Number) expected.get("complexity")).doubleValue(), page.value("builder-bound"), "preview bound");
        WorkbenchIT.assertClose(WorkbenchIT.side(expected, "positive", "maxResistance"), page.value("builder-wplus"), "preview W+");
        WorkbenchIT.assertClose(WorkbenchIT.side(expected, "negative", "maxCapacitance"), page.value("builder-wminus"), "preview W-");

        for (String gadget : new String[] {"both-of-2", "two-of-3"}) {
            new Select(page.$("b-inner")).selectByValue("gadget:" + gadget);
            page.waitFor("preview of " + gadget, WAIT, () -> dialog("request").contains("\"" + gadget + "\"") && !"running".equals(dialog("preview")));
            waitPreview();
            assertEquals("built", dialog("preview"), page.$("builder-error").getText());
            assertStatsShown(jvmBuild(dialog("request")));
        }
        new Select(page.$("b-inner")).selectByValue("gadget:either-of-2");
        page.waitFor("preview of the default again", WAIT, () -> dialog("request").contains("either-of-2") && "built".equals(dialog("preview")));

        // Opened, the main analysis gives the JVM's numbers.
        int serial = page.serial();
        page.$("builder-create").click();
        page.waitForAnalysis(serial, WAIT);
        assertEquals(Json.parse(builtText), Json.parse((String) page.js("return window.Spanwright.scenarioText();")));
        assertEquals("yes", page.$("verdict").getAttribute("data-correct"));
        WorkbenchIT.assertClose(((Number) expected.get("complexity")).doubleValue(), page.value("sum-bound"), "summary bound");
    }

}
