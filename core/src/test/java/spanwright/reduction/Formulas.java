package spanwright.reduction;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/** Seeded random expressions for the builder tests (invented data, test only). */
final class Formulas {
    private Formulas() {}

    static List<String> vars(int n) {
        List<String> v = new ArrayList<>();
        for (int i = 1; i <= n; i++) {
            v.add("x" + i);
        }
        return v;
    }

    /** A random expression over x1..xn using every operator and function of the language. */
    static String random(Random rnd, int n, int depth) {
        return random(rnd, n, depth, "x");
    }

    /** The same with variables named prefix1 … prefixN. */
    static String random(Random rnd, int n, int depth, String prefix) {
        if (depth == 0 || rnd.nextInt(5) == 0) {
            int r = rnd.nextInt(20);
            if (r == 0) {
                return rnd.nextBoolean() ? "1" : "0";
            }
            String v = prefix + (1 + rnd.nextInt(n));
            return rnd.nextInt(3) == 0 ? "!" + v : v;
        }
        switch (rnd.nextInt(12)) {
            case 0:
                return "!(" + random(rnd, n, depth - 1, prefix) + ")";
            case 1:
            case 2:
                return "(" + random(rnd, n, depth - 1, prefix) + " & " + random(rnd, n, depth - 1, prefix) + ")";
            case 3:
            case 4:
                return "(" + random(rnd, n, depth - 1, prefix) + " | " + random(rnd, n, depth - 1, prefix) + ")";
            case 5:
                return "(" + random(rnd, n, depth - 1, prefix) + " ^ " + random(rnd, n, depth - 1, prefix) + ")";
            case 6:
                return "(" + random(rnd, n, depth - 1, prefix) + " -> " + random(rnd, n, depth - 1, prefix) + ")";
            case 7:
                return "(" + random(rnd, n, depth - 1, prefix) + " <-> " + random(rnd, n, depth - 1, prefix) + ")";
            default: {
                String[] fns = {"maj", "thr", "exactly", "atmost", "parity", "any", "all"};
                String fn = fns[rnd.nextInt(fns.length)];
                int m = 1 + rnd.nextInt(4);
                StringBuilder sb = new StringBuilder(fn).append('(');
                if (fn.equals("thr") || fn.equals("exactly") || fn.equals("atmost")) {
                    sb.append(rnd.nextInt(m + 2)).append(", ");
                }
                for (int i = 0; i < m; i++) {
                    sb.append(i > 0 ? ", " : "").append(random(rnd, n, depth - 1, prefix));
                }
                return sb.append(')').toString();
            }
        }
    }

    /**
     * A random read-once AND/OR formula on x1..xN (each variable once, random polarity, random
     * shape: gates of fan-in 2 or 3, kinds chosen at random).
     */
    static String readOnce(Random rnd, int from, int count) {
        if (count == 1) {
            return (rnd.nextInt(3) == 0 ? "!x" : "x") + from;
        }
        int parts = count == 2 ? 2 : 2 + rnd.nextInt(2);
        parts = Math.min(parts, count);
        int[] sizes = new int[parts];
        for (int i = 0; i < parts; i++) {
            sizes[i] = 1;
        }
        for (int left = count - parts; left > 0; left--) {
            sizes[rnd.nextInt(parts)]++;
        }
        String op = rnd.nextBoolean() ? " & " : " | ";
        StringBuilder sb = new StringBuilder("(");
        int start = from;
        for (int i = 0; i < parts; i++) {
            sb.append(i > 0 ? op : "").append(readOnce(rnd, start, sizes[i]));
            start += sizes[i];
        }
        return sb.append(')').toString();
    }
}
