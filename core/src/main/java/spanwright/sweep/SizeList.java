package spanwright.sweep;

import java.util.ArrayList;
import java.util.List;
import java.util.TreeSet;
import spanwright.model.ScenarioException;

/**
 * The sizes of a sweep, written as comma-separated items: {@code 7} (one size), {@code 2..20}
 * (every size from 2 to 20), {@code 2..20+3} (steps of 3: 2, 5, 8, …), {@code 4..64*2} (doubling:
 * 4, 8, 16, 32, 64). The result is sorted and without repeats. Our own syntax.
 */
public final class SizeList {
    /** Most sizes one sweep may list. */
    public static final int MAX_SIZES = 10_000;

    private SizeList() {}

    /**
     * Parses a size list.
     *
     * @param where the argument or JSON path named in errors
     * @throws ScenarioException code {@code sizes}
     */
    public static List<Integer> parse(String text, String where) {
        if (text == null || text.trim().isEmpty()) {
            throw new ScenarioException("sizes", where, "no sizes given: write e.g. 2..20, 4..64*2 or 3,5,9");
        }
        TreeSet<Integer> out = new TreeSet<>();
        List<String> items = new ArrayList<>();
        int start = 0;
        for (int i = 0; i <= text.length(); i++) {
            if (i == text.length() || text.charAt(i) == ',') {
                items.add(text.substring(start, i));
                start = i + 1;
            }
        }
        for (String raw : items) {
            String item = raw.trim();
            int dots = item.indexOf("..");
            if (dots < 0) {
                out.add(number(item, item, where));
                continue;
            }
            int a = number(item.substring(0, dots), item, where);
            String rest = item.substring(dots + 2);
            int plus = rest.indexOf('+');
            int times = rest.indexOf('*');
            int b;
            int step = 1;
            boolean multiply = false;
            if (plus >= 0) {
                b = number(rest.substring(0, plus), item, where);
                step = number(rest.substring(plus + 1), item, where);
            } else if (times >= 0) {
                b = number(rest.substring(0, times), item, where);
                step = number(rest.substring(times + 1), item, where);
                multiply = true;
            } else {
                b = number(rest, item, where);
            }
            if (b < a) {
                throw new ScenarioException("sizes", where, "\"" + item + "\": the range ends before it starts");
            }
            if (step < 1 || (multiply && (step < 2 || a < 1))) {
                throw new ScenarioException("sizes", where, "\"" + item + "\": the step must be at least "
                        + (multiply ? "2 (and the start at least 1) for a factor" : "1"));
            }
            for (long v = a; v <= b; v = multiply ? v * step : v + step) {
                out.add((int) v);
                if (out.size() > MAX_SIZES) {
                    throw new ScenarioException("sizes", where, "more than " + MAX_SIZES + " sizes");
                }
            }
        }
        return new ArrayList<>(out);
    }

    private static int number(String s, String item, String where) {
        String t = s.trim();
        if (t.isEmpty() || t.length() > 9) {
            throw new ScenarioException("sizes", where, "\"" + item + "\" is not a size list item (write e.g. 2..20,"
                    + " 4..64*2, 2..20+2 or 7)");
        }
        for (int i = 0; i < t.length(); i++) {
            if (t.charAt(i) < '0' || t.charAt(i) > '9') {
                throw new ScenarioException("sizes", where, "\"" + item + "\" is not a size list item (write e.g."
                        + " 2..20, 4..64*2, 2..20+2 or 7)");
            }
        }
        return Integer.parseInt(t);
    }

    /** The canonical text of a list: items separated by commas. */
    public static String format(List<Integer> sizes) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < sizes.size(); i++) {
            sb.append(i > 0 ? "," : "").append(sizes.get(i));
        }
        return sb.toString();
    }
}
