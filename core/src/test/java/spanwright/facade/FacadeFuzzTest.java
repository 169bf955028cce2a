package spanwright.facade;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import spanwright.io.Json;

/**
 * Seeded fuzzing of the JSON façade: mutated scenario documents (the demo scenarios and random
 * ones; characters deleted, duplicated and flipped, deep nesting, huge and tiny numbers, Unicode
 * digits, lone surrogates) and mutated share links. Every call must answer with an ok envelope or
 * a clean error envelope — never code "internal", never an exception or Error. 1000 documents
 * and 1000 links by default (about 5000 calls, some seconds); {@code -Dspanwright.fuzz=100000} runs that many instead,
 * and {@code -Dspanwright.fuzz.seed=N} changes the seed. Source of the expectation: the façade's
 * contract (bad input is an error envelope with a code); common practice, no source.
 */
class FacadeFuzzTest {
    private static final int DEFAULT_DOCUMENTS = 1000;

    /** Fragments that have broken things before, or are likely to. */
    private static final String[] NASTY = {
        "1\u0663", "\u0661", "\uD800", "\uDC00", "\\ud800", "\\uDFFF", "1e999", "-1e999", "1e-400", "5e-324",
        "4.9e-324", "1e101", "1e-101", "1e100", "1e-100", "1.8e308", "123456789012345678901234567890", "-0",
        "0.0", "NaN", "null", "true", "[]", "{}", "\"\"", "\"a\"", "\"!a\"", "\"1\"", "\"0\"", "\"s\"", "\"t\"",
        "\\u0000", "\u0000", "\"\\u0661\"", "2^24", "1e9", "-1", "0", "1", "25", "64", "\u00e9", "\uFEFF", "\t", "\n",
    };

    private static int documents() {
        return Integer.getInteger("spanwright.fuzz", DEFAULT_DOCUMENTS);
    }

    static List<String> seeds() throws IOException {
        List<String> out = new ArrayList<>();
        try (Stream<Path> s = Files.list(Path.of("../scenarios"))) {
            for (Path p : s.filter(p -> p.toString().endsWith(".json")).sorted().collect(Collectors.toList())) {
                out.add(Files.readString(p, StandardCharsets.UTF_8));
            }
        }
        assertTrue(out.size() >= 3, "the demo scenarios in ../scenarios");
        return out;
    }

    /** A small random scenario document (2–4 variables, up to 6 vertices). */
    static String randomScenario(Random r) {
        int n = 1 + r.nextInt(4);
        int v = 2 + r.nextInt(5);
        StringBuilder sb = new StringBuilder("{\"format\": \"spanwright-scenario\", \"version\": 1, \"variables\": [");
        for (int i = 0; i < n; i++) {
            sb.append(i == 0 ? "" : ", ").append("\"x").append(i).append('"');
        }
        sb.append("], \"function\": \"");
        for (int i = 0; i < n; i++) {
            sb.append(i == 0 ? "" : r.nextBoolean() ? " | " : " & ").append(r.nextInt(4) == 0 ? "!" : "").append('x').append(i);
        }
        sb.append("\", \"graph\": {\"s\": \"v0\", \"t\": \"v").append(v - 1).append("\", \"vertices\": [");
        for (int i = 0; i < v; i++) {
            sb.append(i == 0 ? "" : ", ").append("{\"id\": \"v").append(i).append("\"}");
        }
        sb.append("], \"edges\": [");
        int m = v - 1 + r.nextInt(2 * v);
        for (int e = 0; e < m; e++) {
            int a = e < v - 1 ? e : r.nextInt(v);
            int b = e < v - 1 ? e + 1 : r.nextInt(v);
            String when = r.nextInt(6) == 0 ? "1" : (r.nextBoolean() ? "" : "!") + "x" + r.nextInt(n);
            sb.append(e == 0 ? "" : ", ").append("{\"u\": \"v").append(a).append("\", \"v\": \"v").append(b)
                    .append("\", \"when\": \"").append(when).append("\", \"weight\": ")
                    .append(Math.pow(10, -3 + 6 * r.nextDouble())).append('}');
        }
        return sb.append("]}}").toString();
    }

