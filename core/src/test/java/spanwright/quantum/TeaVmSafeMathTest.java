package spanwright.quantum;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class TeaVmSafeMathTest {
    @Test
    void machineEpsilonIsTheUlpOfOne() {
        // Java SE specification of Math.ulp: ulp(1.0) = 2^-52 (the page's engine gets it wrong,
        // so the constant is written out; this checks the constant on a correct JVM).
        assertEquals(Math.ulp(1.0), SpanProgramUnitary.MACHINE_EPSILON, 0.0);
    }

    @Test
    void phaseReductionMatchesIeeeRemainder() {
        // Java SE specification of Math.IEEEremainder: phi − 2π·round-to-nearest(phi / 2π); the
        // rint form used in PhaseEstimation must agree with it on the JVM.
        double twoPi = 2 * Math.PI;
        for (double phi = -20; phi <= 20; phi += 0.0137) {
            assertEquals(Math.IEEEremainder(phi, twoPi), phi - twoPi * Math.rint(phi / twoPi), 1e-12, "phi " + phi);
        }
    }
}
