package spanwright.web;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.time.Duration;
import java.util.List;
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
 * The built page in real headless Chromium, opened from file://. Expected numbers come from the
 * JVM: {@link JsonFacade#analyze} on the same scenario text — the same façade the command-line
 * tool's {@code analyze --json} prints — so page and CLI are checked to agree ("independent
 * computation": the same Java code on the JVM versus its TeaVM translations in the browser).
 */
class WorkbenchIT extends PageTestBase {
    private static final Duration WAIT = Duration.ofSeconds(60);
    /** JVM doubles versus TeaVM JavaScript/wasm doubles: same IEEE operations, printed and re-read;
     *  1e-12 relative allows only for last-digit printing differences (common practice, no source). */
    private static final double TOL = 1e-12;

    @BeforeEach
    void clean() {
        page.driver.get(PageDriver.pageUrl(null));
        page.js("localStorage.clear();");
    }

    static String scenarioFile(String name) throws IOException {
        Path p = Paths.get(System.getProperty("spanwright.scenarios", "../scenarios")).resolve(name);
        return Files.readString(p, StandardCharsets.UTF_8);
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> jvmResult(String scenarioText) {
        Map<String, Object> answer = (Map<String, Object>) Json.parse(JsonFacade.analyze(scenarioText, false));
        assertEquals(Boolean.TRUE, answer.get("ok"), () -> "JVM analysis failed: " + answer);
        return (Map<String, Object>) answer.get("result");
    }

    @SuppressWarnings("unchecked")
    static double side(Map<String, Object> result, String side, String key) {
        Map<String, Object> m = (Map<String, Object>) result.get(side);
        return ((Number) m.get(key)).doubleValue();
    }

    @SuppressWarnings("unchecked")
    static String worst(Map<String, Object> result, String side) {
        return (String) ((Map<String, Object>) result.get(side)).get("worst");
    }

    static void assertClose(double expected, double actual, String what) {
        assertEquals(expected, actual, TOL * Math.max(1, Math.abs(expected)), what);
    }

    private void assertPageMatches(Map<String, Object> expected, String where) {
        assertClose(side(expected, "positive", "maxResistance"), page.value("sum-wplus"), "W+ " + where);
        assertClose(side(expected, "negative", "maxCapacitance"), page.value("sum-wminus"), "W- " + where);
        assertClose(((Number) expected.get("complexity")).doubleValue(), page.value("sum-bound"), "bound " + where);
    }

    @Test
    void defaultScenarioMatchesTheJvmInBothEngines() throws IOException {
        Map<String, Object> expected = jvmResult(scenarioFile("default.json"));
        for (String engine : new String[] {"js", "wasm"}) {
            page.js("localStorage.clear();");
            page.openFresh("?engine=" + engine);
            assertEquals(engine, page.data("engine-badge", "engine"), "engine running");
            assertEquals("gallery", page.js("return document.body.dataset.loadedFrom;"));
            assertPageMatches(expected, "(" + engine + " engine)");
            assertTrue(page.$("verdict").getText().contains("decides f"), page.$("verdict").getText());
        }
    }

    @Test
    void singleFileGivesTheSameNumbers() throws IOException {
        Map<String, Object> expected = jvmResult(scenarioFile("default.json"));
        Path single = Paths.get(System.getProperty("spanwright.singleFile", "target/spanwright.html")).toAbsolutePath();
        page.driver.get(single.toUri().toString());
        page.waitForAnalysis(0, WAIT);
        assertPageMatches(expected, "(single file)");
    }

    @Test
    void worstButtonsFocusTheWorstInputs() throws IOException {
        Map<String, Object> expected = jvmResult(scenarioFile("default.json"));
        page.openFresh(null);
        page.$("worst-pos").click();
        page.waitFor("focus on worst positive", WAIT, () -> worst(expected, "positive").equals(page.js("return window.Spanwright.focus();")));
        assertEquals(worst(expected, "positive"), page.$("focus-x").getText());
        assertClose(side(expected, "positive", "maxResistance"), page.value("focus-value"), "R of the focused input");
        page.waitFor("focused row drawn", WAIT, () -> worst(expected, "positive").equals(page.js("return document.body.dataset.focusDrawn;")));
        assertFalse(page.driver.findElements(By.cssSelector(".row.focused")).isEmpty(), "the focused row is visible");

        page.$("worst-neg").click();
        page.waitFor("focus on worst negative", WAIT, () -> worst(expected, "negative").equals(page.js("return window.Spanwright.focus();")));
        assertClose(side(expected, "negative", "maxCapacitance"), page.value("focus-value"), "C of the focused input");

        // Arrow keys step through the list.
        String before = (String) page.js("return window.Spanwright.focus();");
        page.driver.findElement(By.tagName("body")).sendKeys(Keys.ARROW_DOWN);
        page.waitFor("arrow key moves focus", WAIT, () -> !before.equals(page.js("return window.Spanwright.focus();")));
    }

    @Test
    void anEditChangesTheNumbersAndUndoRestoresThem() throws IOException {
        Map<String, Object> original = jvmResult(scenarioFile("default.json"));
        page.openFresh(null);
        assertPageMatches(original, "before the edit");
        page.js("document.querySelectorAll('.editors details').forEach(function(d){d.open=true;});");
        WebElement weight = page.driver.findElements(By.cssSelector("#edge-table .edge-weight")).get(0);
        int serial = page.serial();
        weight.sendKeys(Keys.chord(Keys.CONTROL, "a"), "3", Keys.TAB);
        page.waitForAnalysis(serial, WAIT);
        String edited = (String) page.js("return window.Spanwright.scenarioText();");
        assertTrue(edited.contains("\"weight\":3"), edited);
        Map<String, Object> expectedEdited = jvmResult(edited);
        assertPageMatches(expectedEdited, "after the edit");
        assertNotEquals(side(original, "positive", "maxResistance") * side(original, "negative", "maxCapacitance"),
                page.value("sum-wplus") * page.value("sum-wminus"), "the edit changed W+·W-");

        serial = page.serial();
        page.driver.findElement(By.tagName("body")).click();
        page.driver.findElement(By.tagName("body")).sendKeys(Keys.chord(Keys.CONTROL, "z"));
        page.waitForAnalysis(serial, WAIT);
        assertPageMatches(original, "after undo");

        serial = page.serial();
        page.driver.findElement(By.tagName("body")).sendKeys(Keys.chord(Keys.CONTROL, Keys.SHIFT, "z"));
        page.waitForAnalysis(serial, WAIT);
        assertPageMatches(expectedEdited, "after redo");
    }

    @Test
    void drawingToolsAddAVertexAndAnEdge() {
        page.openFresh(null);
        int vertices = ((Number) page.js("return JSON.parse(window.Spanwright.scenarioText()).graph.vertices.length;")).intValue();
        int edges = ((Number) page.js("return JSON.parse(window.Spanwright.scenarioText()).graph.edges.length;")).intValue();
        page.driver.findElement(By.cssSelector("[data-tool=vertex]")).click();
        WebElement canvas = page.$("graph");
        // Near the top-left corner of the drawing, where the default scenario has no vertex.
        new org.openqa.selenium.interactions.Actions(page.driver)
                .moveToElement(canvas, -canvas.getSize().getWidth() / 2 + 25, -canvas.getSize().getHeight() / 2 + 25).click().perform();
        page.waitFor("vertex added", WAIT, () -> ((Number) page.js("return JSON.parse(window.Spanwright.scenarioText()).graph.vertices.length;")).intValue() == vertices + 1);
        // Join the new vertex to s with the edge tool, clicking both vertices at their drawn positions.
        page.driver.findElement(By.cssSelector("[data-tool=edge]")).click();
        for (String which : new String[] {"v1", (String) page.js("return JSON.parse(window.Spanwright.scenarioText()).graph.s;")}) {
            Map<?, ?> pos = (Map<?, ?>) page.js("var p = window.SpanwrightView.cy.getElementById(arguments[0]).renderedPosition(); return {x: p.x, y: p.y};", which);
            new org.openqa.selenium.interactions.Actions(page.driver)
                    .moveToElement(canvas, (int) Math.round(((Number) pos.get("x")).doubleValue()) - canvas.getSize().getWidth() / 2,
                            (int) Math.round(((Number) pos.get("y")).doubleValue()) - canvas.getSize().getHeight() / 2).click().perform();
        }
        page.waitFor("edge added", WAIT, () -> ((Number) page.js("return JSON.parse(window.Spanwright.scenarioText()).graph.edges.length;")).intValue() == edges + 1);
        page.driver.findElement(By.cssSelector("[data-tool=move]")).click();
    }

    @Test
    void aShareLinkRoundTrips() {
        page.openFresh(null);
        WebElement title = page.$("title");
        title.clear();
        title.sendKeys("Shared by link \u2014 \u00e9t\u00e9", Keys.TAB);
        page.waitFor("title committed", WAIT, () -> String.valueOf(page.js("return window.Spanwright.scenarioText();")).contains("Shared by link"));
        String shared = (String) page.js("return window.Spanwright.scenarioText();");
        page.$("copy-link").click();
        page.waitFor("link shown", WAIT, () -> !page.$("share-link").getAttribute("value").isEmpty());
        String link = page.$("share-link").getAttribute("value");
        assertTrue(link.startsWith("file:///") && link.contains("#s1."), link);

        // Replace the work with another gallery scenario, then follow the link.
        int serial = page.serial();
        new Select(page.$("gallery")).selectByIndex(2);
        page.waitForAnalysis(serial, WAIT);
        assertNotEquals(shared, page.js("return window.Spanwright.scenarioText();"));
        serial = page.serial();
        page.driver.get(link);
        page.waitFor("link opened", WAIT, () -> "opened".equals(page.js("return document.body.dataset.linkStatus;")));
        assertEquals(shared, page.js("return window.Spanwright.scenarioText();"));
        assertEquals("Shared by link \u2014 \u00e9t\u00e9", page.$("title").getAttribute("value"));
        page.waitForAnalysis(serial, WAIT);

        // A fresh tab (full page load) opens the same link too.
        page.js("localStorage.clear();");
        page.driver.get("about:blank");
        page.driver.get(link);
        page.waitFor("link opened on load", WAIT, () -> "opened".equals(page.js("return document.body.dataset.linkStatus;")));
        assertEquals(shared, page.js("return window.Spanwright.scenarioText();"));
    }

    @Test
    void aBrokenLinkShowsAMessageAndKeepsTheWork() {
        page.openFresh(null);
        WebElement title = page.$("title");
        title.clear();
        title.sendKeys("My unsaved work", Keys.TAB);
        page.waitFor("title committed", WAIT, () -> String.valueOf(page.js("return window.Spanwright.scenarioText();")).contains("My unsaved work"));
        String work = (String) page.js("return window.Spanwright.scenarioText();");
        String base = PageDriver.pageUrl(null);
        for (String fragment : new String[] {"#s1.AAAAthis-is-not-a-real-code", "#hello-world", "#s9.QUJD"}) {
            page.js("document.body.dataset.linkStatus = '';");
            page.driver.get(base + fragment);
            page.waitFor("broken link reported for " + fragment, WAIT,
                    () -> "broken".equals(page.js("return document.body.dataset.linkStatus;")));
            assertTrue(page.$("notice").isDisplayed());
            String message = page.$("notice-text").getText();
            assertTrue(message.contains("does not hold a scenario") && message.contains("unchanged"), message);
            assertEquals(work, page.js("return window.Spanwright.scenarioText();"), "work kept after " + fragment);
            assertEquals("My unsaved work", page.$("title").getAttribute("value"));
        }
        // The work also survives a reload (autosave).
        page.driver.navigate().refresh();
        page.waitForAnalysis(0, WAIT);
        assertEquals("autosave", page.js("return document.body.dataset.loadedFrom;"));
        assertEquals(work, page.js("return window.Spanwright.scenarioText();"));
    }

    /** A share fragment for the page's current scenario with another title, made by the page's engine. */
    private static String fragmentTitled(String title) {
        return (String) ((org.openqa.selenium.JavascriptExecutor) page.driver).executeAsyncScript(
                "var cb = arguments[arguments.length - 1]; var o = JSON.parse(window.Spanwright.scenarioText()); o.title = arguments[0];"
                + " window.SwApp.bridge().call('encodeShare', JSON.stringify(o)).then(function (r) { cb(r.fragment); });", title);
    }

    private static String shownTitle() {
        return (String) page.js("return JSON.parse(window.Spanwright.scenarioText()).title;");
    }

    private static void setTitle(String title) {
        WebElement field = page.$("title");
        field.clear();
        field.sendKeys(title, Keys.TAB);
        page.waitFor("title committed", WAIT, () -> title.equals(shownTitle()));
    }

    private static void followLink(String url) {
        page.js("document.body.dataset.linkStatus = '';");
        page.driver.get(url);
        page.waitFor("link opened: " + url, WAIT, () -> "opened".equals(page.js("return document.body.dataset.linkStatus;")));
    }

    /** Issue: a link only opened at the same disk path. The Open link field (key L) takes a whole
     *  link from another place, a link wrapped by a mail program, or the fragment alone; Copy link
     *  offers the fragment alone too; what holds no scenario gives a message and keeps the work. */
    @Test
    void aLinkPastedFromAnotherPlaceOpens() {
        page.openFresh(null);
        setTitle("Sent to a colleague");
        page.$("copy-link").click();
        page.waitFor("link shown", WAIT, () -> !page.$("share-fragment").getAttribute("value").isEmpty());
        String link = page.$("share-link").getAttribute("value");
        String fragment = page.$("share-fragment").getAttribute("value");
        assertTrue(fragment.startsWith("s1.") && link.endsWith("#" + fragment), link + " / " + fragment);
        page.$("share-close").click();
        String sent = scenarioText();

        String half = fragment.substring(0, fragment.length() / 2), rest = fragment.substring(fragment.length() / 2);
        String[] pastes = {
            "https://files.example.org/shared/spanwright.html#" + fragment,
            "file:///C:/Users/colleague/Downloads/spanwright.html#" + half + "\n  " + rest,
            fragment,
            "#" + fragment,
        };
        for (String pasted : pastes) {
            setTitle("Something else");
            page.driver.findElement(By.tagName("body")).sendKeys("l");
            page.waitFor("open box shown", WAIT, () -> page.$("open-box").isDisplayed());
            assertEquals("open-link", page.js("return document.activeElement.id;"), "the field has the keyboard");
            page.js("document.body.dataset.linkStatus = ''; document.getElementById('open-link').value = arguments[0];", pasted);
            page.$("open-link").sendKeys(Keys.ENTER);
            page.waitFor("pasted link opened: " + pasted, WAIT, () -> "opened".equals(page.js("return document.body.dataset.linkStatus;")));
            assertEquals(sent, scenarioText(), "opened from " + pasted);
            assertFalse(page.$("open-box").isDisplayed(), "the box closes after opening");
        }

        String work = scenarioText();
        for (String bad : new String[] {"https://files.example.org/shared/spanwright.html", "s1.not-a-scenario"}) {
            page.driver.findElement(By.tagName("body")).sendKeys("l");
            page.js("document.body.dataset.linkStatus = ''; document.getElementById('open-link').value = arguments[0];", bad);
            page.$("open-link-go").click();
            page.waitFor("refused: " + bad, WAIT, () -> "broken".equals(page.js("return document.body.dataset.linkStatus;")));
            assertTrue(page.$("notice-text").getText().contains("scenario"), page.$("notice-text").getText());
            assertEquals(work, scenarioText(), "work kept after pasting " + bad);
        }
    }

    /** Issue: link A, then link B, then a gallery scenario, then a file, each replacing the last:
     *  every replaced scenario is one Undo step, the user's own work is kept across a reload, and
     *  the undo stack keeps its limit however many scenarios are opened. */
    @Test
    @SuppressWarnings("unchecked")
    void openingOneThingAfterAnotherNeverLosesTheUsersWork() throws IOException {
        page.openFresh(null);
        // A fresh browser opening a link has nothing of its own to bring back: no offer.
        String base = PageDriver.pageUrl(null);
        String fa = fragmentTitled("Link A"), fb = fragmentTitled("Link B");
        page.js("localStorage.clear();");
        page.driver.get("about:blank");
        followLink(base + "#" + fa);
        assertTrue(page.driver.findElements(By.id("restore-previous")).isEmpty(), "no restore offer without saved work");
        assertEquals("Link A", shownTitle());

        setTitle("My own work");
        followLink(base + "#" + fb);
        assertEquals("Link B", shownTitle());
        assertTrue(page.$("restore-previous").isDisplayed(), "replaced own work is offered back");
        page.js("location.hash = arguments[0];", fa);
        page.waitFor("second link opened", WAIT, () -> "Link A".equals(shownTitle()));
        int serial = page.serial();
        new Select(page.$("gallery")).selectByIndex(2);
        page.waitForAnalysis(serial, WAIT);
        String galleryTitle = shownTitle();
        Path file = Files.createTempFile("kept-", ".json");
        Files.writeString(file, scenarioFile("default.json").replaceFirst("\"title\"\\s*:\\s*\"[^\"]*\"", "\"title\": \"From a file\""), StandardCharsets.UTF_8);
        page.$("open-file").sendKeys(file.toString());
        page.waitFor("file opened", WAIT, () -> "From a file".equals(shownTitle()));
        Files.deleteIfExists(file);

        String[] back = {galleryTitle, "Link A", "Link B", "My own work"};
        for (String expected : back) {
            page.driver.findElement(By.tagName("body")).sendKeys(Keys.chord(Keys.CONTROL, "z"));
            page.waitFor("undo to " + expected, WAIT, () -> expected.equals(shownTitle()));
        }

        // Kept across a reload, under Earlier work, and brought back from there.
        setTitle("Scratch");
        page.driver.navigate().refresh();
        page.waitForAnalysis(0, WAIT);
        List<Object> kept = (List<Object>) Json.parse((String) page.js("return localStorage.getItem('spanwright.kept.v1');"));
        List<String> keptTitles = new java.util.ArrayList<>();
        for (Object k : kept) {
            keptTitles.add(String.valueOf(((Map<String, Object>) k).get("title")));
        }
        assertTrue(keptTitles.containsAll(List.of("My own work", "Link A", "Link B")), "kept: " + keptTitles);
        assertFalse(keptTitles.contains(galleryTitle), "a bundled scenario as it came is not kept: " + keptTitles);
        page.driver.findElement(By.tagName("body")).sendKeys("l");
        page.waitFor("open box", WAIT, () -> page.$("open-box").isDisplayed());
        new Select(page.$("kept")).selectByIndex(1 + keptTitles.indexOf("My own work"));
        page.$("kept-open").click();
        page.waitFor("earlier work back", WAIT, () -> "My own work".equals(shownTitle()));

        // However many scenarios are opened, the undo stack keeps its limit.
        long limit = ((Number) page.js("return window.SwPage.historyLimit;")).longValue();
        page.js("for (var i = 0; i < arguments[0]; i++) { var o = JSON.parse(window.Spanwright.scenarioText()); o.title = 'n' + i; window.SwPage.openScenario(o, {}); }", limit + 20);
        assertEquals(limit, ((Number) page.js("return window.SwPage.state.undo.length;")).longValue(), "undo depth after many openings");
    }

    /** Issue: two tabs wrote the same autosave without a word. A tab that sees another tab write
     *  it stops autosaving, says so, keeps its own work, and can take the autosave back. */
    @Test
    void aSecondTabWritingTheAutosaveIsNoticed() {
        page.openFresh(null);
        String first = page.driver.getWindowHandle();
        page.driver.switchTo().newWindow(org.openqa.selenium.WindowType.TAB);
        String second = page.driver.getWindowHandle();
        try {
            page.openFresh(null);
            setTitle("Work of the second tab");
            page.driver.switchTo().window(first);
            page.waitFor("first tab warned", WAIT, () -> "paused".equals(page.js("return document.body.dataset.autosave;")));
            assertTrue(page.$("notice").isDisplayed() && page.$("notice-text").getText().contains("another tab"), page.$("notice-text").getText());
            assertTrue(page.$("autosave-state").isDisplayed(), "the top bar says this tab does not autosave");
            setTitle("Work of the first tab");
            String saved = (String) page.js("return localStorage.getItem('spanwright.autosave.v1');");
            assertTrue(saved.contains("Work of the second tab") && !saved.contains("Work of the first tab"), "not overwritten silently: " + saved);
            String kept = (String) page.js("return localStorage.getItem('spanwright.kept.v1');");
            assertTrue(kept.contains("Work of the first tab"), "the first tab's work is kept: " + kept);

            page.$("autosave-here").click();
            page.waitFor("first tab autosaves again", WAIT, () -> "on".equals(page.js("return document.body.dataset.autosave;")));
            assertTrue(((String) page.js("return localStorage.getItem('spanwright.autosave.v1');")).contains("Work of the first tab"));
            page.driver.switchTo().window(second);
            page.waitFor("second tab warned in turn", WAIT, () -> "paused".equals(page.js("return document.body.dataset.autosave;")));
        } finally {
            page.driver.switchTo().window(second);
            page.driver.close();
            page.driver.switchTo().window(first);
        }
    }

    @Test
    void aPauseInTypingAppliesTheFieldSoAReloadKeepsIt() {
        // The user types into the function field and reloads without leaving the field: what was
        // typed is applied after the pause, autosaved, and back after the reload.
        page.openFresh(null);
        String before = (String) page.js("return window.Spanwright.scenarioText();");
        page.$("function").sendKeys(" | (n1 & q)");
        page.waitFor("the pause applied the function", WAIT,
                () -> String.valueOf(page.js("return window.Spanwright.scenarioText();")).contains("(p & q) | (n1 & q)"));
        assertTrue(before.contains("\"(n1 & n2) | (s1 & s2) | (p & q)\""), before);
        page.driver.navigate().refresh();
        page.waitForAnalysis(0, WAIT);
        assertEquals("autosave", page.js("return document.body.dataset.loadedFrom;"));
        assertEquals("(n1 & n2) | (s1 & s2) | (p & q) | (n1 & q)", page.$("function").getAttribute("value"));
    }

    /** Clicks the drawing's SVG button and returns the document the page would download. */
    private String exportedSvg() {
        page.js("window.__svgText = null; window.SwFormat.download = function (name, blob) {"
                + " window.__svgName = name; blob.text().then(function (t) { window.__svgText = t; }); };");
        page.$("export-svg").click();
        page.waitFor("SVG produced", WAIT, () -> page.js("return window.__svgText;") != null);
        return (String) page.js("return window.__svgText;");
    }

    private static org.w3c.dom.Document parseXml(String text) throws Exception {
        // Reference parser: the JDK's own XML parser (javax.xml), namespace-aware, no DTDs.
        javax.xml.parsers.DocumentBuilderFactory f = javax.xml.parsers.DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(true);
        f.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
        return f.newDocumentBuilder().parse(new java.io.ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)));
    }

    @Test
    @SuppressWarnings("unchecked")
    void theDrawingExportsAsSvgWithTheFocusedInput() throws Exception {
        String text = scenarioFile("default.json");
        Map<String, Object> expected = jvmResult(text);
        page.openFresh(null);
        page.$("worst-neg").click();
        String x = worst(expected, "negative");
        page.waitFor("worst negative drawn", WAIT, () -> x.equals(page.js("return document.body.dataset.focusDrawn;")));
        String svgText = exportedSvg();
        Path shots = Paths.get("target", "screenshots");
        Files.createDirectories(shots);
        Files.writeString(shots.resolve("network-worst-negative.svg"), svgText, StandardCharsets.UTF_8);
        org.w3c.dom.Document svg = parseXml(svgText);
        assertEquals("svg", svg.getDocumentElement().getLocalName());
        assertEquals("http://www.w3.org/2000/svg", svg.getDocumentElement().getNamespaceURI());
        Map<String, Object> doc = (Map<String, Object>) Json.parse(text);
        List<Object> vars = (List<Object>) doc.get("variables");
        Map<String, Object> graph = (Map<String, Object>) doc.get("graph");
        List<Object> edges = (List<Object>) graph.get("edges");
        List<Object> vertices = (List<Object>) graph.get("vertices");
        // One path per edge, one shape per vertex; s a diamond (4-corner polygon), t a square.
        assertEquals(edges.size(), withClass(svg, "edge", null).size(), "edge paths");
        assertEquals(vertices.size(), withClass(svg, "vertex", null).size(), "vertex shapes");
        assertEquals(List.of("polygon"), withClass(svg, "role-s", null));
        assertEquals(List.of("rect"), withClass(svg, "role-t", null));
        // Dashed = absent in G(x): evaluated here from the literals (first variable = first digit).
        int absent = 0;
        for (Object o : edges) {
            String when = String.valueOf(((Map<String, Object>) o).get("when"));
            boolean neg = when.startsWith("!");
            String v = neg ? when.substring(1) : when;
            boolean present = when.equals("1") || ((x.charAt(vars.indexOf(v)) == '1') != neg);
            if (!present) absent++;
        }
        assertTrue(absent > 0, "a negative input has absent edges");
        assertEquals(absent, withClass(svg, "absent", "stroke-dasharray").size(), "dashed edges are the absent ones of " + x);
        String allText = svg.getDocumentElement().getTextContent();
        for (Object v : vertices) {
            assertTrue(allText.contains(String.valueOf(((Map<String, Object>) v).get("id"))), "vertex label " + v);
        }

        // The caption: title, the input, its C, the bound, the normalisation (issue: exports lacked context).
        Map<String, String> caption = new java.util.HashMap<>();
        org.w3c.dom.NodeList texts = svg.getElementsByTagNameNS("*", "text");
        for (int i = 0; i < texts.getLength(); i++) {
            org.w3c.dom.Element t = (org.w3c.dom.Element) texts.item(i);
            if (t.getAttribute("class").equals("caption-line")) {
                caption.put(t.getAttribute("data-role"), t.getTextContent());
            }
        }
        assertEquals(doc.get("title"), caption.get("title"));
        assertTrue(caption.get("input").contains("x = " + x), caption.get("input"));
        String value = caption.get("value");
        assertTrue(value.contains("effective capacitance C = "), value);
        // Source: JsonFacade.analyze on the JVM, the worst negative input's C is W- (printed to 6 digits by the page).
        assertEquals(side(expected, "negative", "maxCapacitance"), Double.parseDouble(value.replaceAll(".*C = ([-0-9.eE+]+).*", "$1")), 1e-5, value);
        // the caption lines are the engine's (JsonFacade.tikz), the same as the TikZ figure's
        String bound = caption.get("bound");
        assertEquals(((Number) expected.get("complexity")).doubleValue(), Double.parseDouble(bound.replaceAll(".*sqrt\\(W\\+ W-\\) = ([-0-9.eE+]*[0-9]).*", "$1")), 1e-5, bound);
        assertTrue(caption.get("normalisation").contains(spanwright.model.Normalisation.CONVENTION), caption.get("normalisation"));
        assertTrue(caption.containsKey("caution"), "the caution is in the caption");
        // The colour key names what the drawing uses: literal colours, dashed absent edges, s, t and the potential ramp.
        List<String> keys = new java.util.ArrayList<>();
        org.w3c.dom.NodeList all = svg.getElementsByTagNameNS("*", "*");
        for (int i = 0; i < all.getLength(); i++) {
            org.w3c.dom.Element e = (org.w3c.dom.Element) all.item(i);
            if (e.getAttribute("class").equals("key-swatch")) {
                keys.add(e.getAttribute("data-key"));
            }
        }
        assertTrue(keys.containsAll(List.of("literal", "absent", "s", "t", "ramp")), "colour key: " + keys);
    }

    /** Issue: the PNG had no caption. The exported PNG is the drawing with a caption band below it
     *  that has ink in it (dark pixels), so it is taller than the drawing alone. */
    @Test
    void theDrawingExportsAsPngWithACaption() {
        page.openFresh(null);
        page.$("worst-pos").click();
        page.waitFor("worst positive drawn", WAIT, () -> page.js("return document.body.dataset.focusDrawn;") != null);
        page.js("window.__png = null; window.SwFormat.download = function (name, blob) { createImageBitmap(blob).then(function (img) {"
                + " var c = document.createElement('canvas'); c.width = img.width; c.height = img.height; var g = c.getContext('2d'); g.drawImage(img, 0, 0);"
                + " var top = +document.getElementById('export-png').dataset.drawingHeight, d = g.getImageData(0, top, img.width, img.height - top).data, dark = 0;"
                + " for (var i = 0; i < d.length; i += 4) if (d[i] + d[i + 1] + d[i + 2] < 200) dark++;"
                + " window.__png = {name: name, width: img.width, height: img.height, top: top, dark: dark}; }); };");
        page.$("export-png").click();
        page.waitFor("PNG produced", WAIT, () -> page.js("return window.__png;") != null);
        Map<?, ?> png = (Map<?, ?>) page.js("return window.__png;");
        int height = ((Number) png.get("height")).intValue(), top = ((Number) png.get("top")).intValue();
        assertTrue(top > 0 && height > top + 100, "caption band below the drawing: " + png);
        assertTrue(((Number) png.get("dark")).intValue() > 2000, "the caption band has text in it: " + png);
        assertTrue(String.valueOf(png.get("name")).endsWith(".png"), png.toString());
    }

    /** Issue: the inputs CSV had no title, no weights, no column per variable. */
    @Test
    @SuppressWarnings("unchecked")
    void theInputsCsvHasAHeaderBlockAndAColumnPerVariable() throws IOException {
        String text = scenarioFile("default.json");
        Map<String, Object> expected = jvmResult(text);
        Map<String, Object> doc = (Map<String, Object>) Json.parse(text);
        List<Object> vars = (List<Object>) doc.get("variables");
        List<Object> edges = (List<Object>) ((Map<String, Object>) doc.get("graph")).get("edges");
        page.openFresh(null);
        page.js("window.__csv = null; window.SwFormat.download = function (name, blob) { blob.text().then(function (t) { window.__csv = t; }); };");
        page.$("export-csv").click();
        page.waitFor("CSV produced", WAIT, () -> page.js("return window.__csv;") != null);
        List<String> lines = List.of(((String) page.js("return window.__csv;")).split("\n"));
        assertEquals("# Spanwright inputs: " + doc.get("title"), lines.get(0));
        // the bound and normalisation lines are the engine's caption lines (JsonFacade.tikz)
        double bound = ((Number) expected.get("complexity")).doubleValue();
        assertTrue(lines.stream().anyMatch(l -> l.startsWith("# W+ = ") && l.contains("bound sqrt(W+ W-) = "
                + spanwright.io.NumberText.sig(bound, 6))), "bound line: " + lines.subList(0, 4));
        assertTrue(lines.contains("# Normalisation: " + spanwright.model.Normalisation.CONVENTION + "."), "normalisation line");
        for (Object o : edges) {
            Map<String, Object> e = (Map<String, Object>) o;
            Object w = e.get("weight") == null ? 1 : e.get("weight");
            String weight = w instanceof Number && ((Number) w).doubleValue() == Math.rint(((Number) w).doubleValue()) ? String.valueOf(((Number) w).longValue()) : String.valueOf(w);
            String line = "# edge " + e.get("id") + ", " + e.get("u") + " - " + e.get("v") + ", " + e.get("when") + ", " + weight;
            assertTrue(lines.contains(line), "weight line " + line);
        }
        int header = 0;
        while (lines.get(header).startsWith("#")) {
            header++;
        }
        List<String> columns = List.of(lines.get(header).split(","));
        assertEquals("x", columns.get(0));
        for (int k = 0; k < vars.size(); k++) {
            assertEquals(vars.get(k), columns.get(1 + k), "a column per variable");
        }
        List<String> rows = lines.subList(header + 1, lines.size());
        assertEquals(1 << vars.size(), rows.size(), "one row per input of the full cube");
        int valueCol = columns.indexOf("value");
        boolean seenWorst = false;
        for (String row : rows) {
            String[] c = row.split(",");
            for (int k = 0; k < vars.size(); k++) {
                assertEquals(String.valueOf(c[0].charAt(k)), c[1 + k], "variable column " + vars.get(k) + " of " + c[0]);
            }
            if (c[0].equals(worst(expected, "positive"))) {
                // Source: JsonFacade.analyze on the JVM: the worst positive input's R is W+.
                assertClose(side(expected, "positive", "maxResistance"), Double.parseDouble(c[valueCol]), "R of the worst positive input");
                seenWorst = true;
            }
        }
        assertTrue(seenWorst, "the worst positive input is a row");
    }

    /** Tag names of the SVG elements whose class list has {@code cls} (and the attribute, if given). */
    private static List<String> withClass(org.w3c.dom.Document svg, String cls, String attribute) {
        List<String> out = new java.util.ArrayList<>();
        org.w3c.dom.NodeList all = svg.getElementsByTagNameNS("*", "*");
        for (int i = 0; i < all.getLength(); i++) {
            org.w3c.dom.Element e = (org.w3c.dom.Element) all.item(i);
            if (java.util.Arrays.asList(e.getAttribute("class").split(" ")).contains(cls) && (attribute == null || e.hasAttribute(attribute))) {
                out.add(e.getLocalName());
            }
        }
        return out;
    }

    @Test
    void hostileStringsStayInert() throws IOException {
        String img = "<img src=x onerror=\\\"window.__pwned=1\\\">";
        String script = "\\\"><script>window.__pwned=2</script>";
        String scenario = "{\"format\":\"spanwright-scenario\",\"version\":1,"
                + "\"title\":\"" + img + "\",\"notes\":\"" + script + "\","
                + "\"variables\":[\"a\",\"b\"],\"function\":\"a & b\",\"promise\":null,"
                + "\"graph\":{\"s\":\"" + img + "\",\"t\":\"" + script + "\","
                + "\"vertices\":[{\"id\":\"" + img + "\",\"x\":0,\"y\":0},{\"id\":\"m\",\"x\":100,\"y\":0},"
                + "{\"id\":\"" + script + "\",\"x\":200,\"y\":0}],"
                + "\"edges\":[{\"id\":\"" + img + "\",\"u\":\"" + img + "\",\"v\":\"m\",\"when\":\"a\"},"
                + "{\"id\":\"e2\",\"u\":\"m\",\"v\":\"" + script + "\",\"when\":\"b\"}]}}";
        Path file = Files.createTempFile("hostile-", ".json");
        Files.writeString(file, scenario, StandardCharsets.UTF_8);
        page.openFresh(null);
        int imgs = ((Number) page.js("return document.images.length;")).intValue();
        int scripts = ((Number) page.js("return document.scripts.length;")).intValue();
        int serial = page.serial();
        page.$("open-file").sendKeys(file.toString());
        page.waitForAnalysis(serial, WAIT);
        page.js("document.querySelectorAll('.editors details').forEach(function(d){d.open=true;});");
        page.$("worst-pos").click();
        page.waitFor("focus drawn", WAIT, () -> page.js("return document.body.dataset.focusDrawn;") != null);
        page.$("copy-link").click();
        page.waitFor("link shown", WAIT, () -> !page.$("share-link").getAttribute("value").isEmpty());
        assertEquals("<img src=x onerror=\"window.__pwned=1\">", page.$("title").getAttribute("value"));
        assertTrue(page.$("edge-table").getText().contains("<img src=x"), "shown as text");
        assertEquals(null, page.js("return window.__pwned === undefined ? null : window.__pwned;"), "no script ran");
        assertEquals(imgs, ((Number) page.js("return document.images.length;")).intValue(), "no <img> was created");
        assertEquals(scripts, ((Number) page.js("return document.scripts.length;")).intValue(), "no <script> was created");
        // The SVG export keeps the names as text: it parses, has no script element or event
        // attribute, and the hostile strings are in its text content.
        try {
            org.w3c.dom.Document svg = parseXml(exportedSvg());
            assertEquals(0, svg.getElementsByTagNameNS("*", "script").getLength(), "no <script> in the SVG");
            assertEquals(0, svg.getElementsByTagNameNS("*", "img").getLength(), "no <img> in the SVG");
            assertTrue(svg.getDocumentElement().getTextContent().contains("<img src=x onerror="), "the name is text");
        } catch (Exception e) {
            throw new AssertionError("the SVG export of hostile names must be well-formed XML", e);
        }
        Files.deleteIfExists(file);
    }

    @Test
    void aBadFileGivesAMessageAndKeepsTheWork() throws IOException {
        page.openFresh(null);
        String work = (String) page.js("return window.Spanwright.scenarioText();");
        Path file = Files.createTempFile("broken-", ".json");
        Files.writeString(file, "{\"format\": \"spanwright-scenario\",\n  \"version\": 1,\n  \"title\": oops }", StandardCharsets.UTF_8);
        page.$("open-file").sendKeys(file.toString());
        page.waitFor("message shown", WAIT, () -> page.$("notice").isDisplayed());
        String message = page.$("notice-text").getText();
        assertTrue(message.contains(file.getFileName().toString()) && message.contains("line 3"), message);
        assertEquals(work, page.js("return window.Spanwright.scenarioText();"));
        Files.deleteIfExists(file);
    }

    @Test
    @SuppressWarnings("unchecked")
    void histogramCountsAreTheEnginesHistogram() throws IOException {
        for (int g : new int[] {-1, 1, 2}) {
            if (g < 0) {
                page.openFresh(null);
            } else {
                int serial = page.serial();
                new Select(page.$("gallery")).selectByIndex(g);
                page.waitForAnalysis(serial, WAIT);
            }
            String shown = (String) page.js("return window.Spanwright.scenarioText();");
            // Source: JsonFacade.analyze on the JVM for the same text, its "histogram".
            Map<String, Object> hist = (Map<String, Object>) jvmResult(shown).get("histogram");
            for (String side : new String[] {"positive", "negative"}) {
                List<Object> expected = (List<Object>) ((Map<String, Object>) hist.get(side)).get("counts");
                List<Object> drawn = (List<Object>) Json.parse((String) page.js("return document.getElementById('histogram').dataset." + side + ";"));
                assertEquals(expected.size(), drawn.size(), side + " bins, gallery " + g);
                for (int i = 0; i < expected.size(); i++) {
                    assertEquals(((Number) expected.get(i)).longValue(), ((Number) drawn.get(i)).longValue(), side + " bin " + i + ", gallery " + g);
                }
            }
        }
    }

    @Test
    @SuppressWarnings("unchecked")
    void renamingAVariableGoesThroughTheEngineAndRoundTrips() {
        page.openFresh(null);
        String original = (String) page.js("return window.Spanwright.scenarioText();");
        Map<String, Object> numbers = jvmResult(original);
        page.js("document.querySelectorAll('.editors details').forEach(function(d){d.open=true;});");
        int index = ((List<Object>) ((Map<String, Object>) Json.parse(original)).get("variables")).indexOf("p");
        assertTrue(index >= 0, "the default scenario has a variable p");

        // Source: JsonFacade.renameVariable on the JVM, same text.
        rename(index, "pump_on");
        String renamed = (String) page.js("return window.Spanwright.scenarioText();");
        Map<String, Object> expected = (Map<String, Object>) Json.parse(JsonFacade.renameVariable(original, "p", "pump_on"));
        assertEquals(Boolean.TRUE, expected.get("ok"), () -> "JVM rename failed: " + expected);
        assertEquals(Json.parse((String) expected.get("scenario")), Json.parse(renamed), "page text = engine's renamed text");
        assertTrue(renamed.contains("pump_on & q"), renamed);
        page.waitForAnalysis(0, WAIT);
        assertPageMatches(numbers, "after renaming (a rename changes no number)");

        rename(index, "p");
        String back = (String) page.js("return window.Spanwright.scenarioText();");
        Map<String, Object> expectedBack = (Map<String, Object>) Json.parse(JsonFacade.renameVariable(renamed, "pump_on", "p"));
        assertEquals(Json.parse((String) expectedBack.get("scenario")), Json.parse(back), "second rename = engine's");
        assertEquals(Json.parse(original), Json.parse(back), "renaming there and back gives the original");

        // A name the engine refuses: a message, and nothing changes.
        WebElement chip = page.driver.findElement(By.cssSelector("[data-var-index='" + index + "']"));
        chip.sendKeys(Keys.chord(Keys.CONTROL, "a"), "2bad", Keys.TAB);
        page.waitFor("refusal shown", WAIT, () -> page.$("notice").isDisplayed() && page.$("notice-text").getText().contains("2bad"));
        assertTrue(page.$("notice-text").getText().contains("Nothing was changed"), page.$("notice-text").getText());
        assertEquals(back, page.js("return window.Spanwright.scenarioText();"));
    }

    private void rename(int index, String to) {
        String before = (String) page.js("return window.Spanwright.scenarioText();");
        WebElement chip = page.driver.findElement(By.cssSelector("[data-var-index='" + index + "']"));
        chip.sendKeys(Keys.chord(Keys.CONTROL, "a"), to, Keys.TAB);
        page.waitFor("rename to " + to + " applied", WAIT, () -> !before.equals(page.js("return window.Spanwright.scenarioText();")));
    }

    /** Geometry check of the drawing itself (no computed value): in presentation mode at
     *  1280×720, on both worst inputs of every gallery scenario, no edge label box meets a vertex. */
    @Test
    void edgeLabelsStayClearOfVerticesInPresentationMode() {
        page.driver.manage().window().setSize(new org.openqa.selenium.Dimension(1280, 720));
        try {
            page.openFresh(null);
            int frames = ((Number) page.js("return window.outerHeight - window.innerHeight;")).intValue();
            page.driver.manage().window().setSize(new org.openqa.selenium.Dimension(1280, 720 + frames));
            int scenarios = ((Number) page.js("return document.getElementById('gallery').options.length - 1;")).intValue();
            page.driver.findElement(By.tagName("body")).sendKeys("m");
            page.waitFor("presentation mode", WAIT, () -> "present".equals(page.js("return document.body.dataset.mode;")));
            for (int g = 1; g <= scenarios; g++) {
                int serial = page.serial();
                page.js("var s = document.getElementById('gallery'); s.value = String(arguments[0]); s.dispatchEvent(new Event('change'));", g - 1);
                page.waitForAnalysis(serial, WAIT);
                for (String key : new String[] {"1", "0"}) {
                    page.js("document.body.dataset.focusDrawn = '';");
                    page.driver.findElement(By.tagName("body")).sendKeys(key);
                    page.waitFor("focus drawn", WAIT, () -> !"".equals(page.js("return document.body.dataset.focusDrawn || '';")));
                    Object clashes = page.js(
                            "var cy = window.SpanwrightView.cy, out = [];"
                            + "var lb = {includeNodes:false, includeEdges:false, includeLabels:true, includeMainLabels:true, includeSourceLabels:false, includeTargetLabels:false, includeOverlays:false, includeUnderlays:false, useCache:false};"
                            + "var nb = {includeNodes:true, includeEdges:false, includeLabels:false, includeOverlays:false, includeUnderlays:false, useCache:false};"
                            + "cy.edges().forEach(function(e){ var a = e.boundingBox(lb); if (!(a.w > 0)) return;"
                            + "  cy.nodes().forEach(function(n){ var b = n.boundingBox(nb);"
                            + "    if (a.x1 < b.x2 && b.x1 < a.x2 && a.y1 < b.y2 && b.y1 < a.y2) out.push(e.id() + ' (' + e.data('shown') + ') on ' + n.id()); }); });"
                            + "return out.join('; ');");
                    assertEquals("", clashes, "gallery scenario " + g + ", worst input key " + key);
                }
            }
        } finally {
            page.driver.manage().window().setSize(new org.openqa.selenium.Dimension(1280, 900));
        }
    }

    @Test
    void screenshotsOfNormalAndPresentationModes() throws IOException {
        page.driver.manage().window().setSize(new org.openqa.selenium.Dimension(1280, 720));
        try {
            page.openFresh(null);
            // Make the viewport itself 1280×720 (the window size includes the browser's frame).
            int extra = ((Number) page.js("return window.outerHeight - window.innerHeight;")).intValue();
            page.driver.manage().window().setSize(new org.openqa.selenium.Dimension(1280, 720 + extra));
            assertEquals(720L, page.js("return window.innerHeight;"), "viewport height");
            page.driver.findElement(By.tagName("body")).sendKeys("1");
            page.waitFor("focus drawn", WAIT, () -> page.js("return document.body.dataset.focusDrawn;") != null);
            assertNotNull(page.screenshot("normal-1280x720"));
            page.driver.findElement(By.tagName("body")).sendKeys("m");
            page.waitFor("presentation mode", WAIT, () -> "present".equals(page.js("return document.body.dataset.mode;")));
            assertFalse(page.$("copy-link").isDisplayed(), "controls hidden in presentation mode");
            assertTrue(page.driver.findElement(By.cssSelector(".caution")).isDisplayed(), "the caution stays visible");
            page.driver.findElement(By.tagName("body")).sendKeys("0");
            assertNotNull(page.screenshot("present-1280x720"));
            page.driver.findElement(By.tagName("body")).sendKeys(Keys.ESCAPE);
            assertEquals("edit", page.js("return document.body.dataset.mode;"));
        } finally {
            page.driver.manage().window().setSize(new org.openqa.selenium.Dimension(1280, 900));
        }
    }

    /**
     * A graph that does not decide f (the default scenario with the bypass left out of f): the
     * Summary marks √(W₊·W₋) as not a bound for f with the engine's reason, the weight search warns
     * in words, and the Bounds sheet marks this graph's rows. Source of the expected words and
     * count: JsonFacade.analyze and JsonFacade.bounds on the JVM for the same text
     * (complexityIsBound, complexityNote).
     */
    @Test
    @SuppressWarnings("unchecked")
    void aGraphThatDoesNotDecideFIsNotABound() throws IOException {
        String text = scenarioFile("default.json").replace("\"(n1 & n2) | (s1 & s2) | (p & q)\"", "\"(n1 & n2) | (s1 & s2)\"");
        assertTrue(text.contains("\"(n1 & n2) | (s1 & s2)\""), "the function was replaced");
        Map<String, Object> expected = jvmResult(text);
        assertEquals(Boolean.FALSE, expected.get("complexityIsBound"));
        String note = String.valueOf(expected.get("complexityNote"));
        int serial = page.serial();
        page.js("window.SwPage.openScenario(JSON.parse(arguments[0]), {});", text);
        page.waitForAnalysis(serial, WAIT);
        assertEquals("no", page.$("verdict").getAttribute("data-correct"));
        assertTrue(page.$("sum-bound-note").isDisplayed(), "the mark is shown");
        assertTrue(page.$("sum-bound-note").getText().contains(note), page.$("sum-bound-note").getText());
        assertEquals("no", page.js("return document.getElementById('sum-bound').parentNode.dataset.bound;"));
        assertClose(((Number) expected.get("complexity")).doubleValue(), page.value("sum-bound"), "the number is still shown");

        page.$("tab-weights").click();
        page.waitFor("optimiser available", WAIT, () -> page.$("opt-run").isEnabled());
        page.$("opt-run").click();
        page.waitFor("search finished", WAIT, () -> "result".equals(page.js("return document.body.dataset.optimiser;")));
        assertTrue(page.$("opt-warning").isDisplayed(), "the weight search warns");
        assertTrue(page.$("opt-warning").getText().contains(note), page.$("opt-warning").getText());
        page.$("opt-discard").click();

        page.$("tab-bounds").click();
        page.waitFor("bounds computed", WAIT, () -> "ready".equals(page.js("return document.body.dataset.bounds;")));
        Map<String, Object> bounds = (Map<String, Object>) ((Map<String, Object>) Json.parse(JsonFacade.bounds(text))).get("result");
        assertEquals(Boolean.FALSE, bounds.get("complexityIsBound"));
        assertTrue(page.$("bounds-warning").isDisplayed());
        assertTrue(page.$("bounds-warning").getText().contains(String.valueOf(bounds.get("complexityNote"))), page.$("bounds-warning").getText());
        assertEquals("no", page.$("bounds-complexity").getAttribute("data-bound"));
        page.$("tab-summary").click();

        // A graph that decides f shows no mark.
        serial = page.serial();
        page.js("window.SwPage.openScenario(JSON.parse(arguments[0]), {});", scenarioFile("default.json"));
        page.waitForAnalysis(serial, WAIT);
        assertFalse(page.$("sum-bound-note").isDisplayed());
        assertEquals("yes", page.js("return document.getElementById('sum-bound').parentNode.dataset.bound;"));
    }
}
