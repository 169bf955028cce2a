package spanwright.web;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.logging.Level;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.TakesScreenshot;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.logging.LogEntry;
import org.openqa.selenium.logging.LogType;
import org.openqa.selenium.logging.LoggingPreferences;
import org.openqa.selenium.support.ui.WebDriverWait;

/**
 * Real Chromium (Debian's chromium + chromedriver, never a downloaded browser), headless, with a
 * fresh profile, opening the built page from file://. A missing browser or page is an error, not
 * a skipped test.
 */
final class PageDriver implements AutoCloseable {
    final ChromeDriver driver;
    final Path profile;

    PageDriver(int width, int height) throws IOException {
        String chromium = System.getProperty("spanwright.chromium", "/usr/bin/chromium");
        String chromedriver = System.getProperty("webdriver.chrome.driver", "/usr/bin/chromedriver");
        if (!Files.isExecutable(Paths.get(chromium)) || !Files.isExecutable(Paths.get(chromedriver))) {
            throw new IllegalStateException("The browser tests need Debian's chromium and chromium-driver: "
                    + chromium + " or " + chromedriver + " is missing (apt-get install chromium chromium-driver).");
        }
        profile = Files.createTempDirectory("spanwright-chromium-");
        ChromeOptions options = new ChromeOptions();
        options.setBinary(chromium);
        options.addArguments("--headless=new", "--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage",
                "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run",
                "--user-data-dir=" + profile, "--window-size=" + width + "," + height);
        LoggingPreferences logs = new LoggingPreferences();
        logs.enable(LogType.BROWSER, Level.ALL);
        options.setCapability("goog:loggingPrefs", logs);
        ChromeDriverService service = new ChromeDriverService.Builder()
                .usingDriverExecutable(Paths.get(chromedriver).toFile()).build();
        driver = new ChromeDriver(service, options);
        driver.manage().window().setSize(new Dimension(width, height));
    }

    static Path page() {
        Path p = Paths.get(System.getProperty("spanwright.page", "target/spanwright/index.html")).toAbsolutePath();
        if (!Files.isRegularFile(p)) {
            throw new IllegalStateException("The built page is missing: " + p + " (run mvn package in web first)");
        }
        return p;
    }

    static String pageUrl(String query) {
        return page().toUri() + (query == null ? "" : query);
    }

    Object js(String script, Object... args) {
        return ((JavascriptExecutor) driver).executeScript(script, args);
    }

    WebElement $(String id) {
        return driver.findElement(By.id(id));
    }

    String data(String id, String attribute) {
        return $(id).getAttribute("data-" + attribute);
    }

    int serial() {
        Object s = js("return document.body.dataset.analysisSerial || '0';");
        return Integer.parseInt(String.valueOf(s));
    }

    /** Waits until an analysis newer than {@code after} has been shown (numbers or an error). */
    void waitForAnalysis(int after, Duration timeout) {
        new WebDriverWait(driver, timeout).withMessage(() -> "no analysis shown; browser log:\n" + logText())
                .until(d -> serial() > after && !"running".equals(js("return document.body.dataset.analysis;")));
    }

    void waitFor(String what, Duration timeout, java.util.function.Supplier<Boolean> condition) {
        new WebDriverWait(driver, timeout).withMessage(() -> what + "; browser log:\n" + logText())
                .until(d -> condition.get());
    }

    /** Opens the page with a clean state and waits for the first analysis. */
    void openFresh(String query) {
        driver.get(pageUrl(query));
        waitForAnalysis(0, Duration.ofSeconds(60));
    }

    double value(String id) {
        String v = data(id, "value");
        if (v == null || v.isEmpty()) {
            return Double.NaN;
        }
        return Double.parseDouble(v);
    }

    List<String> log() {
        List<String> out = new ArrayList<>();
        for (LogEntry e : driver.manage().logs().get(LogType.BROWSER)) {
            out.add(e.getLevel() + " " + e.getMessage());
        }
        return out;
    }

    String logText() {
        try {
            return String.join("\n", log());
        } catch (RuntimeException e) {
            return "(log unavailable: " + e.getMessage() + ")";
        }
    }

    Path screenshot(String name) throws IOException {
        Path dir = Paths.get(System.getProperty("spanwright.shots", "target/screenshots"));
        Files.createDirectories(dir);
        Path out = dir.resolve(name + ".png");
        Files.write(out, ((TakesScreenshot) driver).getScreenshotAs(OutputType.BYTES));
        return out;
    }

    @Override
    public void close() {
        try {
            driver.quit();
        } finally {
            try (var walk = Files.walk(profile)) {
                walk.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
            } catch (IOException ignored) {
                // a left-over temporary profile is harmless
            }
        }
    }
}
