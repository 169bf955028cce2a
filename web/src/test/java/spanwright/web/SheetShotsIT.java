package spanwright.web;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.time.Duration;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.Keys;

/**
 * Screenshots (1280×720 viewport) of the result sheets and the "New from…" dialog, in normal and
 * presentation mode, written to target/screenshots for a person to look at. The checks here are
 * only that each view is showing (numbers are checked against the JVM in the other classes).
 */
class SheetShotsIT {
    private static final Duration WAIT = Duration.ofSeconds(120);
    private static PageDriver page;

    @BeforeAll
    static void start() throws IOException {
        page = new PageDriver(1280, 720);
        page.driver.get(PageDriver.pageUrl(null));
        page.js("localStorage.clear();");
        page.openFresh(null);
        int frames = ((Number) page.js("return window.outerHeight - window.innerHeight;")).intValue();
        page.driver.manage().window().setSize(new Dimension(1280, 720 + frames));
        assertEquals(720L, page.js("return window.innerHeight;"), "viewport height");
    }

    @AfterAll
    static void stop() {
        if (page != null) {
            page.close();
        }
    }

    private void key(String k) {
        page.driver.findElement(By.tagName("body")).sendKeys(k);
    }

    private void mode(String m) {
        if (!m.equals(page.js("return document.body.dataset.mode;"))) {
            key(m.equals("present") ? "m" : Keys.ESCAPE.toString());
        }
        page.waitFor("mode " + m, WAIT, () -> m.equals(page.js("return document.body.dataset.mode;")));
        page.js("return new Promise(function (r) { setTimeout(r, 300); });");
    }

    @Test
    void weightsSheet() throws IOException {
        mode("edit");
        key("1");
        key("w");
        page.waitFor("optimiser available", WAIT, () -> page.$("opt-run").isEnabled());
        page.$("opt-run").click();
        page.waitFor("optimiser result", WAIT, () -> "result".equals(page.js("return document.body.dataset.optimiser;")));
        page.screenshot("weights-normal-1280x720");
        mode("present");
        assertTrue(page.$("opt-compare").isDisplayed());
        page.screenshot("weights-present-1280x720");
        mode("edit");
        page.$("opt-discard").click();
        key("s");
    }

    @Test
    void boundsSheet() throws IOException {
        mode("edit");
        key("b");
        page.waitFor("bounds computed", WAIT, () -> "ready".equals(page.js("return document.body.dataset.bounds;")));
        page.screenshot("bounds-normal-1280x720");
        mode("present");
        page.screenshot("bounds-present-1280x720");
        mode("edit");
        key("s");
    }

    @Test
    void runSheet() throws IOException {
        mode("edit");
        key("1");
        page.waitFor("focus drawn", WAIT, () -> page.js("return document.body.dataset.focusDrawn;") != null);
        key("r");
        page.waitFor("simulated", WAIT, () -> "ready".equals(page.js("return document.body.dataset.simulation;")));
        page.screenshot("run-normal-1280x720");
        mode("present");
        key("0");
        page.waitFor("simulated again", WAIT, () -> "ready".equals(page.js("return document.body.dataset.simulation;"))
                && String.valueOf(page.js("return window.Spanwright.focus();")).equals(page.$("run-focus").getAttribute("data-x")));
        page.js("return new Promise(function (r) { setTimeout(r, 300); });");
        page.screenshot("run-present-1280x720");
        mode("edit");
        key("s");
    }

    @Test
    void builderDialog() throws IOException {
        mode("edit");
        key("n");
        page.waitFor("dialog open", WAIT, () -> page.$("builder").isDisplayed());
        page.waitFor("preview", WAIT, () -> "ready".equals(page.js("return document.getElementById('builder').dataset.previewFigures;")));
        page.screenshot("builder-formula-1280x720");
        page.driver.findElement(By.cssSelector("input[name=bkind][value=tree]")).click();
        page.waitFor("tree preview", WAIT, () -> String.valueOf(page.js("return document.getElementById('builder').dataset.request;")).contains("\"tree\"")
                && "ready".equals(page.js("return document.getElementById('builder').dataset.previewFigures;")));
        page.screenshot("builder-tree-1280x720");
        page.$("b-function").sendKeys(Keys.chord(Keys.CONTROL, "a"), "a & (b | ");
        page.waitFor("error shown", WAIT, () -> page.$("builder-error").isDisplayed());
        page.screenshot("builder-error-1280x720");
        page.$("builder-close").click();
    }

    @Test
    void summaryInPresentationMode() throws IOException {
        mode("present");
        key("s");
        key("0");
        page.waitFor("focus drawn", WAIT, () -> page.js("return document.body.dataset.focusDrawn;") != null);
        page.js("return new Promise(function (r) { setTimeout(r, 300); });");
        page.screenshot("summary-present-worst-negative-1280x720");
        key("1");
        page.js("return new Promise(function (r) { setTimeout(r, 500); });");
        page.screenshot("summary-present-worst-positive-1280x720");
        mode("edit");
    }
}
