package spanwright.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.io.Json;
import spanwright.model.ScenarioException;

/** User families: the demo family files in scenarios/families, templates of both kinds, errors. */
class FamilyTemplateTest {
    static final Path DIR = Path.of("..", "scenarios", "families");

    static List<Path> familyFiles() throws IOException {
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
    void everyDemoFamilyBuildsCorrectReductionsAtItsSizes() throws IOException {
        // Source: the requirement that user families are saved in scenarios/ and build
        // ordinary scenarios; each size must decide its function (checked on every input).
        assertTrue(!familyFiles().isEmpty(), "scenarios/families holds at least one family");
        for (Path p : familyFiles()) {
            FamilyTemplate f = FamilyTemplate.read(Json.parse(Files.readString(p, StandardCharsets.UTF_8)));
            assertTrue(!f.title().isBlank());
            for (int size : SizeList.parse(f.defaultSizes(), "sizes")) {
                if (size > 8) {
                    continue;
                }
                FamilyInstance in = f.instance(size);
                AnalysisResult r = Analysis.run(in.scenario());
                assertEquals(Boolean.TRUE, r.correct(), p + " at size " + size);
            }
        }
    }

    @Test
    void theLanternRelayIsAParityLadderWithResistanceN() throws IOException {
        // Derived: on every input the n posts each keep two of their four edges, a perfect
        // matching between consecutive levels, so G(x) is two disjoint paths through all levels;
        // on a positive input s reaches t along n unit edges: R = n. On a negative input all 2n
        // absent edges join the two paths: C = 2n (unit conductances in parallel). So with the
        // template's unit weights sqrt(W+ W-) = sqrt(2) n.
        FamilyTemplate f = FamilyTemplate.read(Json.parse(Files.readString(DIR.resolve("lantern-relay.json"),
                StandardCharsets.UTF_8)));
        for (int n = 1; n <= 6; n++) {
            AnalysisResult r = Analysis.run(f.instance(n).scenario());
            assertEquals(n, r.maxResistance(), 1e-12);
            assertEquals(2 * n, r.maxCapacitance(), 1e-12);
            assertEquals(Math.sqrt(2) * n, r.complexity(), 1e-12);
            assertEquals(4 * n, f.instance(n).scenario().edges().size());
        }
    }

    @Test
    void aBuildTemplateWithADeclaredSymmetry() {
        // OR of n variables through the formula builder, declaring every permutation (as
        // automorphisms: parallel s–t edges). Derived: OR_n with unit weights has W+ = 1, W- = n.
        String text = "{\"format\": \"spanwright-family\", \"version\": 1, \"title\": \"any of n\","
                + " \"parameter\": {\"name\": \"m\", \"sizes\": \"2..4\"},"
                + " \"symmetry\": {\"tree\": [\"$m\"], \"reason\": \"automorphism\"},"
                + " \"build\": {\"kind\": \"formula\", \"expression\": \"$[i = 1 .. m: y$i : | ]\", \"weights\": \"unit\"}}";
        FamilyTemplate f = FamilyTemplate.read(Json.parse(text));
        assertEquals("m", f.parameterName());
        FamilyInstance in = f.instance(4);
        assertEquals(4, in.scenario().variableCount());
        assertNotNull(in.symmetry());
        AnalysisResult r = Analysis.run(in.scenario());
        assertEquals(1.0, r.maxResistance(), 1e-12);
        assertEquals(4.0, r.maxCapacitance(), 1e-12);
        SweepSize s = SweepSize.build(f, 4, SweepOptions.defaults().withBounds(false, 0));
        assertTrue(String.valueOf(s.metadata().get("symmetryCheck")).startsWith("holds"), s.metadata().toString());
    }

    @Test
    void badFamilyFilesAreRefusedWithAPath() {
        ScenarioException e = assertThrows(ScenarioException.class, () -> FamilyTemplate.read(Json.parse(
                "{\"format\": \"spanwright-family\", \"version\": 1}")));
        assertTrue(e.getMessage().contains("exactly one of"), e.getMessage());
        e = assertThrows(ScenarioException.class, () -> FamilyTemplate.read(Json.parse(
                "{\"format\": \"spanwright-family\", \"version\": 2, \"build\": {}}")));
        assertEquals("$.version", e.path());
        e = assertThrows(ScenarioException.class, () -> FamilyTemplate.read(Json.parse(
                "{\"format\": \"spanwright-family\", \"version\": 1, \"build\": {}, \"colour\": 1}")));
        assertEquals("$.colour", e.path());
        // an error inside the built request names the template path and the size
        FamilyTemplate f = FamilyTemplate.read(Json.parse("{\"format\": \"spanwright-family\", \"version\": 1,"
                + " \"build\": {\"kind\": \"host\", \"family\": \"grid\", \"size\": [\"$n\", 1]}}"));
        e = assertThrows(ScenarioException.class, () -> f.instance(3));
        assertTrue(e.path().startsWith("$.build"), e.path());
        assertTrue(e.getMessage().contains("n = 3"), e.getMessage());
        // a declared symmetry whose fan-ins do not multiply to n
        FamilyTemplate g = FamilyTemplate.read(Json.parse("{\"format\": \"spanwright-family\", \"version\": 1,"
                + " \"symmetry\": {\"tree\": [2, \"$n\"]}, \"build\": {\"kind\": \"formula\", \"expression\":"
                + " \"any($[i=1..n: x$i])\"}}"));
        e = assertThrows(ScenarioException.class, () -> g.instance(3));
        assertEquals("$.symmetry.tree", e.path());
        assertEquals(Map.of(), Map.of());
    }
}
