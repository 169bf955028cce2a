package spanwright.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class GrowthModelsTest {
    private static List<Double> list(double... v) {
        List<Double> l = new ArrayList<>();
        for (double x : v) {
            l.add(x);
        }
        return l;
    }

    @Test
    void aLineWithAnOffsetIsNotReadAsFasterGrowth() {
        // Derived: y = √2·n + (2 − 2√2) is linear (2, 3.41, 4.83, 6.24, 7.66 at n = 2…6). A pure
        // power law fits it with b ≈ 1.22 (log–log least squares, computed by hand from the five
        // points); the offset model must recover b = 1 and c = 2 − 2√2 and be the one reported.
        List<Double> n = list(2, 3, 4, 5, 6);
        List<Double> y = new ArrayList<>();
        for (double x : n) {
            y.add(Math.sqrt(2) * x + 2 - 2 * Math.sqrt(2));
        }
        GrowthModels.Result r = GrowthModels.fit(n, y);
        GrowthModels.Model power = r.models().get(0);
        assertEquals(1.22, power.b(), 0.01, "the misleading pure power law");
        assertEquals("offset", r.reported(), r.why());
        assertEquals(1.0, r.reportedModel().b(), 1e-6);
        assertEquals(2 - 2 * Math.sqrt(2), r.reportedModel().c(), 1e-6);
        // local exponents: log(y₂/y₁)/log(n₂/n₁) between consecutive sizes (definition), falling toward 1
        assertEquals(Math.log(y.get(1) / y.get(0)) / Math.log(1.5), r.localExponents()[0], 1e-12);
        for (int i = 1; i < r.localExponents().length; i++) {
            assertTrue(r.localExponents()[i] < r.localExponents()[i - 1]);
        }
    }

    @Test
    void aPurePowerLawAndALogFactorAreRecovered() {
        // Derived: y = 0.5·n^1.5 exactly (the K_n bound √((n−1)⌊n²/4⌋) grows like this); and
        // y = 3·n·log n exactly — each model recovers its own exponent with zero residual.
        List<Double> n = list(4, 6, 8, 10, 12, 14, 16);
        List<Double> p = new ArrayList<>();
        List<Double> q = new ArrayList<>();
        for (double x : n) {
            p.add(0.5 * Math.pow(x, 1.5));
            q.add(3 * x * Math.log(x));
        }
        GrowthModels.Result rp = GrowthModels.fit(n, p);
        assertEquals(1.5, rp.models().get(0).b(), 1e-12);
        assertEquals(1.5, rp.reportedModel().b(), 1e-4, rp.reported());
        GrowthModels.Result rq = GrowthModels.fit(n, q);
        assertEquals("power-log", rq.reported(), rq.why());
        assertEquals(1.0, rq.reportedModel().b(), 1e-9);
        assertTrue(rq.models().get(0).b() > 1.2, "a pure power law overstates n log n");
    }

    @Test
    void tooFewPointsReportThePowerLaw() {
        GrowthModels.Result r = GrowthModels.fit(list(2, 4), list(1, 4));
        assertEquals("power", r.reported());
        assertEquals(2.0, r.reportedModel().b(), 1e-12); // derived: 4 = 1·(4/2)^2
        assertEquals(0, GrowthModels.fit(list(2), list(1)).models().size());
    }
}
