package spanwright.analysis;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import spanwright.domain.InputDomain;
import spanwright.electric.ElectricalNetwork;
import spanwright.model.Condition;
import spanwright.model.Edge;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;
import spanwright.model.Vertex;

/**
 * Mergeable summaries: a split domain merges bit for bit into one pass, and the maxima, worst
 * inputs, counts and histograms agree with an independent brute-force pass written here (one
 * {@link ElectricalNetwork} per input, values kept in an array, the first input within the tie
 * tolerance found by a scan — the rule of the "Core engine" issue).
 */
class SummaryTest {

    /** Independent reference: every value, then max and first-near by scanning. */
    static final class Reference {
        double maxR = Double.NaN;
        double maxC = Double.NaN;
        long worstP = -1;
        long worstN = -1;
        long pos;
        long neg;
        long ce;
        List<Long> ceList = new ArrayList<>();

        Reference(Scenario sc, long from, long to) {
            InputDomain d = InputDomain.of(sc);
            ElectricalNetwork net = new ElectricalNetwork(sc);
            double[] v = new double[(int) (to - from)];
            boolean[] c = new boolean[v.length];
            long[] x = new long[v.length];
            for (long k = from; k < to; k++) {
                int i = (int) (k - from);
                x[i] = d.get(k);
                boolean[] p = Analysis.presentEdges(sc, x[i]);
                c[i] = net.connected(p);
                v[i] = net.witnessSize(p);
                if (c[i]) {
                    pos++;
                    maxR = Double.isNaN(maxR) ? v[i] : Math.max(maxR, v[i]);
                } else {
                    neg++;
                    maxC = Double.isNaN(maxC) ? v[i] : Math.max(maxC, v[i]);
                }
                if (sc.function() != null && sc.function().eval(x[i]) != c[i]) {
                    ce++;
                    if (ceList.size() < AnalysisRun.KEPT_COUNTEREXAMPLES) {
                        ceList.add(x[i]);
                    }
                }
            }
            for (int i = 0; i < v.length; i++) {
                if (c[i] && worstP < 0 && v[i] >= maxR - AnalysisRun.TIE * maxR) {
                    worstP = x[i];
                }
                if (!c[i] && worstN < 0 && v[i] >= maxC - AnalysisRun.TIE * maxC) {
                    worstN = x[i];
                }
            }
        }
    }

    static String fullText(Summary s) {
        StringBuilder sb = new StringBuilder();
        sb.append(s.coverage()).append(s.fingerprint()).append(s.from()).append(s.to()).append(s.positiveCount())
                .append(s.negativeCount()).append(Double.doubleToLongBits(s.maxResistance()))
                .append(Double.doubleToLongBits(s.maxCapacitance())).append(s.worstPositive()).append(s.worstNegative())
                .append(java.util.Arrays.toString(s.recordInputs(true))).append(java.util.Arrays.toString(s.recordValues(true)))
                .append(java.util.Arrays.toString(s.recordInputs(false))).append(java.util.Arrays.toString(s.recordValues(false)))
                .append(s.counterexampleCount()).append(java.util.Arrays.toString(s.counterexamples()))
                .append(java.util.Arrays.toString(s.histogramKeys()))
                .append(java.util.Arrays.toString(s.histogramCounts(true)))
                .append(java.util.Arrays.toString(s.histogramCounts(false)));
        return sb.toString();
    }

