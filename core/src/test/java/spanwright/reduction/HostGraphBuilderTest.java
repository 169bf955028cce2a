package spanwright.reduction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.function.Supplier;
import org.jgrapht.Graph;
import org.jgrapht.alg.connectivity.ConnectivityInspector;
import org.jgrapht.graph.builder.GraphTypeBuilder;
import org.junit.jupiter.api.Test;
import spanwright.analysis.Analysis;
import spanwright.analysis.AnalysisResult;
import spanwright.io.RoundTrip;
import spanwright.model.ScenarioException;
import spanwright.io.ScenarioReader;
import spanwright.model.Edge;
import spanwright.model.Scenario;

class HostGraphBuilderTest {

    private static Built host(String family, int... size) {
        return HostGraphBuilder.family(family, size, null, null, 1, -1);
    }

    /** s–t connectivity of the present edges by JGraphT (an independent implementation). */
    private static boolean jgraphtConnected(Scenario sc, long mask) {
        int[] next = {0};
        Supplier<Integer> es = () -> next[0]++;
        Graph<Integer, Integer> g = GraphTypeBuilder.<Integer, Integer>undirected().allowingMultipleEdges(true)
                .allowingSelfLoops(true).edgeSupplier(es).buildGraph();
        for (int v = 0; v < sc.vertexCount(); v++) {
            g.addVertex(v);
        }
        for (Edge e : sc.edges()) {
            if (e.when().holds(mask, sc.variableCount())) {
                g.addEdge(e.u(), e.v());
            }
        }
        return new ConnectivityInspector<>(g).pathExists(sc.s(), sc.t());
    }

    @Test
    void everyFamilyDecidesConnectivityOnEveryInput() {
        // Source: independent computation — the path function agrees with the analysis's
        // connectivity (reduction check) and, input by input, with JGraphT's ConnectivityInspector.
        Built[] hosts = {host("path", 5), host("cycle", 6), host("grid", 3, 3), host("complete", 5),
            host("bipartite", 2, 3), host("hypercube", 3), HostGraphBuilder.family("random", new int[] {7, 10}, null, null, 42, -1),
            HostGraphBuilder.family("random", new int[] {9, 8}, null, null, 7, -1)};
        for (Built b : hosts) {
            Scenario sc = b.scenario();
            AnalysisResult r = Analysis.run(sc);
            assertEquals(Boolean.TRUE, r.correct(), sc.title());
            for (int i = 0; i < r.domainSize(); i++) {
                assertEquals(jgraphtConnected(sc, r.input(i)), r.connected(i), sc.title() + " " + r.inputString(i));
            }
            RoundTrip.check(sc);
        }
    }

    @Test
    void familiesHaveTheirHandbookSizes() {
        // Common practice, no source (graph theory handbook counts): path P_n has n−1 edges, cycle
        // C_n n, grid k×l k(l−1)+l(k−1), K_n n(n−1)/2, K_{a,b} ab, hypercube Q_d d·2^(d−1) edges on
        // 2^d vertices.
        assertEquals(4, host("path", 5).scenario().edges().size());
        assertEquals(6, host("cycle", 6).scenario().edges().size());
        assertEquals(17, host("grid", 3, 4).scenario().edges().size());
        assertEquals(12, host("grid", 3, 4).scenario().vertexCount());
        assertEquals(10, host("complete", 5).scenario().edges().size());
        assertEquals(6, host("bipartite", 2, 3).scenario().edges().size());
        assertEquals(12, host("hypercube", 3).scenario().edges().size());
        assertEquals(8, host("hypercube", 3).scenario().vertexCount());
    }

    @Test
    void vertexNamesMatchTheStructure() {
        // Derived from the definitions: grid neighbours differ by one in exactly one coordinate;
        // hypercube neighbours differ in exactly one bit; bipartite edges join the two sides;
        // cycle edges join consecutive vertices.
        Scenario grid = host("grid", 3, 4).scenario();
        for (Edge e : grid.edges()) {
            int[] a = rc(grid.vertices().get(e.u()).id());
            int[] b = rc(grid.vertices().get(e.v()).id());
            assertEquals(1, Math.abs(a[0] - b[0]) + Math.abs(a[1] - b[1]), e.id());
            // positions follow the names
            assertEquals((a[1] - 1) * 100.0, grid.vertices().get(e.u()).x(), 1e-9);
        }
        assertEquals("r1c1", grid.vertices().get(grid.s()).id());
        assertEquals("r3c4", grid.vertices().get(grid.t()).id());
        Scenario cube = host("hypercube", 3).scenario();
        for (Edge e : cube.edges()) {
            String a = cube.vertices().get(e.u()).id();
            String b = cube.vertices().get(e.v()).id();
            int diff = 0;
            for (int i = 1; i < a.length(); i++) {
                diff += a.charAt(i) != b.charAt(i) ? 1 : 0;
            }
            assertEquals(1, diff, a + " " + b);
        }
        assertEquals("h000", cube.vertices().get(cube.s()).id());
        assertEquals("h111", cube.vertices().get(cube.t()).id());
        Scenario bip = host("bipartite", 2, 3).scenario();
        for (Edge e : bip.edges()) {
            assertNotEquals(bip.vertices().get(e.u()).id().charAt(0), bip.vertices().get(e.v()).id().charAt(0));
        }
        Scenario cyc = host("cycle", 6).scenario();
        for (Edge e : cyc.edges()) {
            int a = Integer.parseInt(cyc.vertices().get(e.u()).id().substring(1));
            int b = Integer.parseInt(cyc.vertices().get(e.v()).id().substring(1));
            assertTrue(Math.abs(a - b) == 1 || Math.abs(a - b) == 5, a + "-" + b);
        }
        assertEquals("v4", cyc.vertices().get(cyc.t()).id(), "opposite vertex of C_6");
        // variable names derive from the endpoints
        assertEquals("r1c1_r1c2", grid.variables().get(0));
    }

