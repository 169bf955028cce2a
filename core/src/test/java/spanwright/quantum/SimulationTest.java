package spanwright.quantum;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import spanwright.analysis.Analysis;
import spanwright.model.ScenarioException;
import spanwright.io.ScenarioReader;
import spanwright.model.Condition;
import spanwright.model.Edge;
import spanwright.model.Promise;
import spanwright.model.Scenario;

class SimulationTest {

    static List<Path> demoScenarios() throws IOException {
        List<Path> files = new ArrayList<>();
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(Path.of("..", "scenarios"), "*.json")) {
            for (Path p : ds) {
                files.add(p);
            }
        }
        files.sort(null);
        return files;
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("demoScenarios")
    void chosenBitsSeparateTheDemoScenariosAtEpsilon(Path file) throws IOException {
        // Definition of "b separates at error ε" (Simulation, docs/simulation.md), checked with an
        // independent brute force: acceptance = ‖(1/M) Σ_{k<M} U^k|0⟩‖² by matrix powers (no
        // spectrum). At the chosen b every negative input is accepted with probability ≤ ε and every
        // positive input more often than every negative one; at b − 1 that fails.
        Scenario sc = ScenarioReader.read(Files.readString(file, StandardCharsets.UTF_8));
        double eps = 0.1;
        SimulationResult r = Simulation.run(sc, SimulationOptions.defaults().withEpsilon(eps));
        assertTrue(r.bits > 0, file + ": " + r.bitsReason);
        assertEquals(r.maxResistance, r.alpha2, 0.0, "default alpha² = W+");
        SpanProgramUnitary u = new SpanProgramUnitary(sc, r.alpha2);
        for (int b : new int[] {r.bits, r.bits - 1}) {
            if (b < 1) {
                continue;
            }
            double minPos = Double.POSITIVE_INFINITY;
            double maxNeg = Double.NEGATIVE_INFINITY;
            for (InputSimulation x : r.inputs()) {
                double p = QuantumNets.acceptanceByPowers(u.unitary(Analysis.presentEdges(sc, x.mask)), b);
                assertEquals(p, x.acceptance(b), 1e-10, x.input + " b " + b);
                if (x.positive) {
                    minPos = Math.min(minPos, p);
                } else {
                    maxNeg = Math.max(maxNeg, p);
                }
            }
            boolean separates = maxNeg <= eps && minPos > maxNeg;
            assertEquals(b == r.bits, separates, file + " b " + b + ": minPos " + minPos + ", maxNeg " + maxNeg);
        }
        // costs follow from the bits (definitions): 2^b − 1 queries per run, ⌈log₂(|E|+1)⌉ + b qubits
        assertEquals((1L << r.bits) - 1, r.queries);
        assertEquals(r.stateQubits + r.bits, r.qubits);
        assertEquals(32 - Integer.numberOfLeadingZeros(r.edges), r.stateQubits); // ⌈log₂(m+1)⌉ (derived)
        assertNotNull(r.repetition);
        assertEquals(r.repetition.runs * r.queries, r.totalQueries);
        // positive acceptance never falls below the phase-zero floor α²/(α²+W₊) = 1/2 (derived)
        for (double p : r.minPositiveAcceptance()) {
            assertTrue(p >= 0.5 - 1e-12);
        }
    }

    @Test
    @Tag("slow") // 61 simulations, about 2 s
    void orQueriesGrowAsSquareRootOfN() {
        // Common practice, no source (Grover-type scaling): OR_n under the promise |x| ∈ {0, 1}, so
        // W₊ = 1 and W₋ = n; at fixed ε the queries grow as Θ(√n). Fit of log q against log n on
        // n = 4 … 64, exponent 0.5 ± 0.15. Also the closed form (derived in SpectrumTest): the only
        // negative input puts all its weight on 2 arctan(1/√n) (α² = 1), so the bits are the least b
        // with F_{2^b}(2 arctan(1/√n)) ≤ ε.
        double eps = 0.1;
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        int count = 0;
        for (int n = 4; n <= 64; n++) {
            Scenario sc = QuantumNets.orAtMostOne(n);
            SimulationResult r = Simulation.run(sc, SimulationOptions.defaults().withEpsilon(eps));
            assertEquals(1.0, r.maxResistance, 1e-12);
            assertEquals(n, r.maxCapacitance, 1e-9);
            int expected = 1;
            while (PhaseEstimation.fejer(2 * Math.atan(1 / Math.sqrt(n)), expected) > eps) {
                expected++;
            }
            assertEquals(expected, r.bits, "n " + n);
            double lx = Math.log(n);
            double ly = Math.log(r.queries);
            sx += lx;
            sy += ly;
            sxx += lx * lx;
            sxy += lx * ly;
            count++;
        }
        double slope = (count * sxy - sx * sy) / (count * sxx - sx * sx);
        assertTrue(Math.abs(slope - 0.5) <= 0.15, "fitted exponent " + slope);
    }