    /** One to three random mutations of {@code text}. */
    static String mutate(String text, Random r) {
        StringBuilder sb = new StringBuilder(text);
        int k = 1 + r.nextInt(3);
        for (int i = 0; i < k; i++) {
            int len = sb.length();
            int at = len == 0 ? 0 : r.nextInt(len);
            switch (r.nextInt(9)) {
                case 0: // delete a span
                    sb.delete(at, Math.min(len, at + 1 + r.nextInt(4)));
                    break;
                case 1: { // duplicate a span
                    int end = Math.min(len, at + 1 + r.nextInt(len < 100_000 ? 40 : 1));
                    sb.insert(at, sb.substring(at, end));
                    break;
                }
                case 2: // flip one character
                    if (len > 0) {
                        sb.setCharAt(at, "{}[]\":,0123456789.eE+-!|&^()<>aAsStT \\".charAt(r.nextInt(38)));
                    }
                    break;
                case 3: // a nasty fragment
                    sb.insert(at, NASTY[r.nextInt(NASTY.length)]);
                    break;
                case 4: { // replace a number with a nasty one
                    int d = indexOfDigit(sb, at);
                    if (d >= 0) {
                        int e = d;
                        while (e < sb.length() && "0123456789.eE+-".indexOf(sb.charAt(e)) >= 0) {
                            e++;
                        }
                        sb.replace(d, e, NASTY[r.nextInt(NASTY.length)]);
                    }
                    break;
                }
                case 5: { // deep nesting: JSON brackets or expression parentheses
                    int depth = 100 + r.nextInt(1200);
                    if (r.nextBoolean()) {
                        sb.insert(at, "[".repeat(depth) + "]".repeat(depth));
                    } else {
                        int q = sb.indexOf("\"function\": \"");
                        if (q >= 0) {
                            q += 13;
                            String open = r.nextBoolean() ? "(" : "!";
                            sb.insert(q, open.repeat(depth));
                            if (open.equals("(")) {
                                int close = sb.indexOf("\"", q + depth);
                                if (close > 0) {
                                    sb.insert(close, ")".repeat(depth));
                                }
                            }
                        }
                    }
                    break;
                }
                case 6: { // a long OR in the function
                    int q = sb.length() < 20_000 ? sb.indexOf("\"function\": \"") : -1;
                    if (q >= 0) {
                        q += 13;
                        int close = sb.indexOf("\"", q);
                        if (close > q && close - q < 200) {
                            String f = sb.substring(q, close);
                            // mostly modest; one in 40 about the size that once overflowed the stack
                            int copies = r.nextInt(40) == 0 ? 5000 + r.nextInt(20_000) / Math.max(1, f.length() / 4)
                                    : 1 + r.nextInt(300);
                            sb.replace(q, close, (f + " | ").repeat(copies) + f);
                        }
                    }
                    break;
                }
                case 7: // truncate
                    sb.setLength(at);
                    break;
                default: // a random character, any plane
                    sb.insert(at, (char) r.nextInt(0x10000));
            }
        }
        return sb.toString();
    }

    private static int indexOfDigit(CharSequence s, int from) {
        for (int i = 0; i < s.length(); i++) {
            int j = (from + i) % s.length();
            if (Character.isDigit(s.charAt(j))) {
                return j;
            }
        }
        return -1;
    }

    /** Fails unless {@code envelope} is ok or a clean error (code other than internal). */
    @SuppressWarnings("unchecked")
    static void assertClean(String call, String input, String envelope) {
        Object o;
        try {
            o = Json.parse(envelope);
        } catch (RuntimeException e) {
            throw new AssertionError(call + ": the answer is not JSON: " + envelope);
        }
        Map<String, Object> m = (Map<String, Object>) o;
        if (Boolean.TRUE.equals(m.get("ok"))) {
            return;
        }
        Map<String, Object> err = (Map<String, Object>) m.get("error");
        assertTrue(err != null && err.get("code") instanceof String && err.get("message") instanceof String,
                call + ": not an envelope: " + envelope);
        if ("internal".equals(err.get("code"))) {
            throw new AssertionError(call + " answered internal: " + err.get("message") + "\ninput: "
                    + (input.length() > 400 ? input.substring(0, 400) + "…" : input));
        }
    }