    private static int[] rc(String id) {
        int c = id.indexOf('c');
        return new int[] {Integer.parseInt(id.substring(1, c)), Integer.parseInt(id.substring(c + 1))};
    }

    @Test
    void pathAndCycleWitnessSizes() {
        // Derived: a path of n−1 unit edges has W₊ = n−1 (all present, series) and W₋ = 1 (one
        // absent edge, the rest shorted) — the AND gadget. A cycle of 2k vertices with s, t
        // opposite: W₊ = k (one side intact, the other broken), W₋ = 2 (each side broken once:
        // two unit capacitors in parallel).
        AnalysisResult path = Analysis.run(host("path", 6).scenario());
        assertEquals(5.0, path.maxResistance(), 1e-12);
        assertEquals(1.0, path.maxCapacitance(), 1e-12);
        AnalysisResult cycle = Analysis.run(host("cycle", 8).scenario());
        assertEquals(4.0, cycle.maxResistance(), 1e-12);
        assertEquals(2.0, cycle.maxCapacitance(), 1e-12);
    }

    @Test
    void randomHostIsSeededAndSimple() {
        // Contract: the same seed gives the same graph; m distinct pairs, no self-loops.
        Scenario a = HostGraphBuilder.family("random", new int[] {10, 15}, null, null, 123, -1).scenario();
        Scenario b = HostGraphBuilder.family("random", new int[] {10, 15}, null, null, 123, -1).scenario();
        Scenario c = HostGraphBuilder.family("random", new int[] {10, 15}, null, null, 124, -1).scenario();
        assertEquals(a.variables(), b.variables());
        assertNotEquals(a.variables(), c.variables());
        Set<String> pairs = new HashSet<>();
        for (Edge e : a.edges()) {
            assertTrue(e.u() != e.v());
            assertTrue(pairs.add(Math.min(e.u(), e.v()) + "-" + Math.max(e.u(), e.v())));
        }
        assertEquals(15, pairs.size());
        // dense case (more than half the pairs, sampled as a complement): K_6 minus 3 edges
        assertEquals(12, HostGraphBuilder.family("random", new int[] {6, 12}, null, null, 5, -1).scenario().edges().size());
    }

    @Test
    void splitMixMatchesItsReferenceStream() {
        // From memory: the SplitMix64 reference stream for seed 0 starts 0xE220A8397B1DCDAF,
        // 0x6E789E6AA1B965F4 (Steele, Lea & Flood, OOPSLA 2014; widely reproduced test vector).
        long[] state = {0};
        assertEquals(0xE220A8397B1DCDAFL, HostGraphBuilder.splitMix(state));
        assertEquals(0x6E789E6AA1B965F4L, HostGraphBuilder.splitMix(state));
    }

    @Test
    void atMostMissingPromise() {
        // Derived: "at most k of m edges missing" allows Hamming weights m−k..m, so the domain has
        // Σ_{j≤k} C(m, j) inputs: grid 2×3 has 7 edges, k = 2 gives 1 + 7 + 21 = 29.
        Built b = HostGraphBuilder.family("grid", new int[] {2, 3}, null, null, 1, 2);
        AnalysisResult r = Analysis.run(b.scenario());
        assertEquals(29, r.domainSize());
        assertEquals(Boolean.TRUE, r.correct());
        RoundTrip.check(b.scenario());
    }

