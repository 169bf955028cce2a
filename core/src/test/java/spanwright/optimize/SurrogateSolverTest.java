package spanwright.optimize;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The surrogate's Newton steps in low-rank form (diagonal plus rank-one terms, solved by the
 * Woodbury identity) against the dense Cholesky form (EJML): the same convex problem, so the same
 * minimiser. Independent computation: the dense form builds and factors the full Hessian.
 */
class SurrogateSolverTest {
    @Test
    void lowRankAndDenseNewtonStepsReachTheSameMinimiser() {
        Random rnd = new Random(11L);
        for (int trial = 0; trial < 6; trial++) {
            int g = 40 + rnd.nextInt(60);
            int ra = 2 + rnd.nextInt(6);
            int rb = 2 + rnd.nextInt(6);
            double[][] a = rows(rnd, ra, g);
            double[][] b = rows(rnd, rb, g);
            boolean[] free = new boolean[g];
            double[] u0 = new double[g];
            for (int k = 0; k < g; k++) {
                free[k] = rnd.nextInt(10) != 0; // some groups locked
                u0[k] = 0.3 * rnd.nextGaussian();
            }
            SurrogateSolver dense = new SurrogateSolver(g, free, u0);
            dense.forceForm(false);
            SurrogateSolver low = new SurrogateSolver(g, free, u0);
            low.forceForm(true);
            double[] ud = dense.minimise(a, b, u0, null);
            double[] ul = low.minimise(a, b, u0, null);
            // the objective max_i log(a_i·e^u) + max_j log(b_j·e^-u) at both points: equal minima
            assertEquals(objective(a, b, ud), objective(a, b, ul), 1e-7, "trial " + trial + ", " + g + " groups");
        }
    }

    private static double[][] rows(Random rnd, int r, int g) {
        double[][] m = new double[r][g];
        for (int i = 0; i < r; i++) {
            for (int k = 0; k < g; k++) {
                m[i][k] = rnd.nextInt(3) == 0 ? 0 : rnd.nextDouble();
            }
        }
        return m;
    }

    private static double objective(double[][] a, double[][] b, double[] u) {
        return side(a, u, 1) + side(b, u, -1);
    }

    private static double side(double[][] c, double[] u, int sign) {
        double best = Double.NEGATIVE_INFINITY;
        for (double[] row : c) {
            double s = 0;
            for (int k = 0; k < u.length; k++) {
                s += row[k] * Math.exp(sign * u[k]);
            }
            best = Math.max(best, Math.log(s));
        }
        return best;
    }
}
