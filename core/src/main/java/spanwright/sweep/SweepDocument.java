package spanwright.sweep;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.analysis.Summary;
import spanwright.io.Json;
import spanwright.model.Normalisation;
import spanwright.model.ScenarioException;
import spanwright.model.Inputs;

/**
 * The files of a sweep (our own formats; keys in {@code docs/sweeps.md}):
 * <ul>
 *   <li>the result, {@code "format": "spanwright-sweep"}: family, sizes, options, one row per
 *       size, fitted exponents, and (apart, so they can be left out) times and run facts;</li>
 *   <li>a shard's part, {@code "format": "spanwright-sweep-part"}: for each unit of work the
 *       shard owns, the size's metadata and the {@link Summary} of its input range, written so that
 *       it reads back bit for bit (doubles in shortest round-trip form, inputs as input strings).</li>
 * </ul>
 * Which shard owns what ({@link #owned}): a size whose every input is evaluated and whose domain
 * has more than {@link #SPLIT_ABOVE} inputs is split into one contiguous input range per shard;
 * any other size belongs whole to shard (index of the size in the list) mod N. The merge checks
 * that the parts are of one sweep, that every shard is present once, that the parts agree on each
 * size's metadata (weights included, by fingerprint), and that the ranges cover each domain.
 */
public final class SweepDocument {
    public static final String FORMAT = "spanwright-sweep";
    public static final String PART_FORMAT = "spanwright-sweep-part";
    public static final int VERSION = 1;
    /** Every-input sizes with more inputs than this are split across shards. */
    public static final long SPLIT_ABOVE = 1L << 16;
    /** Keys of a result that vary from run to run (left out by {@link #resultsOnly}). */
    public static final List<String> RUN_KEYS = List.of("run", "timing");

    private SweepDocument() {}

    // ------------------------------------------------------------------ ownership

    /**
     * The range [from, to) of units shard {@code shard} of {@code shards} evaluates for the size at
     * {@code index} of the list, or null when another shard owns the whole size. Decided from the
     * built size alone (its method and domain), before any expensive step.
     */
    public static long[] owned(int index, SweepSize built, int shards, int shard) {
        if (shards <= 1) {
            return new long[] {0, -1}; // everything (−1: all units, known after prepare)
        }
        if (built.status() == SweepSize.Status.OK && built.method() == SweepOptions.Method.EVERY
                && built.domainSize() > SPLIT_ABOVE) {
            long d = (long) built.domainSize();
            return new long[] {split(d, shards, shard), split(d, shards, shard + 1)};
        }
        return index % shards == shard ? new long[] {0, -1} : null;
    }

    /** Start of part i of n of a range of d units: floor(d · i / n), without overflow. */
    public static long split(long d, int n, int i) {
        return (d / n) * i + (d % n) * i / n;
    }

    // ------------------------------------------------------------------ summaries

    /** A summary as JSON; reads back bit for bit with {@link #summary}. */
    public static Map<String, Object> summaryJson(Summary s) {
        Map<String, Object> m = new LinkedHashMap<>();
        int n = s.variableCount();
        m.put("coverage", s.coverage() == Summary.Coverage.DOMAIN ? "domain" : "candidates");
        m.put("fingerprint", Long.toHexString(s.fingerprint()));
        m.put("variables", n);
        m.put("checked", s.checked());
        m.put("from", s.from());
        m.put("to", s.to());
        m.put("positiveCount", s.positiveCount());
        m.put("negativeCount", s.negativeCount());
        m.put("positiveRecords", records(s, true, n));
        m.put("negativeRecords", records(s, false, n));
        m.put("counterexampleCount", s.counterexampleCount());
        m.put("counterexamples", SweepSize.inputStrings(s.counterexamples(), n));
        List<Object> h = new ArrayList<>();
        int[] keys = s.histogramKeys();
        long[] p = s.histogramCounts(true);
        long[] q = s.histogramCounts(false);
        for (int i = 0; i < keys.length; i++) {
            List<Object> b = new ArrayList<>();
            b.add(keys[i]);
            b.add(p[i]);
            b.add(q[i]);
            h.add(b);
        }
        m.put("histogram", h);
        return m;
    }