    @ParameterizedTest
    @ValueSource(longs = {1, 2, 3, 4, 5})
    void randomSplitsMergeBitForBitAndAgreeWithTheReference(long seed) {
        Random rnd = new Random(seed);
        Scenario sc = RandomScenarios.generate(rnd, 9, 8, 16, 0.15, 0.4, 0.2, 5.0);
        long size = InputDomain.of(sc).size();
        Summary whole = Analysis.summarize(sc, 0, size);
        Reference ref = new Reference(sc, 0, size);
        assertEquals(ref.pos, whole.positiveCount());
        assertEquals(ref.neg, whole.negativeCount());
        assertEquals(Double.doubleToLongBits(ref.maxR), Double.doubleToLongBits(whole.maxResistance()));
        assertEquals(Double.doubleToLongBits(ref.maxC), Double.doubleToLongBits(whole.maxCapacitance()));
        assertEquals(ref.worstP, whole.worstPositive());
        assertEquals(ref.worstN, whole.worstNegative());
        long histTotal = 0;
        for (long c : whole.histogramCounts(true)) {
            histTotal += c;
        }
        for (long c : whole.histogramCounts(false)) {
            histTotal += c;
        }
        assertEquals(size, histTotal, "every input in one bin");
        // the analysis (which shares the per-input routine) agrees with the reference too
        AnalysisResult a = Analysis.run(sc);
        assertEquals(ref.worstP, a.worstPositive());
        assertEquals(ref.worstN, a.worstNegative());
        for (int trial = 0; trial < 5; trial++) {
            List<Long> cuts = new ArrayList<>();
            int parts = 1 + rnd.nextInt(7);
            for (int i = 1; i < parts; i++) {
                cuts.add((long) rnd.nextInt((int) size + 1));
            }
            cuts.add(0L);
            cuts.add(size);
            Collections.sort(cuts);
            List<Summary> pieces = new ArrayList<>();
            for (int i = 0; i + 1 < cuts.size(); i++) {
                pieces.add(Analysis.summarize(sc, cuts.get(i), cuts.get(i + 1)));
            }
            Collections.shuffle(pieces, rnd);
            assertEquals(fullText(whole), fullText(Summary.merge(pieces)), "cuts " + cuts);
        }
    }

    @Test
    void tiesKeepTheFirstInputAcrossParts() {
        // OR_6 as six parallel unit edges: every weight-1 input has R = 1 exactly (derived: one
        // unit resistor), every weight-2 input R = 1/2; the first positive input with R = 1 in input
        // order is 000001. The only negative input is 000000 with C = 6 (six unit capacitors).
        Scenario sc = parallel(6);
        for (int cut = 0; cut <= 64; cut += 4) {
            Summary m = Summary.merge(List.of(Analysis.summarize(sc, 0, cut), Analysis.summarize(sc, cut, 64)));
            assertEquals(1L, m.worstPositive());
            assertEquals(1.0, m.maxResistance());
            assertEquals(6.0, m.maxCapacitance(), 1e-12);
            assertEquals(0L, m.worstNegative());
        }
    }

    @Test
    void recordsNearTheMaximumDecideTheWorstInput() {
        // Derived by hand: values 1, 1 + 1e-13 (a record inside the tie window of 1 + 1e-13), 0.5:
        // the first input within 1e-12 of the maximum is the first one. Built from three parts.
        Summary.Builder unused = null;
        long[] in = {5L};
        Summary a = Summary.restore(Summary.Coverage.DOMAIN, 7, 3, false, 0, 1, 1, 0, 1.0, in, new double[] {1.0},
                Double.NaN, new long[0], new double[0], 0, new long[0], new int[0], new long[0], new long[0]);
        Summary b = Summary.restore(Summary.Coverage.DOMAIN, 7, 3, false, 1, 2, 1, 0, 1.0 + 1e-13, new long[] {6L},
                new double[] {1.0 + 1e-13}, Double.NaN, new long[0], new double[0], 0, new long[0], new int[0],
                new long[0], new long[0]);
        Summary c = Summary.restore(Summary.Coverage.DOMAIN, 7, 3, false, 2, 3, 1, 0, 0.5, new long[] {7L},
                new double[] {0.5}, Double.NaN, new long[0], new double[0], 0, new long[0], new int[0], new long[0],
                new long[0]);
        Summary m = Summary.merge(List.of(c, a, b));
        assertEquals(5L, m.worstPositive());
        assertEquals(1.0 + 1e-13, m.maxResistance());
        assertEquals(unused, null);
        // a value larger by more than the tolerance moves the worst input
        Summary d = Summary.restore(Summary.Coverage.DOMAIN, 7, 3, false, 3, 4, 1, 0, 1.001, new long[] {8L},
                new double[] {1.001}, Double.NaN, new long[0], new double[0], 0, new long[0], new int[0], new long[0],
                new long[0]);
        assertEquals(8L, Summary.merge(List.of(a, b, c, d)).worstPositive());
    }

