package spanwright.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** Least-squares exponents against the closed-form simple-regression formulas. */
class PowerFitTest {

    @Test
    void anExactPowerLawIsRecovered() {
        // derived: y = 3 x^0.75 is a straight line in log–log with slope 0.75, no residual
        List<Double> x = new ArrayList<>();
        List<Double> y = new ArrayList<>();
        for (int n = 2; n <= 64; n *= 2) {
            x.add((double) n);
            y.add(3 * Math.pow(n, 0.75));
        }
        PowerFit f = PowerFit.fit(x, y);
        assertEquals(0.75, f.exponent, 1e-12);
        assertEquals(3.0, f.prefactor, 1e-10);
        assertTrue(f.standardError < 1e-12);
        assertEquals(6, f.points);
    }

    @Test
    void noisyDataMatchTheTextbookFormulas() {
        // Independent computation (common practice, no source beyond any statistics text): with
        // u = log x, v = log y, slope b = Sxy/Sxx, intercept a = v̄ − b ū, and
        // se(b) = sqrt(RSS / (m − 2) / Sxx).
        Random rnd = new Random(5);
        List<Double> x = new ArrayList<>();
        List<Double> y = new ArrayList<>();
        for (int n = 3; n <= 40; n += 3) {
            x.add((double) n);
            y.add(Math.pow(n, 1.3) * Math.exp(0.05 * rnd.nextGaussian()));
        }
        int m = x.size();
        double su = 0;
        double sv = 0;
        for (int i = 0; i < m; i++) {
            su += Math.log(x.get(i));
            sv += Math.log(y.get(i));
        }
        double ub = su / m;
        double vb = sv / m;
        double sxx = 0;
        double sxy = 0;
        for (int i = 0; i < m; i++) {
            double du = Math.log(x.get(i)) - ub;
            sxx += du * du;
            sxy += du * (Math.log(y.get(i)) - vb);
        }
        double b = sxy / sxx;
        double a = vb - b * ub;
        double rss = 0;
        for (int i = 0; i < m; i++) {
            double r = Math.log(y.get(i)) - a - b * Math.log(x.get(i));
            rss += r * r;
        }
        double se = Math.sqrt(rss / (m - 2) / sxx);
        PowerFit f = PowerFit.fit(x, y);
        assertEquals(b, f.exponent, 1e-10);
        assertEquals(Math.exp(a), f.prefactor, 1e-9 * Math.exp(a));
        assertEquals(se, f.standardError, 1e-9 * se);
    }

    @Test
    void tooFewPointsIsAValueNotAnError() {
        PowerFit one = PowerFit.fit(List.of(4.0), List.of(2.0));
        assertTrue(Double.isNaN(one.exponent));
        assertNotNull(one.missing);
        PowerFit two = PowerFit.fit(List.of(4.0, 16.0), List.of(2.0, 4.0));
        assertEquals(0.5, two.exponent, 1e-12);
        assertTrue(Double.isNaN(two.standardError), "two points: no error estimate");
        // unusable values (NaN, 0) are left out
        PowerFit skip = PowerFit.fit(List.of(1.0, 2.0, 4.0, 8.0), List.of(Double.NaN, 0.0, 2.0, 4.0));
        assertEquals(2, skip.points);
    }
}