    private static List<Object> records(Summary s, boolean positive, int n) {
        List<Object> l = new ArrayList<>();
        long[] in = s.recordInputs(positive);
        double[] v = s.recordValues(positive);
        for (int i = 0; i < in.length; i++) {
            List<Object> r = new ArrayList<>();
            r.add(Inputs.format(in[i], n));
            r.add(v[i]);
            l.add(r);
        }
        return l;
    }

    /** Reads a summary written by {@link #summaryJson}. */
    @SuppressWarnings("unchecked")
    public static Summary summary(Object json, String path) {
        Map<String, Object> m = object(json, path);
        try {
            int n = (int) whole(m.get("variables"), path + ".variables");
            String cov = String.valueOf(m.get("coverage"));
            Summary.Coverage c = cov.equals("domain") ? Summary.Coverage.DOMAIN : cov.equals("candidates")
                    ? Summary.Coverage.CANDIDATES : null;
            if (c == null) {
                throw new ScenarioException("part", path + ".coverage", "coverage is \"domain\" or \"candidates\"");
            }
            long fp = hex(String.valueOf(m.get("fingerprint")), path + ".fingerprint");
            List<Object> pr = list(m.get("positiveRecords"), path + ".positiveRecords");
            List<Object> nr = list(m.get("negativeRecords"), path + ".negativeRecords");
            long[] pin = new long[pr.size()];
            double[] pv = new double[pr.size()];
            long[] nin = new long[nr.size()];
            double[] nv = new double[nr.size()];
            readRecords(pr, pin, pv, n, path + ".positiveRecords");
            readRecords(nr, nin, nv, n, path + ".negativeRecords");
            List<Object> ce = list(m.get("counterexamples"), path + ".counterexamples");
            long[] cex = new long[ce.size()];
            for (int i = 0; i < cex.length; i++) {
                cex[i] = input(ce.get(i), n, path + ".counterexamples[" + i + "]");
            }
            List<Object> h = list(m.get("histogram"), path + ".histogram");
            int[] keys = new int[h.size()];
            long[] hp = new long[h.size()];
            long[] hn = new long[h.size()];
            for (int i = 0; i < keys.length; i++) {
                List<Object> b = list(h.get(i), path + ".histogram[" + i + "]");
                if (b.size() != 3) {
                    throw new ScenarioException("part", path + ".histogram[" + i + "]", "a bin is [key, positive, negative]");
                }
                keys[i] = (int) whole(b.get(0), path + ".histogram[" + i + "]");
                hp[i] = whole(b.get(1), path + ".histogram[" + i + "]");
                hn[i] = whole(b.get(2), path + ".histogram[" + i + "]");
            }
            return Summary.restore(c, fp, n, Boolean.TRUE.equals(m.get("checked")), whole(m.get("from"), path + ".from"),
                    whole(m.get("to"), path + ".to"), whole(m.get("positiveCount"), path + ".positiveCount"),
                    whole(m.get("negativeCount"), path + ".negativeCount"), pv.length == 0 ? Double.NaN : pv[pv.length - 1],
                    pin, pv, nv.length == 0 ? Double.NaN : nv[nv.length - 1], nin, nv,
                    whole(m.get("counterexampleCount"), path + ".counterexampleCount"), cex, keys, hp, hn);
        } catch (IllegalArgumentException e) {
            throw new ScenarioException("part", path, "the summary is damaged: " + e.getMessage());
        }
    }