    @Test
    void textbookPrecisionAndItsLemmaBound() {
        // Definitions: Θ = 1/(2√(W₊W₋)); its bits are the least b with 2π/2^b ≤ Θ. The effective
        // spectral gap lemma (Lee et al. 2011, arXiv:1011.3020) bounds each negative input's weight
        // on |θ| ≤ Θ by (Θ²/4)(1 + α²C) ≤ (Θ²/4)(1 + α²W₋).
        Scenario sc = QuantumNets.or(9, Promise.weights(new int[] {0, 1}));
        SimulationResult r = Simulation.run(sc, SimulationOptions.defaults());
        SimulationResult.Textbook t = r.textbook;
        assertNotNull(t);
        assertEquals(1 / (2 * Math.sqrt(9)), t.theta, 1e-12);
        assertTrue(2 * Math.PI / (1L << t.bits) <= t.theta);
        assertTrue(2 * Math.PI / (1L << (t.bits - 1)) > t.theta);
        assertEquals((1L << t.bits) - 1, t.queries);
        assertEquals(t.theta * t.theta / 4 * (1 + 9), t.negativeWeightBound, 1e-12);
        for (InputSimulation x : r.inputs()) {
            if (!x.positive) {
                assertTrue(x.weightWithin(t.theta) <= t.negativeWeightBound + 1e-12);
            }
        }
        assertEquals(0.5, t.positiveFloor, 1e-12);
    }

    @Test
    void focusKeepsTheWholeSpectrumAndMayLieOutsideTheDomain() {
        // OR_3 under |x| ≤ 1: the input 111 is outside the domain but can still be looked at.
        Scenario sc = QuantumNets.or(3, Promise.weights(new int[] {0, 1}));
        SimulationResult r = Simulation.run(sc, SimulationOptions.defaults().withFocus(0b111));
        InputSimulation f = r.focus();
        assertNotNull(f);
        assertFalse(f.inDomain);
        assertTrue(f.positive);
        assertEquals(4, f.spectrumPhases().length);
        // three parallel unit edges: R = 1/3, weight α²/(α² + 1/3) with α² = W₊ = 1 (derived)
        assertEquals(1 / (1 + 1.0 / 3), f.phaseZeroWeight, 1e-12);
        assertEquals(4, r.inputs().size());
    }

    @Test
    void oneSidedDomainsGiveAReasonNotAnException() {
        // A network whose s and t are always joined: no negative input, nothing to separate.
        Scenario always = new Scenario("always", "", List.of("a"), null, null, Promise.NONE,
                QuantumNets.or(1, null).vertices(), 0, 1,
                List.of(new Edge("e1", 0, 1, Condition.ALWAYS, 2.0)), null);
        SimulationResult r = Simulation.run(always, SimulationOptions.defaults());
        assertEquals(0, r.bits);
        assertTrue(r.bitsReason.contains("no negative inputs"), r.bitsReason);
        assertNull(r.repetition);
        assertEquals(-1, r.queries);
        assertEquals(-1, r.qubits);
        assertNull(r.textbook);
        assertTrue(Double.isNaN(r.maxCapacitance));
        assertEquals(2.0, r.alpha2, 0.0);
        // no positive input: α² falls back to 1, and says so
        Scenario never = always.withEdges(List.of());
        SimulationResult n = Simulation.run(never, SimulationOptions.defaults());
        assertEquals(1.0, n.alpha2, 0.0);
        assertEquals("1 (no positive inputs)", n.alpha2Source);
        assertEquals(0, n.bits);
        assertEquals(0, n.edges);
        assertEquals(0, n.stateQubits);
    }

    @Test
    void selfLoopsAreLeftOutOfTheSpace() {
        // As in the analysis: a self-loop carries no current and Ã maps it to 0; it is not a
        // coordinate of the simulated space (documented choice).
        Scenario or2 = QuantumNets.or(2, null);
        List<Edge> edges = new ArrayList<>(or2.edges());
        edges.add(new Edge("loop", 0, 0, Condition.literal(0, "x1", true), 1.0));
        SimulationResult r = Simulation.run(or2.withEdges(edges), SimulationOptions.defaults());
        SimulationResult plain = Simulation.run(or2, SimulationOptions.defaults());
        assertEquals(2, r.edges);
        assertEquals(plain.bits, r.bits);
        for (int i = 0; i < r.inputs().size(); i++) {
            assertEquals(plain.inputs().get(i).acceptance(3), r.inputs().get(i).acceptance(3), 1e-12);
        }
    }

