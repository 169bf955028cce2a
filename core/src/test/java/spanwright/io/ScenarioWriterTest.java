package spanwright.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import spanwright.model.Condition;
import spanwright.model.Edge;
import spanwright.model.Promise;
import spanwright.model.Scenario;
import spanwright.model.Vertex;

/**
 * ScenarioWriter is the reader's inverse. Source for every check: the format's contract
 * (docs/scenario-format.md) — read(write(x)) equals x field for field — on hand-made cases and
 * seeded random scenarios.
 */
class ScenarioWriterTest {

    @Test
    void demoScenariosRoundTrip() throws IOException {
        // Contract check on the project's own demo files (read, write, read again: equal).
        try (Stream<Path> files = Files.list(Path.of("..", "scenarios"))) {
            List<Path> list = new ArrayList<>();
            files.filter(p -> p.toString().endsWith(".json")).forEach(list::add);
            assertFalse(list.isEmpty());
            for (Path p : list) {
                Scenario sc = ScenarioReader.read(Files.readString(p, StandardCharsets.UTF_8));
                RoundTrip.check(sc);
            }
        }
    }

    @Test
    void everyPromiseKindAndOptionalFieldRoundTrips() {
        // Contract check: each promise kind, missing and partial positions, weight 1 left out,
        // groups and locks, a self-loop (kept in the file), quotes and non-ASCII text.
        List<String> vars = List.of("a", "b", "c.2");
        List<Vertex> vs = List.of(new Vertex("s", 0, -0.5), new Vertex("m"), new Vertex("t\"x", 1e-7, Double.NaN));
        List<Edge> es = List.of(new Edge("e1", 0, 1, Condition.literal(0, "a", true), 1.0),
                new Edge("e2", 1, 2, Condition.literal(1, "b", false), 0.1 + 0.2, "g1", false),
                new Edge("e3", 0, 2, Condition.ALWAYS, 3.0, null, true),
                new Edge("loop", 1, 1, Condition.literal(2, "c.2", true), 2.5));
        Promise[] promises = {Promise.NONE, Promise.expression("a | b", spanwright.expr.ExprParser.parse("a | b", vars)),
            Promise.weights(new int[] {2, 0}), Promise.inputs(new long[] {5, 1, 7})};
        for (Promise p : promises) {
            Scenario sc = new Scenario("Täst \"quoted\" ✓", "line one\nline two", vars, "a & !b | c.2",
                    spanwright.expr.ExprParser.parse("a & !b | c.2", vars), p, vs, 0, 2, es, null);
            Scenario back = RoundTrip.check(sc);
            assertEquals(1, back.warnings().size(), "the self-loop is reported again on reading");
        }
    }

    @Test
    void weightOneAndMissingPositionsAreLeftOut() {
        // Contract: defaults are not written (weight 1, no position, no group, not locked).
        Scenario sc = new Scenario("", "", List.of("a"), null, null, Promise.NONE,
                List.of(new Vertex("s"), new Vertex("t")), 0, 1,
                List.of(new Edge("e1", 0, 1, Condition.literal(0, "a", true), 1.0)), null);
        String text = ScenarioWriter.write(sc);
        assertFalse(text.contains("weight"), text);
        assertFalse(text.contains("\"x\""), text);
        assertFalse(text.contains("group"), text);
        assertTrue(text.contains("\"function\": null"), text);
        RoundTrip.check(sc);
    }

    @Test
    void seededRandomScenariosRoundTrip() {
        // Contract check on 200 seeded random scenarios with awkward doubles (subnormal, huge,
        // many digits) as weights and positions.
        Random rnd = new Random(4417L);
        for (int trial = 0; trial < 200; trial++) {
            int n = 1 + rnd.nextInt(6);
            List<String> vars = new ArrayList<>();
            for (int i = 0; i < n; i++) {
                vars.add("v" + i);
            }
            int nv = 2 + rnd.nextInt(6);
            List<Vertex> vs = new ArrayList<>();
            for (int i = 0; i < nv; i++) {
                vs.add(rnd.nextBoolean() ? new Vertex("n" + i) : new Vertex("n" + i, awkward(rnd), awkward(rnd)));
            }
            List<Edge> es = new ArrayList<>();
            int ne = rnd.nextInt(10);
            for (int i = 0; i < ne; i++) {
                int x = rnd.nextInt(n + 1);
                Condition c = x == n ? Condition.ALWAYS : Condition.literal(x, vars.get(x), rnd.nextBoolean());
                // weights: awkward digits at both ends of the accepted range and inside it
                double w = Math.min(Edge.MAX_WEIGHT, Math.abs(awkward(rnd)) * 1e-200 + Edge.MIN_WEIGHT);
                es.add(new Edge("e" + i, rnd.nextInt(nv), rnd.nextInt(nv), c, w));
            }
            Scenario sc = new Scenario("t" + trial, "", vars, null, null, Promise.NONE, vs, 0, nv - 1, es, null);
            RoundTrip.check(sc);
        }
    }

    private static double awkward(Random rnd) {
        switch (rnd.nextInt(5)) {
            case 0:
                return rnd.nextDouble();
            case 1:
                return rnd.nextGaussian() * 1e300;
            case 2:
                return Double.MIN_VALUE * (1 + rnd.nextInt(1000));
            case 3:
                return rnd.nextInt(1000) - 500;
            default:
                return 1.0 / 3.0 * rnd.nextInt(100);
        }
    }
}