    @Test
    void gapsOverlapsAndOtherScenariosAreRefused() {
        Scenario sc = parallel(4);
        Summary a = Analysis.summarize(sc, 0, 5);
        Summary b = Analysis.summarize(sc, 6, 16);
        Summary o = Analysis.summarize(sc, 4, 16);
        Summary other = Analysis.summarize(parallel(4).withWeights(new double[] {1, 1, 1, 2}), 5, 16);
        assertTrue(assertThrows(IllegalArgumentException.class, () -> Summary.merge(List.of(a, b))).getMessage()
                .contains("[5, 6) are missing"));
        assertTrue(assertThrows(IllegalArgumentException.class, () -> Summary.merge(List.of(a, o))).getMessage()
                .contains("overlap"));
        assertTrue(assertThrows(IllegalArgumentException.class, () -> Summary.merge(List.of(a, other))).getMessage()
                .contains("different scenarios"));
    }

    @Test
    void binsAreFixedEighthsOfAnOctave() {
        // Derived: 1.0 has exponent 0 and mantissa 0 → bin 0 = [1, 1.125); 3.0 = 2·1.5 → exponent
        // 1, j = 4 → bin 12 = [3, 3.25); 0 has its own bin; edges are exact powers of two times (1 + j/8).
        assertEquals(0, Summary.bin(1.0));
        assertEquals(0, Summary.bin(1.1249999));
        assertEquals(1, Summary.bin(1.125));
        assertEquals(12, Summary.bin(3.0));
        assertEquals(3.0, Summary.binLow(12));
        assertEquals(3.25, Summary.binHigh(12));
        assertEquals(2.0, Summary.binHigh(7));
        assertEquals(Summary.ZERO_BIN, Summary.bin(0.0));
        assertEquals(-8, Summary.bin(0.5));
        assertEquals(0.5, Summary.binLow(-8));
        Random rnd = new Random(9);
        for (int i = 0; i < 1000; i++) {
            double v = Math.exp(rnd.nextGaussian() * 30);
            int k = Summary.bin(v);
            assertTrue(Summary.binLow(k) <= v && v < Summary.binHigh(k), v + " in bin " + k);
        }
    }

    @Test
    void restoredSummariesRoundTrip() {
        Scenario sc = RandomScenarios.generate(new Random(11), 7, 6, 12, 0.15, 0.4, 0.2, 5.0);
        Summary s = Analysis.summarize(sc, 3, 100);
        Summary r = Summary.restore(s.coverage(), s.fingerprint(), s.variableCount(), s.checked(), s.from(), s.to(),
                s.positiveCount(), s.negativeCount(), s.maxResistance(), s.recordInputs(true), s.recordValues(true),
                s.maxCapacitance(), s.recordInputs(false), s.recordValues(false), s.counterexampleCount(),
                s.counterexamples(), s.histogramKeys(), s.histogramCounts(true), s.histogramCounts(false));
        assertEquals(fullText(s), fullText(r));
        assertArrayEquals(s.counterexamples(), r.counterexamples());
    }

    /** n parallel unit s–t edges, edge i present when x_i = 1. */
    static Scenario parallel(int n) {
        List<String> vars = new ArrayList<>();
        List<Edge> edges = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            vars.add("x" + (i + 1));
            edges.add(new Edge("e" + i, 0, 1, Condition.literal(i, "x" + (i + 1), true), 1.0));
        }
        return new Scenario("OR", "", vars, null, null, null, List.of(new Vertex("s", 0, 0), new Vertex("t", 1, 0)),
                0, 1, edges, null);
    }
}