    private static String call(String name, String input, java.util.function.Supplier<String> f) {
        String out;
        try {
            out = f.get();
        } catch (Throwable t) { // deliberately everything: no throwable may leave the façade
            throw new AssertionError(name + " threw " + t + "\ninput: "
                    + (input.length() > 400 ? input.substring(0, 400) + "…" : input), t);
        }
        assertClean(name, input, out);
        return out;
    }

    @Test
    @SuppressWarnings("unchecked")
    void mutatedDocumentsAndLinksGetCleanAnswers() throws IOException {
        long seed = Long.getLong("spanwright.fuzz.seed", 13L);
        Random r = new Random(seed);
        List<String> seeds = seeds();
        List<String> links = new ArrayList<>();
        for (String s : seeds) {
            Map<String, Object> m = (Map<String, Object>) Json.parse(JsonFacade.encodeShare(s));
            links.add((String) m.get("fragment"));
        }
        int n = documents();
        int valid = 0;
        for (int i = 0; i < n; i++) {
            String base = r.nextInt(3) == 0 ? randomScenario(r) : seeds.get(r.nextInt(seeds.size()));
            String doc = r.nextInt(10) == 0 ? base : mutate(base, r);
            Map<String, Object> v = (Map<String, Object>) Json.parse(call("validate", doc, () -> JsonFacade.validate(doc)));
            call("encodeShare", doc, () -> JsonFacade.encodeShare(doc));
            if (Boolean.TRUE.equals(v.get("ok"))) {
                valid++;
                double size = ((Number) v.get("domainSize")).doubleValue();
                List<Object> vars = (List<Object>) v.get("variables");
                if (size <= 4096) {
                    call("analyze", doc, () -> JsonFacade.analyze(doc, false));
                    String input = "0".repeat(vars.size());
                    call("detail", doc, () -> JsonFacade.detail(doc, input));
                    if (i % 25 == 0) {
                        call("optimize", doc, () -> JsonFacade.optimize(doc, "{\"iterations\": 3}"));
                    }
                }
                if (!vars.isEmpty()) {
                    String from = (String) vars.get(0);
                    String to = r.nextBoolean() ? "renamed" : NASTY[r.nextInt(NASTY.length)];
                    call("renameVariable", doc, () -> JsonFacade.renameVariable(doc, from, to));
                }
            }
            // a share link, mutated
            String link = links.get(r.nextInt(links.size()));
            String bad = r.nextInt(8) == 0 ? link : mutate(link, r);
            call("decodeShare", bad, () -> JsonFacade.decodeShare(bad));
        }
        assertTrue(valid > n / 10, "enough mutated documents stay valid to reach the analysis: " + valid + " of " + n);
    }

    @Test
    void linksRefuseWhatTheyCannotCarry() throws IOException {
        // UTF-8 cannot hold a lone surrogate (Unicode §3.9), and links carry at most 4 MiB of text
        String doc = seeds().get(0);
        int q = doc.indexOf("\"title\": \"") + 10;
        String lone = doc.substring(0, q) + "\uD800" + doc.substring(q);
        String a = JsonFacade.encodeShare(lone);
        // the reader refuses it first (json-syntax, with the line and column); ShareCodec's own
        // check stays for callers that skip the reader
        assertTrue(a.contains("\"json-syntax\"") && a.contains("lone surrogate") && a.contains("column"), a);
        String big = doc.substring(0, q) + "x".repeat(5 << 20) + doc.substring(q);
        String b = JsonFacade.encodeShare(big);
        assertTrue(b.contains("\"share-link\"") && b.contains("too large"), b);
    }
}