    @Test
    void sizeGuardAndOptionsGiveClearMessages() {
        Scenario big = QuantumNets.or(Simulation.MAX_EDGES + 1, Promise.weights(new int[] {0}));
        ScenarioException e = assertThrows(ScenarioException.class,
                () -> Simulation.run(big, SimulationOptions.defaults()));
        assertEquals("too-large-to-simulate", e.code());
        assertEquals("$.graph.edges", e.path());
        assertTrue(e.getMessage().contains("at most " + Simulation.MAX_EDGES + " edges"), e.getMessage());

        Scenario wide = QuantumNets.or(17, null);
        e = assertThrows(ScenarioException.class, () -> Simulation.run(wide, SimulationOptions.defaults()));
        assertEquals("too-large-to-simulate", e.code());
        assertEquals("$.variables", e.path());
        assertTrue(e.getMessage().contains("131072"), e.getMessage());

        // 300 parallel edges over 10 variables (edge i on variable i mod 10), promise |x| ≤ 9:
        // 1023 inputs × 301³ > MAX_WORK
        List<Edge> many = new ArrayList<>();
        Scenario ten = QuantumNets.or(10, null);
        for (int i = 0; i < 300; i++) {
            many.add(new Edge("e" + i, 0, 1, ten.edges().get(i % 10).when(), 1.0));
        }
        Scenario heavy = new Scenario("heavy", "", ten.variables(), null, null,
                Promise.weights(new int[] {0, 1, 2, 3, 4, 5, 6, 7, 8, 9}), ten.vertices(), 0, 1, many, null);
        e = assertThrows(ScenarioException.class, () -> Simulation.run(heavy, SimulationOptions.defaults()));
        assertEquals("too-large-to-simulate", e.code());
        assertEquals("$.promise", e.path());
        assertTrue(e.getMessage().contains("too much work"), e.getMessage());

        Scenario small = QuantumNets.or(2, null);
        e = assertThrows(ScenarioException.class,
                () -> Simulation.run(small, SimulationOptions.defaults().withEpsilon(1.5)));
        assertEquals("$options.epsilon", e.path());
        e = assertThrows(ScenarioException.class,
                () -> Simulation.run(small, SimulationOptions.defaults().withAlpha2(-1)));
        assertEquals("$options.alpha2", e.path());
    }

    @Test
    void aGivenAlphaIsUsedAndLargerAlphaRaisesThePositiveFloor() {
        // Derived: the positive floor is α²/(α² + W₊), so α² = 9 W₊ gives 0.9.
        Scenario sc = QuantumNets.or(4, Promise.weights(new int[] {0, 1}));
        SimulationResult r = Simulation.run(sc, SimulationOptions.defaults().withAlpha2(9));
        assertEquals("given", r.alpha2Source);
        for (InputSimulation x : r.inputs()) {
            if (x.positive) {
                assertEquals(0.9, x.phaseZeroWeight, 1e-12);
            }
        }
    }

    @Test
    void randomScenariosStayWithinTheLemmaAndAreOrthogonal() {
        // The run's own checks, against the lemma (≤ 1) and the identity UᵀU = I.
        Random rnd = new Random(8);
        for (int trial = 0; trial < 4; trial++) {
            Scenario sc = QuantumNets.random(rnd, 6, 8, 14);
            SimulationResult r = Simulation.run(sc, SimulationOptions.defaults());
            assertTrue(r.orthogonalityDefect < 1e-12);
            if (r.negativeCount > 0) {
                assertTrue(r.lemmaWorstRatio <= 1 + 1e-9, "ratio " + r.lemmaWorstRatio);
            }
            DMatrixRMaj dummy = new SpanProgramUnitary(sc, r.alpha2).unitary(Analysis.presentEdges(sc, 0));
            assertEquals(r.edges + 1, dummy.numRows);
        }
    }

