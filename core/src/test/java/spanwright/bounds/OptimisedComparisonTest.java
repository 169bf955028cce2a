package spanwright.bounds;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import spanwright.io.ScenarioReader;
import spanwright.model.Scenario;

class OptimisedComparisonTest {
    private static Scenario demo(String name) throws Exception {
        return ScenarioReader.read(Files.readString(Path.of("..", "scenarios", name)));
    }

    @Test
    void optimisedWeightsNeverBeatTheAdversaryBound() throws Exception {
        // Reichardt, SODA 2011, arXiv:1005.1601: every st-connectivity graph deciding f is a span
        // program, so √(W+W-) ≥ ADV±(f) for any weights — also for the optimiser's weights.
        for (String name : new String[] {"default.json", "ferry-bridge.json", "inverter-ladder.json"}) {
            BoundsReport r = Bounds.compute(demo(name), Bounds.Limits.CLI);
            assertTrue(r.optimisedGap() >= 1 - Bounds.GAP_TOLERANCE, name + ": " + r.optimisedGap());
            assertTrue(r.optimisedComplexity() <= r.complexity() * (1 + 1e-12), name);
        }
    }

    @Test
    void readOnceDefaultReachesTheBound() throws Exception {
        // Published: ADV = ADV± = √N for read-once AND/OR formulas (Barnum & Saks 2004; Høyer, Lee
        // & Špalek 2005, arXiv:quant-ph/0509067); the default scenario is (n1&n2)|(s1&s2)|(p&q)
        // on N = 6 as a series–parallel graph, which attains it with suitable weights.
        BoundsReport r = Bounds.compute(demo("default.json"), Bounds.Limits.CLI);
        assertEquals(Math.sqrt(6), r.optimisedComplexity(), 1e-7);
        assertEquals(1.0, r.optimisedGap(), 1e-6);
    }
}
