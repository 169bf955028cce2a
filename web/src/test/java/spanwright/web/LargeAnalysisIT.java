package spanwright.web;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import org.junit.jupiter.api.Test;

/**
 * A 2^20-input enumeration in the page (a ladder of 10 rungs, {@link BenchIT#ladder}): progress is
 * shown, Cancel keeps the last finished numbers, the page answers scripts while the worker runs, and
 * the finished numbers equal the JVM's. Times seen on the way go to target/bench-browser.txt, never
 * asserted.
 */
class LargeAnalysisIT {
    private static final Duration WAIT = Duration.ofSeconds(180);

    private static String ladder(int rungs) {
        return BenchIT.ladder(rungs);
    }

    private static void record(String line) throws IOException {
        BenchIT.record(line);
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
}
