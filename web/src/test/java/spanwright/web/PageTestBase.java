package spanwright.web;

import java.io.IOException;
import java.time.Duration;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;

/**
 * One headless Chromium per test class (1280×900, fresh profile), opened on the built page from
 * file://. Test classes run one after another, so the shared field is never used by two at once.
 */
abstract class PageTestBase {
    static final Duration LONG_WAIT = Duration.ofSeconds(120);
    static PageDriver page;

    @BeforeAll
    static void startBrowser() throws IOException {
        page = new PageDriver(1280, 900);
    }

    @AfterAll
    static void stopBrowser() {
        if (page != null) {
            page.close();
            page = null;
        }
    }

    /** The page with empty storage and the default scenario analysed. */
    static void openClean() {
        page.driver.get(PageDriver.pageUrl(null));
        page.js("localStorage.clear();");
        page.openFresh(null);
    }

    static String scenarioText() {
        return (String) page.js("return window.Spanwright.scenarioText();");
    }
}
