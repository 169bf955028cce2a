package spanwright.io;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * Number formatting for people (the command-line summary), without {@code String.format} (which
 * TeaVM supports only in part). JSON output never goes through here: it keeps full precision.
 */
public final class NumberText {
    private NumberText() {}

    /** {@code v} rounded to {@code digits} significant digits, plain notation for 1e-4 ≤ |v| &lt; 1e9. */
    public static String sig(double v, int digits) {
        if (Double.isNaN(v)) {
            return "—";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "∞" : "−∞";
        }
        if (v == 0) {
            return "0";
        }
        BigDecimal b = new BigDecimal(v).round(new MathContext(digits, RoundingMode.HALF_EVEN)).stripTrailingZeros();
        double a = Math.abs(v);
        if (a >= 1e-4 && a < 1e9) {
            return b.toPlainString();
        }
        return b.toString().replace("E+", "e").replace("E", "e");
    }
}
