package spanwright.bounds;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import spanwright.io.Json;
import spanwright.model.Inputs;

/**
 * ADV± and ADV against an independent SDP solver: the fixture {@code adversary-cvxopt.json} was
 * written by CVXOPT 1.3.0's cone solver ({@code cvxopt.solvers.sdp}, tolerances 1e-9 on the duality
 * gap and feasibility) through {@code core/src/test/python/adversary_cvxopt.py}, which states the SDP
 * it solves. Tolerances here: our certified interval must contain CVXOPT's value to 1e-9 relative
 * (CVXOPT's primal–dual gap in the fixture is at most 1.3e-9 absolute) and lie within 1e-8 relative
 * of it (our intervals at these sizes are at most about 5e-9 wide), so a wrong interval and a loose
 * one both fail.
 * Some rows are also published values: OR₂ = √2, MAJ₃ = 2, parity = n, read-once formulas √N
 * (Barnum & Saks 2004; Reichardt 2011), exactly-2-of-5: √17 (Ambainis's and the spectral bound
 * agree with it for symmetric functions, from memory), the 4-bit monotone-strings function of
 * Høyer, Lee and Špalek 2007: ADV 2.5, ADV± 2.5135 (from memory).
 */
class AdversaryReferenceTest {
    /** How far outside our certified interval CVXOPT's value may lie, relative. */
    static final double CONTAIN = 1e-9;
    /** How far our certified interval may reach from CVXOPT's value, relative. */
    static final double WITHIN = 1e-8;

    static Stream<Arguments> rows() throws IOException {
        String text;
        try (InputStream in = AdversaryReferenceTest.class.getResourceAsStream("adversary-cvxopt.json")) {
            text = new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
        @SuppressWarnings("unchecked")
        Map<String, Object> doc = (Map<String, Object>) Json.parse(text);
        List<Arguments> out = new ArrayList<>();
        for (Object o : (List<?>) doc.get("functions")) {
            Map<?, ?> row = (Map<?, ?>) o;
            assertEquals("optimal", row.get("advPmStatus"), row.get("name") + ": CVXOPT did not converge");
            assertEquals("optimal", row.get("advStatus"), row.get("name") + ": CVXOPT did not converge");
            out.add(Arguments.of(row.get("name"), row));
        }
        assertTrue(out.size() >= 10, "fixture rows: " + out.size());
        return out.stream();
    }

    /** The function of a fixture row: its inputs (the whole cube when absent) and values, x1…xn left to right. */
    static TargetFunction function(Map<?, ?> row) {
        int n = ((Number) row.get("n")).intValue();
        String values = (String) row.get("values");
        long[] x = new long[values.length()];
        boolean[] v = new boolean[values.length()];
        List<?> inputs = (List<?>) row.get("inputs");
        for (int k = 0; k < x.length; k++) {
            x[k] = inputs == null ? k : Inputs.parse((String) inputs.get(k), n);
            assertTrue(x[k] >= 0, "input " + k);
            v[k] = values.charAt(k) == '1';
        }
        return new TargetFunction(TargetFunction.names("x", n), x, v);
    }

    static void assertNear(String what, double reference, double lower, double upper) {
        double contain = CONTAIN * reference;
        double within = WITHIN * reference;
        assertTrue(lower <= upper, what + ": interval [" + lower + ", " + upper + "]");
        assertTrue(lower <= reference + contain && upper >= reference - contain,
                what + ": certified [" + lower + ", " + upper + "] excludes CVXOPT's " + reference);
        assertTrue(lower >= reference - within && upper <= reference + within,
                what + ": certified [" + lower + ", " + upper + "] reaches beyond 1e-8 of CVXOPT's " + reference);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("rows")
    void generalAdversaryAgreesWithCvxopt(String name, Map<?, ?> row) {
        GeneralAdversary g = GeneralAdversary.compute(function(row));
        assertNear(name + " ADV±", ((Number) row.get("advPm")).doubleValue(), g.lower(), g.upper());
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("rows")
    void positiveAdversaryAgreesWithCvxopt(String name, Map<?, ?> row) {
        PositiveAdversary p = PositiveAdversary.compute(function(row));
        assertNear(name + " ADV", ((Number) row.get("adv")).doubleValue(), p.lower(), p.upper());
    }
}
