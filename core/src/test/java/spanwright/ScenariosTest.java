package spanwright;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.cli.Main;
import spanwright.io.ScenarioReader;
import spanwright.model.Scenario;

/**
 * Every demo scenario in ../scenarios (relative to the core module, Maven's working directory for
 * tests) reads, names its function, and is a correct reduction on its whole domain. Source: the
 * "Done when" list of the "Core engine" issue (each demo has a function and is verified correct by
 * the analysis).
 */
class ScenariosTest {

    static final Path DIR = Path.of("..", "scenarios");

    static List<Path> scenarioFiles() throws IOException {
        List<Path> files = new ArrayList<>();
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(DIR, "*.json")) {
            for (Path p : ds) {
                files.add(p);
            }
        }
        files.sort(null);
        return files;
    }

    @Test
    void thereAreAtLeastThreeDemoScenarios() throws IOException {
        assertTrue(scenarioFiles().size() >= 3, "scenarios/ holds " + scenarioFiles());
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("scenarioFiles")
    void readsHasAFunctionAndIsACorrectReduction(Path file) throws IOException {
        Scenario sc = ScenarioReader.read(Files.readString(file, StandardCharsets.UTF_8));
        assertFalse(sc.title().isBlank(), file + " has a title");
        assertNotNull(sc.function(), file + " has a function");
        assertNotNull(sc.functionText());
        assertEquals(List.of(), sc.warnings(), file + " reads without warnings");
        AnalysisResult r = Analysis.run(sc);
        assertTrue(r.reductionChecked());
        assertEquals(Boolean.TRUE, r.correct(), file + ": counterexamples " + r.counterexamples());
        assertEquals(0, r.counterexampleCount());
        assertTrue(r.positiveCount() > 0 && r.negativeCount() > 0, file + " has inputs on both sides");
        assertEquals(r.domainSize(), r.positiveCount() + r.negativeCount());
        assertTrue(Double.isFinite(r.complexity()) && r.complexity() > 0, file + ": bound " + r.complexity());
    }

    @Test
    void theBuiltInDefaultIsScenariosDefaultJson() throws IOException {
        // the jar carries the demo scenarios; the CLI's default is a copy of scenarios/default.json
        try (InputStream in = Main.class.getResourceAsStream(Main.DEFAULT_SCENARIO)) {
            assertNotNull(in, Main.DEFAULT_SCENARIO + " on the classpath");
            assertEquals(Files.readString(DIR.resolve("default.json"), StandardCharsets.UTF_8),
                new String(in.readAllBytes(), StandardCharsets.UTF_8));
        }
    }
}
