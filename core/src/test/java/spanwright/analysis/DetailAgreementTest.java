package spanwright.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.junit.jupiter.api.Test;
import spanwright.model.RandomScenarios;
import spanwright.model.Scenario;

/**
 * The summary (every input's value in {@link Analysis#run}) and the per-input {@link Analysis#detail}
 * give the same number, bit for bit: both come from the same elimination (the detail's value is the
 * elimination's, not the sum of its energies). Seeded random scenarios with weights rescaled across
 * 1e-12 … 1e12. Source: the stated contract of ElectricalNetwork.witness; common practice, no source.
 */
class DetailAgreementTest {
    @Test
    void summaryAndDetailAgreeBitForBit() {
        Random rnd = new Random(77);
        int checked = 0;
        for (int trial = 0; trial < 20; trial++) {
            Scenario sc = RandomScenarios.generate(rnd, 5, 4 + rnd.nextInt(6), 6 + rnd.nextInt(12), 0.125, 0.5, 0.2, 5.0);
            double[] w = new double[sc.edges().size()];
            for (int e = 0; e < w.length; e++) {
                w[e] = Math.pow(10, -12 + 24 * rnd.nextDouble());
            }
            sc = sc.withWeights(w);
            AnalysisResult r = Analysis.run(sc);
            for (int k = 0; k < r.domainSize(); k++) {
                InputDetail d = Analysis.detail(sc, r.input(k));
                assertEquals(r.connected(k), d.witness.connected, "side of input " + k);
                assertEquals(Double.doubleToLongBits(r.value(k)), Double.doubleToLongBits(d.witness.value),
                        "trial " + trial + " input " + k + ": " + r.value(k) + " vs " + d.witness.value);
                checked++;
            }
        }
        assertEquals(20 * 32, checked);
    }
}
