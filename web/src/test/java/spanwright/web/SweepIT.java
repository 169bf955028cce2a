package spanwright.web;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.WebElement;
import spanwright.io.Json;
import spanwright.facade.JsonFacade;

/**
 * The "Sweep" sheet in real Chromium from file://: the OR family over n = 2..6, run size by size
 * in the page's task worker, against the JVM's {@link JsonFacade#sweep} for the same request (the
 * façade behind the command-line {@code sweep --json}); and a restart of the same sweep keeps the
 * finished sizes from localStorage instead of computing them again.
 */
class SweepIT extends PageTestBase {
    private static final Duration WAIT = Duration.ofSeconds(180);
    /** The optimiser and the ADV± solver iterate on doubles; the JVM's and the browser's
     *  elementary functions may differ in the last bit, so values agree to 1e-8 relative (common
     *  practice, no source); counts and statuses must agree exactly. */
    private static final double TOL = 1e-8;

    private static void runSweep() {
        page.$("sweep-run").click();
        page.waitFor("sweep finished", WAIT, () -> {
            Object s = page.js("return document.body.dataset.sweep;");
            return "ready".equals(s) || "error".equals(s);
        });
        assertEquals("ready", page.js("return document.body.dataset.sweep;"),
                () -> "sweep error: " + page.$("sweep-error").getText());
    }

    @Test
    @SuppressWarnings("unchecked")
    void orSweepMatchesTheJvmAndARestartKeepsFinishedSizes() throws Exception {
        openClean();
        page.$("tab-sweep").click();
        page.waitFor("sweep sheet built", WAIT, () -> "yes".equals(page.js("return document.body.dataset.sweepReady;")));
        page.js("const s = document.getElementById('sweep-family'); s.value = 'or'; s.dispatchEvent(new Event('change'));"
                + "document.getElementById('sweep-from').value = '2'; document.getElementById('sweep-to').value = '6';");
        runSweep();
        assertEquals("2,3,4,5,6", page.data("sweep-body", "computed"));
        assertEquals("", page.data("sweep-body", "kept"));

        // Source: JsonFacade.sweep on the JVM, the same family, sizes and (default) options.
        Map<String, Object> jvm = (Map<String, Object>) Json.parse(JsonFacade.sweep(
                "{\"family\":{\"family\":\"or\"},\"sizes\":\"2..6\",\"options\":{},\"fitFrom\":0,\"fitLast\":0}"));
        assertEquals(Boolean.TRUE, jvm.get("ok"), () -> "JVM sweep failed: " + jvm);
        Map<String, Object> result = (Map<String, Object>) jvm.get("result");
        List<Object> rows = (List<Object>) result.get("rows");
        List<WebElement> trs = page.driver.findElements(By.cssSelector("#sweep-table tbody tr"));
        assertEquals(rows.size(), trs.size(), "rows");
        for (int i = 0; i < rows.size(); i++) {
            Map<String, Object> r = (Map<String, Object>) rows.get(i);
            WebElement tr = trs.get(i);
            assertEquals(((Number) r.get("size")).intValue(), Integer.parseInt(tr.getAttribute("data-size")), "size of row " + i);
            double e = ((Number) r.get("complexity")).doubleValue();
            assertEquals(e, Double.parseDouble(tr.getAttribute("data-complexity")), TOL * e, "sqrt(W+W-) at n = " + r.get("size"));
        }
        Map<String, Object> fit = (Map<String, Object>) ((Map<String, Object>) ((Map<String, Object>) result.get("fits")).get("series")).get("complexity");
        WebElement li = page.driver.findElement(By.cssSelector("#sweep-fits li[data-series=complexity]"));
        double exp = ((Number) fit.get("exponent")).doubleValue();
        assertEquals(exp, Double.parseDouble(li.getAttribute("data-exponent")), 1e-8, "fitted exponent of sqrt(W+W-)");
        assertEquals(0.5, exp, 0.02, "ADV(OR_n) = sqrt(n), so the exponent is 1/2");
        assertTrue(page.$("sweep-caution").getText().contains("not a proof"), "caution shown");
        assertEquals(3, ((Number) page.js("return document.querySelectorAll('#sweep-plot g[data-series]').length;")).intValue(),
                "plot has sqrt(W+W-), ADV± and D");
        String svg = (String) page.js("return new XMLSerializer().serializeToString(document.getElementById('sweep-plot'));");
        assertTrue(svg.startsWith("<svg") && svg.contains("exponent"), "the plot serialises as SVG");

        long chrome = ((Number) page.js("return window.outerHeight - window.innerHeight;")).longValue();
        page.driver.manage().window().setSize(new Dimension(1280, 720 + (int) chrome));
        page.js("document.getElementById('sweep-plot').scrollIntoView();");
        Path shot = page.screenshot("sweep-1280x720");
        assertTrue(Files.size(shot) > 0);

        // Restart: a reload, the same sweep; the finished sizes come from localStorage.
        page.driver.navigate().refresh();
        page.waitFor("sweep sheet built", WAIT, () -> "yes".equals(page.js("return document.body.dataset.sweepReady;")));
        page.js("document.getElementById('tab-sweep').click();"
                + "const s = document.getElementById('sweep-family'); s.value = 'or';"
                + "document.getElementById('sweep-from').value = '2'; document.getElementById('sweep-to').value = '7';");
        runSweep();
        assertEquals("7", page.data("sweep-body", "computed"), "only the new size is computed");
        assertEquals("2,3,4,5,6", page.data("sweep-body", "kept"), "finished sizes are kept");
        assertFalse(page.$("sweep-status").getText().isEmpty());
    }