    @Test
    void oneInputIsSimulatedAtAnyDomainSize() {
        // OR_20 (20 parallel unit edges, 2^20 inputs > MAX_INPUTS): with an input in focus only that
        // input is simulated. α² = W₊ = 1 (one edge present, R = 1; by structure). Derived closed forms
        // (docs/simulation.md, "Why it works", after Belovs & Reichardt, arXiv:1203.2603):
        // input with k ones: R = 1/k, phase-zero weight α²/(α² + R) = 1/(1 + 1/k);
        // input 0…0: all of |0⟩'s weight on |θ| = 2 arctan(1/(α√n)).
        Scenario or20 = QuantumNets.or(20, null);
        long three = 0b111L << 5;
        SimulationResult r = Simulation.run(or20, SimulationOptions.defaults().withFocus(three));
        assertEquals(SimulationResult.INPUT, r.scope);
        assertTrue(r.scopeReason.contains("at most " + Simulation.MAX_INPUTS + " inputs")
                && r.scopeReason.contains("1048576"), r.scopeReason);
        assertEquals(1.0, r.alpha2, 1e-12);
        assertEquals("W+ by structure", r.alpha2Source);
        assertEquals(1 << 20, r.domainSize);
        assertEquals(0, r.bits);
        assertEquals(-1, r.positiveCount);
        assertTrue(r.inputs().isEmpty());
        InputSimulation f = r.focus();
        assertTrue(f.positive && f.inDomain);
        assertEquals(1.0 / 3, f.witnessSize, 1e-12);
        assertEquals(1 / (1 + 1.0 / 3), f.phaseZeroWeight, 1e-12);
        assertEquals(21, f.spectrumPhases().length);

        SimulationResult zero = Simulation.run(or20, SimulationOptions.defaults().withFocus(0));
        double theta = 2 * Math.atan(1 / Math.sqrt(20));
        double[] p = zero.focus().spectrumPhases();
        double[] w = zero.focus().spectrumWeights();
        double near = 0;
        for (int k = 0; k < p.length; k++) {
            if (Math.abs(p[k] - theta) < 1e-9) {
                near += w[k];
            }
        }
        assertEquals(1.0, near, 1e-9);
        assertFalse(zero.focus().positive);

        // The same input in a whole-domain run (a listed promise of three inputs, α² given alike)
        // has the same U(x), hence the same acceptance curve (consistency of the two paths).
        SimulationResult listed = Simulation.run(QuantumNets.or(20, Promise.inputs(new long[] {0, 1, three})),
                SimulationOptions.defaults().withAlpha2(1).withFocus(three));
        assertEquals(SimulationResult.DOMAIN, listed.scope);
        for (int b = 1; b <= PhaseEstimation.MAX_BITS; b++) {
            assertEquals(listed.focus().acceptance(b), f.acceptance(b), 1e-12, "b = " + b);
        }

        // Without an input in focus the refusal names the limit and the way out.
        ScenarioException e = assertThrows(ScenarioException.class,
                () -> Simulation.run(or20, SimulationOptions.defaults()));
        assertTrue(e.getMessage().contains("simulate one input"), e.getMessage());
    }

    @Test
    void oneInputNeverListsTheDomain() {
        // 70 variables: no mask, and a cube no domain can list (InputDomain refuses beyond 30
        // variables), so a result at all shows the domain was not built. A given α² (here 2) needs
        // no analysis: phase-zero weight α²/(α² + R) with R = 1/k for k ones (derived as above).
        Scenario or70 = QuantumNets.or(70, null);
        boolean[] x = new boolean[70];
        x[3] = true;
        x[69] = true;
        SimulationResult r = Simulation.run(or70, SimulationOptions.defaults().withAlpha2(2).withFocusBits(x));
        assertEquals(SimulationResult.INPUT, r.scope);
        assertEquals("given", r.alpha2Source);
        assertEquals(-1, r.domainSize);
        assertEquals(-1, r.focus().mask);
        assertEquals(70, r.focus().input.length());
        assertEquals('1', r.focus().input.charAt(69));
        assertEquals(2 / (2 + 0.5), r.focus().phaseZeroWeight, 1e-12);
        assertEquals(7, r.stateQubits); // ⌈log₂ 71⌉ (derived)

        // Too many edges for one input either: the limit and what to try instead.
        Scenario big = QuantumNets.or(Simulation.MAX_EDGES + 1, null);
        ScenarioException e = assertThrows(ScenarioException.class,
                () -> Simulation.run(big, SimulationOptions.defaults().withFocusBits(new boolean[Simulation.MAX_EDGES + 1])));
        assertEquals("$.graph.edges", e.path());
        assertTrue(e.getMessage().contains("at most " + Simulation.MAX_EDGES + " edges, even for one input")
                && e.getMessage().contains("analyze --input"), e.getMessage());
    }
}