    @Test
    void givenHostKeepsItsDrawingAndNamesParallelEdges() {
        // Contract: a user's host keeps ids, positions and weights; every edge gets its own
        // variable, a second parallel edge "u_v.2"; self-loops are dropped.
        String text = "{\"format\":\"spanwright-scenario\",\"version\":1,\"variables\":[\"q\"],\"graph\":{\"s\":\"home\","
                + "\"t\":\"mill-2\",\"vertices\":[{\"id\":\"home\",\"x\":0,\"y\":0},{\"id\":\"ford\",\"x\":50,\"y\":10},"
                + "{\"id\":\"mill-2\",\"x\":100,\"y\":0}],\"edges\":[{\"id\":\"lane\",\"u\":\"home\",\"v\":\"ford\",\"when\":\"q\"},"
                + "{\"id\":\"bridge\",\"u\":\"ford\",\"v\":\"mill-2\",\"when\":\"1\",\"weight\":2},"
                + "{\"id\":\"boat\",\"u\":\"ford\",\"v\":\"mill-2\",\"when\":\"!q\"},"
                + "{\"id\":\"loop\",\"u\":\"ford\",\"v\":\"ford\",\"when\":\"q\"}]}}";
        Scenario given = ScenarioReader.read(text);
        Built b = HostGraphBuilder.given(given, null, null, -1);
        Scenario sc = b.scenario();
        assertEquals(List.of("home_ford", "ford_mill_2", "ford_mill_2.2"), sc.variables());
        assertEquals("bridge", sc.edges().get(1).id());
        assertEquals(2.0, sc.edges().get(1).weight());
        assertEquals(50.0, sc.vertices().get(1).x());
        assertEquals(3, sc.edges().size());
        assertEquals(Boolean.TRUE, Analysis.run(sc).correct());
        assertTrue(sc.connectivity().ownGraph(), "the function is s-t connectivity of the graph, not a list of paths");
    }

    @Test
    void theFunctionIsConnectivityAndThePathCountAStatistic() {
        // Derived: K_7 has Σ_{k=0..5} 5!/(5−k)! = 326 simple paths between two vertices, more than
        // the 256 the statistic counts; the function is the connectivity form either way.
        Built b = host("complete", 7);
        assertNull(b.stats().get("paths"));
        assertTrue(b.scenario().connectivity().ownGraph());
        // K_6: Σ_{k=0..4} 4!/(4−k)! = 1 + 4 + 12 + 24 + 24 = 65 paths
        assertEquals(65, host("complete", 6).stats().get("paths"));
    }

    @Test
    void impossibleParametersAreNamed() {
        // Common practice, no source: each refusal names the family, the parameter and the bound.
        ScenarioException grid = assertThrows(ScenarioException.class, () -> host("grid", 1, 4));
        assertEquals("$.size", grid.path());
        assertTrue(grid.getMessage().contains("a single row is a path"), grid.getMessage());
        assertThrows(ScenarioException.class, () -> host("cycle", 2));
        assertThrows(ScenarioException.class, () -> host("path", 1));
        assertThrows(ScenarioException.class, () -> host("hypercube", 0));
        assertThrows(ScenarioException.class, () -> host("bipartite", 0, 3));
        ScenarioException random = assertThrows(ScenarioException.class, () -> host("random", 4, 7));
        assertTrue(random.getMessage().contains("n(n-1)/2 = 6"), random.getMessage());
        // beyond enumeration the builder still builds (the analysis then works by structure) ...
        assertEquals(40, host("grid", 5, 5).scenario().variableCount());
        assertEquals(32, host("hypercube", 4).scenario().variableCount());
        // ... up to the reader's limit of 4096 variables: K_100 has 4950 edges
        ScenarioException big = assertThrows(ScenarioException.class, () -> host("complete", 100));
        assertEquals("too-many-variables", big.code());
        assertTrue(big.getMessage().contains("4950 edges"), big.getMessage());
        // with a promise the domain is enumerated, so the enumeration limit applies
        ScenarioException promised = assertThrows(ScenarioException.class,
                () -> HostGraphBuilder.family("grid", new int[] {5, 5}, null, null, 1, 2));
        assertEquals("too-many-variables", promised.code());
        ScenarioException arity = assertThrows(ScenarioException.class, () -> host("grid", 3));
        assertTrue(arity.getMessage().contains("two sizes"), arity.getMessage());
        ScenarioException family = assertThrows(ScenarioException.class, () -> host("torus", 3, 3));
        assertEquals("$.family", family.path());
        ScenarioException s = assertThrows(ScenarioException.class,
                () -> HostGraphBuilder.family("grid", new int[] {2, 2}, "r9c9", null, 1, -1));
        assertEquals("$.s", s.path());
        ScenarioException same = assertThrows(ScenarioException.class,
                () -> HostGraphBuilder.family("grid", new int[] {2, 2}, "r1c1", "r1c1", 1, -1));
        assertEquals("same-s-t", same.code());
        ScenarioException promise = assertThrows(ScenarioException.class,
                () -> HostGraphBuilder.family("path", new int[] {3}, null, null, 1, 5));
        assertEquals("$.atMostMissing", promise.path());
    }
}