    @Test
    void cancelKeepsFinishedSizesForTheNextRun() throws Exception {
        openClean();
        page.$("tab-sweep").click();
        page.waitFor("sweep sheet built", WAIT, () -> "yes".equals(page.js("return document.body.dataset.sweepReady;")));
        page.js("const s = document.getElementById('sweep-family'); s.value = 'parity'; s.dispatchEvent(new Event('change'));"
                + "document.getElementById('sweep-from').value = '2'; document.getElementById('sweep-to').value = '24';");
        page.$("sweep-run").click();
        String kept = "const v = JSON.parse(localStorage.getItem('spanwright.sweep.v1:' + JSON.stringify([{family: 'parity'}, {}])) || '{}');"
                + "return Object.keys(v.rows || {}).length;";
        page.waitFor("two sizes finished", WAIT, () -> ((Number) page.js(kept)).intValue() >= 2);
        assertEquals("running", page.js("return document.body.dataset.sweep;"), "still running when cancelled");
        page.js("document.getElementById('sweep-cancel').scrollIntoView({block: 'center'});");
        page.screenshot("sweep-running");
        page.$("sweep-cancel").click();
        assertEquals("cancelled", page.js("return document.body.dataset.sweep;"));
        assertFalse(page.$("sweep-progress").isDisplayed(), "progress hidden after cancel");
        // The same sweep over the finished sizes only: nothing is computed again.
        page.js("document.getElementById('sweep-to').value = '3';");
        runSweep();
        assertEquals("", page.data("sweep-body", "computed"));
        assertEquals("2,3", page.data("sweep-body", "kept"));
    }

    @Test
    @SuppressWarnings("unchecked")
    void familyOptionsReachTheEngine() {
        openClean();
        page.$("tab-sweep").click();
        page.waitFor("sweep sheet built", WAIT, () -> "yes".equals(page.js("return document.body.dataset.sweepReady;")));
        page.js("const s = document.getElementById('sweep-family'); s.value = 'threshold'; s.dispatchEvent(new Event('change'));"
                + "document.getElementById('sweep-from').value = '2'; document.getElementById('sweep-to').value = '4';"
                + "document.getElementById('sweep-family-options').value = '{\"k\": oops}';");
        page.$("sweep-run").click();
        assertEquals("error", page.js("return document.body.dataset.sweep;"), "bad JSON is refused before the engine");
        assertTrue(page.$("sweep-error").getText().contains("not JSON"));
        page.js("document.getElementById('sweep-family-options').value = '{\"k\": \"n / 2\"}';");
        runSweep();
        // Source: JsonFacade.sweep on the JVM with the same family spec.
        Map<String, Object> jvm = (Map<String, Object>) Json.parse(JsonFacade.sweep(
                "{\"family\":{\"family\":\"threshold\",\"k\":\"n / 2\"},\"sizes\":\"2..4\",\"options\":{}}"));
        assertEquals(Boolean.TRUE, jvm.get("ok"), () -> "JVM sweep failed: " + jvm);
        List<Object> rows = (List<Object>) ((Map<String, Object>) jvm.get("result")).get("rows");
        List<WebElement> trs = page.driver.findElements(By.cssSelector("#sweep-table tbody tr"));
        assertEquals(rows.size(), trs.size(), "rows");
        for (int i = 0; i < rows.size(); i++) {
            Object c = ((Map<String, Object>) rows.get(i)).get("complexity");
            String shown = trs.get(i).getAttribute("data-complexity");
            if (!(c instanceof Number)) {
                assertEquals("", shown, "no complexity in row " + i);
                continue;
            }
            double e = ((Number) c).doubleValue();
            assertEquals(e, Double.parseDouble(shown), TOL * e, "sqrt(W+W-) of thr(n/2, n) in row " + i);
        }
    }
}