    /** An unsigned 64-bit hexadecimal number (written by Long.toHexString). */
    private static long hex(String s, String path) {
        if (s.isEmpty() || s.length() > 16) {
            throw new ScenarioException("part", path, "expected a hexadecimal fingerprint");
        }
        long v = 0;
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            int d = c >= '0' && c <= '9' ? c - '0' : c >= 'a' && c <= 'f' ? c - 'a' + 10 : c >= 'A' && c <= 'F' ? c - 'A' + 10 : -1;
            if (d < 0) {
                throw new ScenarioException("part", path, "expected a hexadecimal fingerprint");
            }
            v = (v << 4) | d;
        }
        return v;
    }

    private static void readRecords(List<Object> l, long[] in, double[] v, int n, String path) {
        for (int i = 0; i < l.size(); i++) {
            List<Object> r = list(l.get(i), path + "[" + i + "]");
            if (r.size() != 2 || !(r.get(1) instanceof Double)) {
                throw new ScenarioException("part", path + "[" + i + "]", "a record is [input, value]");
            }
            in[i] = input(r.get(0), n, path + "[" + i + "]");
            v[i] = (Double) r.get(1);
        }
    }

    private static long input(Object o, int n, String path) {
        if (!(o instanceof String) || ((String) o).length() != n) {
            throw new ScenarioException("part", path, "expected an input string of " + n + " characters 0/1");
        }
        String s = (String) o;
        long m = 0;
        for (int i = 0; i < n; i++) {
            char c = s.charAt(i);
            if (c != '0' && c != '1') {
                throw new ScenarioException("part", path, "expected an input string of " + n + " characters 0/1");
            }
            m = (m << 1) | (c - '0');
        }
        return m;
    }

    // ------------------------------------------------------------------ documents

    /** The head shared by results and parts: format, family, title, parameter, sizes, options. */
    public static Map<String, Object> head(String format, Family family, List<Integer> sizes, SweepOptions options) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("format", format);
        m.put("version", VERSION);
        m.put("family", family.spec());
        m.put("title", family.title());
        Map<String, Object> p = new LinkedHashMap<>();
        p.put("name", family.parameterName());
        p.put("meaning", family.parameterMeaning());
        m.put("parameter", p);
        m.put("sizes", SizeList.format(sizes));
        m.put("options", options.toJson());
        return m;
    }

    /**
     * A result document from rows (sorted by size), with fits over the tail; {@code run} may be
     * null. Rows may carry a {@code timing} key (left out by {@link #resultsOnly}).
     */
    public static Map<String, Object> result(Family family, List<Integer> sizes, SweepOptions options,
            List<Map<String, Object>> rows, int fitFrom, int fitLast, Map<String, Object> run) {
        Map<String, Object> m = head(FORMAT, family, sizes, options);
        m.put("convention", Normalisation.CONVENTION);
        m.put("caution", SweepReport.FIT_CAUTION);
        List<Map<String, Object>> sorted = new ArrayList<>(rows);
        sorted.sort((a, b) -> Integer.compare(((Number) a.get("size")).intValue(), ((Number) b.get("size")).intValue()));
        m.put("rows", new ArrayList<Object>(sorted));
        m.put("fits", SweepReport.fits(sorted, fitFrom, fitLast));
        m.put("fitsBySize", SweepReport.fits(sorted, fitFrom, fitLast, "size"));
        if (run != null) {
            m.put("run", run);
        }
        return m;
    }

    /** A copy without the keys that vary from run to run (times, memory, run facts). */
    @SuppressWarnings("unchecked")
    public static Object resultsOnly(Object doc) {
        if (doc instanceof Map) {
            Map<String, Object> out = new LinkedHashMap<>();
            for (Map.Entry<String, Object> e : ((Map<String, Object>) doc).entrySet()) {
                if (!RUN_KEYS.contains(e.getKey())) {
                    out.put(e.getKey(), resultsOnly(e.getValue()));
                }
            }
            return out;
        }
        if (doc instanceof List) {
            List<Object> out = new ArrayList<>();
            for (Object o : (List<Object>) doc) {
                out.add(resultsOnly(o));
            }
            return out;
        }
        return doc;
    }

    /** One unit of a part: a size's metadata, the summary of its range (or null), its timing. */
    public static Map<String, Object> unit(SweepSize s, Summary summary) {
        Map<String, Object> u = new LinkedHashMap<>();
        u.put("size", s.size());
        u.put("metadata", s.metadata());
        u.put("summary", summary == null ? null : summaryJson(summary));
        u.put("timing", s.timing());
        return u;
    }

    /**
     * Merges the parts of one sharded sweep into the result document, bit for bit the unsharded
     * sweep's (apart from times).
     *
     * @throws ScenarioException naming the part and what is wrong (another sweep, a missing or
     *     repeated shard, metadata that disagree, ranges that do not cover a domain)
     */
    @SuppressWarnings("unchecked")
    public static Map<String, Object> merge(List<Object> parts, List<String> names, int fitFrom, int fitLast,
            Map<String, Object> run) {
        if (parts.isEmpty()) {
            throw new ScenarioException("merge", "$", "no parts to merge");
        }
        Map<String, Object> first = null;
        String headText = null;
        int shards = -1;
        boolean[] seen = null;
        Map<Integer, List<Map<String, Object>>> bySize = new HashMap<>();
        for (int p = 0; p < parts.size(); p++) {
            String name = names.get(p);
            Map<String, Object> d = object(parts.get(p), name);
            if (!PART_FORMAT.equals(d.get("format"))) {
                throw new ScenarioException("merge", name + ": $.format", "not a sweep part (format "
                        + Json.write(d.get("format")) + "; parts are written by sweep --shards N --shard i)");
            }
            Map<String, Object> h = new LinkedHashMap<>();
            for (String k : List.of("family", "sizes", "options", "shards")) {
                h.put(k, d.get(k));
            }
            String ht = Json.write(h);
            int n = (int) whole(d.get("shards"), name + ": $.shards");
            int i = (int) whole(d.get("shard"), name + ": $.shard");
            if (first == null) {
                first = d;
                headText = ht;
                shards = n;
                seen = new boolean[n];
            } else if (!ht.equals(headText)) {
                throw new ScenarioException("merge", name, "this part belongs to another sweep (family, sizes, options or"
                        + " shard count differ from " + names.get(0) + ")");
            }
            if (i < 0 || i >= shards) {
                throw new ScenarioException("merge", name + ": $.shard", "shard " + i + " of " + shards + "?");
            }
            if (seen[i]) {
                throw new ScenarioException("merge", name, "shard " + i + " is given twice");
            }
            seen[i] = true;
            for (Object uo : list(d.get("units"), name + ": $.units")) {
                Map<String, Object> u = object(uo, name + ": $.units[]");
                u.put("part", name);
                bySize.computeIfAbsent((int) whole(u.get("size"), name + ": $.units[].size"), k -> new ArrayList<>()).add(u);
            }
        }
        List<Integer> missing = new ArrayList<>();
        for (int i = 0; i < shards; i++) {
            if (!seen[i]) {
                missing.add(i);
            }
        }
        if (!missing.isEmpty()) {
            throw new ScenarioException("merge", "$", "shard(s) " + missing + " of " + shards + " missing");
        }
        Family family = BuiltInFamilies.fromSpec(first.get("family"), "$.family");
        List<Integer> sizes = SizeList.parse(String.valueOf(first.get("sizes")), "$.sizes");
        List<Map<String, Object>> rows = new ArrayList<>();
        for (int size : sizes) {
            List<Map<String, Object>> units = bySize.get(size);
            if (units == null) {
                throw new ScenarioException("merge", "$", "size " + size + " is in no part (was a shard stopped early?)");
            }
            String meta = Json.write(units.get(0).get("metadata"));
            List<Summary> sums = new ArrayList<>();
            Map<String, Object> timing = new LinkedHashMap<>();
            for (Map<String, Object> u : units) {
                if (!Json.write(u.get("metadata")).equals(meta)) {
                    throw new ScenarioException("merge", String.valueOf(u.get("part")), "size " + size + ": the parts"
                            + " disagree on the instance or its weights (a time cap hit in one shard but not another?"
                            + " use an iteration budget only)");
                }
                Object so = u.get("summary");
                if (so != null && so != Json.NULL) {
                    sums.add(summary(so, u.get("part") + ": size " + size));
                }
                timing.put(String.valueOf(u.get("part")), u.get("timing"));
            }
            Map<String, Object> metadata = (Map<String, Object>) units.get(0).get("metadata");
            Summary merged = null;
            if (!sums.isEmpty()) {
                try {
                    merged = Summary.merge(sums);
                } catch (IllegalArgumentException e) {
                    throw new ScenarioException("merge", "$", "size " + size + ": " + e.getMessage());
                }
                double domain = ((Number) metadata.get("domainSize")).doubleValue();
                Object in = metadata.get("inputs");
                double expected = in instanceof Map ? ((Number) ((Map<String, Object>) in).get("candidates")).doubleValue()
                        : domain;
                if (merged.from() != 0 || merged.to() != (long) expected) {
                    throw new ScenarioException("merge", "$", "size " + size + ": the parts cover inputs [" + merged.from()
                            + ", " + merged.to() + ") of " + (long) expected);
                }
            }
            Map<String, Object> row = SweepSize.row(metadata, merged);
            row.put("timing", timing);
            rows.add(row);
        }
        SweepOptions options = options(first.get("options"), "$.options");
        return result(family, sizes, options, rows, fitFrom, fitLast, run);
    }

    /** Options from their JSON (as written by {@link SweepOptions#toJson}); absent keys keep {@link SweepOptions#defaults()}. */
    public static SweepOptions options(Object json, String path) {
        return options(json, path, SweepOptions.defaults());
    }

    /** Options from their JSON; absent keys keep their values in {@code base}. */
    public static SweepOptions options(Object json, String path, SweepOptions base) {
        Map<String, Object> m = object(json, path);
        SweepOptions o = base;
        for (Map.Entry<String, Object> e : m.entrySet()) {
            String p = path + "." + e.getKey();
            Object v = e.getValue();
            switch (e.getKey()) {
                case "method": {
                    SweepOptions.Method me = SweepOptions.Method.of(String.valueOf(v));
                    if (me == null) {
                        throw new ScenarioException("option", p, "method is auto, every, undominated, orbits or structure");
                    }
                    o = o.withMethod(me);
                    break;
                }
                case "optimizeIterations": o = o.withOptimizeIterations((int) whole(v, p)); break;
                case "optimizeSeconds":
                    if (!(v instanceof Double) || !((Double) v > 0)) {
                        throw new ScenarioException("option", p, "optimizeSeconds is a number > 0");
                    }
                    o = o.withOptimizeMillis((long) Math.rint((Double) v * 1000));
                    break;
                case "starts": o = o.withStarts((int) whole(v, p)); break;
                case "seed": o = o.withSeed(whole(v, p)); break;
                case "bounds":
                    if (!(v instanceof Boolean)) {
                        throw new ScenarioException("option", p, "bounds is true or false");
                    }
                    o = o.withBounds((Boolean) v, o.boundsMaxVariables());
                    break;
                case "boundsMaxVariables": o = o.withBounds(o.bounds(), (int) whole(v, p)); break;
                case "maxInputs": o = o.withMaxInputs(whole(v, p)); break;
                default:
                    throw new ScenarioException("option", p, "unknown sweep option \"" + e.getKey() + "\" (known: method,"
                            + " optimizeIterations, optimizeSeconds, starts, seed, bounds, boundsMaxVariables, maxInputs)");
            }
        }
        return o;
    }

    // ------------------------------------------------------------------ small JSON helpers

    @SuppressWarnings("unchecked")
    static Map<String, Object> object(Object o, String path) {
        if (!(o instanceof Map)) {
            throw new ScenarioException("type", path, "expected a JSON object");
        }
        return (Map<String, Object>) o;
    }

    @SuppressWarnings("unchecked")
    static List<Object> list(Object o, String path) {
        if (!(o instanceof List)) {
            throw new ScenarioException("type", path, "expected a JSON array");
        }
        return (List<Object>) o;
    }

    static long whole(Object o, String path) {
        if (o instanceof Integer || o instanceof Long) {
            return ((Number) o).longValue();
        }
        if (!(o instanceof Double) || (Double) o != Math.rint((Double) o) || Math.abs((Double) o) > 9e15) {
            throw new ScenarioException("type", path, "expected a whole number, got " + Json.write(o));
        }
        return (long) (double) (Double) o;
    }
}
