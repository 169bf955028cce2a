package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import spanwright.io.Json;
import spanwright.io.NumberText;

/**
 * The command-line tool through {@link Main#run}: exit codes, the {@code --json} keys, the
 * {@code --inputs} rows, and agreement of the JSON numbers with the human summary. Source of the
 * expectations: the "Command-line tool" section of the "Core engine" issue and docs/cli.md;
 * values of the small scenarios are derived by hand beside each check.
 */
class MainTest {

    @TempDir
    Path dir;

    /** Captured result of one run. */
    static final class Run {
        final int status;
        final String out;
        final String err;

        Run(int status, String out, String err) {
            this.status = status;
            this.out = out;
            this.err = err;
        }

        @SuppressWarnings("unchecked")
        Map<String, Object> json() {
            return (Map<String, Object>) Json.parse(out);
        }
    }

    static Run run(String... args) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int status;
        try (PrintStream o = new PrintStream(out, true, StandardCharsets.UTF_8);
                PrintStream e = new PrintStream(err, true, StandardCharsets.UTF_8)) {
            status = Main.run(args, o, e);
        }
        return new Run(status, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    }

    Path write(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text, StandardCharsets.UTF_8);
        return p;
    }

    /** Two variables, two parallel s–t edges (OR of a and b), with the given function line. */
    static String parallel(String functionJson) {
        return "{\"format\": \"spanwright-scenario\", \"version\": 1, \"title\": \"Two parallel edges\","
            + " \"variables\": [\"a\", \"b\"], " + functionJson
            + " \"graph\": {\"s\": \"s\", \"t\": \"t\", \"vertices\": [{\"id\": \"s\"}, {\"id\": \"t\"}],"
            + " \"edges\": [{\"u\": \"s\", \"v\": \"t\", \"when\": \"a\"}, {\"u\": \"s\", \"v\": \"t\", \"when\": \"b\", \"weight\": 2}]}}";
    }

    static void assertNoStackTrace(Run r) {
        for (String s : new String[] {r.out, r.err}) {
            assertFalse(s.contains("Exception"), s);
            assertFalse(s.contains("\tat "), s);
            assertFalse(s.contains("at spanwright."), s);
        }
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> obj(Map<String, Object> m, String key) {
        assertTrue(m.get(key) instanceof Map, key + " is an object: " + m.get(key));
        return (Map<String, Object>) m.get(key);
    }

    static void assertNumberOrNull(Object v, String what) {
        assertTrue(v instanceof Double || v == Json.NULL, what + " is a number or null: " + v);
    }

    // ------------------------------------------------------------------ exit status

    @Test
    void defaultScenarioExitsZero() {
        Run r = run("analyze");
        assertEquals(0, r.status, r.err);
        assertTrue(r.out.contains("reduction") && r.out.contains("correct"), r.out);
        assertTrue(r.out.contains("sqrt(W+ W-) = "), r.out);
        assertTrue(r.out.contains("caution:"), "the caution goes with every bound: " + r.out);
        assertEquals("", r.err);
        Run j = run("analyze", "--json");
        assertEquals(0, j.status);
        assertEquals(Boolean.TRUE, obj(j.json(), "reduction").get("correct"));
    }

    @Test
    void defaultScenarioIsTheBundledCopyOfScenariosDefaultJson() throws IOException {
        Path file = Path.of("..", "scenarios", "default.json");
        Run fromFile = run("analyze", "--json", file.toString());
        Run builtIn = run("analyze", "--json");
        assertEquals(0, fromFile.status, fromFile.err);
        assertEquals(fromFile.out, builtIn.out);
    }

    @Test
    void wrongReductionExitsOneAndListsCounterexamples() throws IOException {
        // Derived: parallel edges s–t (a) and s–t (b) connect s and t exactly when a | b; the
        // claimed function a & b differs on 01 and 10 (connected, f = 0).
        Path p = write("wrong.json", parallel("\"function\": \"a & b\","));
        Run r = run("analyze", p.toString());
        assertEquals(1, r.status, r.out + r.err);
        assertTrue(r.out.contains("WRONG on 2 input(s)"), r.out);
        assertTrue(r.out.contains("01 (f=0, connected)") && r.out.contains("10 (f=0, connected)"), r.out);
        assertNoStackTrace(r);

        Run j = run("analyze", p.toString(), "--json");
        assertEquals(1, j.status);
        Map<String, Object> red = obj(j.json(), "reduction");
        assertEquals(true, red.get("checked"));
        assertEquals(false, red.get("correct"));
        assertEquals(2.0, red.get("counterexampleCount"));
        assertEquals(List.of(Map.of("x", "01", "f", 0.0, "connected", true), Map.of("x", "10", "f", 0.0, "connected", true)),
            red.get("counterexamples"));
    }

    @Test
    void invalidScenarioExitsTwoNamingTheJsonPath() throws IOException {
        Path p = write("bad.json", parallel("\"function\": \"a | b\",").replace("\"weight\": 2", "\"weight\": -2"));
        for (String[] args : new String[][] {{"analyze", p.toString()}, {"analyze", p.toString(), "--json"}}) {
            Run r = run(args);
            assertEquals(2, r.status);
            assertTrue(r.err.contains("$.graph.edges[1].weight"), r.err);
            assertTrue(r.err.contains("weight must be a finite number > 0"), r.err);
            assertEquals("", r.out, "nothing on stdout for an invalid scenario");
            assertNoStackTrace(r);
        }
    }

    /** 21 variables under a promise that allows every input: 2^21 inputs, one s–t edge on x1. */
    static String wideDomain() {
        StringBuilder vars = new StringBuilder();
        for (int i = 1; i <= 21; i++) {
            vars.append(i > 1 ? ", " : "").append("\"x").append(i).append('"');
        }
        return "{\"format\": \"spanwright-scenario\", \"version\": 1, \"variables\": [" + vars + "],"
            + " \"promise\": \"x1 | !x1\", \"graph\": {\"s\": \"s\", \"t\": \"t\","
            + " \"vertices\": [{\"id\": \"s\"}, {\"id\": \"t\"}], \"edges\": [{\"u\": \"s\", \"v\": \"t\", \"when\": \"x1\"}]}}";
    }

    @Test
    void listingMoreThanTwoToTheTwentyInputsIsRefusedBeforeTheWork() throws IOException {
        // the stated limit (docs/scenario-format.md): rows for at most 2^20 inputs; 2^21 is refused
        // with exit 2 and what to use instead, text and JSON alike; without --inputs it runs
        Path p = write("wide.json", wideDomain());
        for (String[] args : new String[][] {{"analyze", p.toString(), "--inputs"},
                {"analyze", p.toString(), "--json", "--inputs"}}) {
            Run r = run(args);
            assertEquals(2, r.status, r.err);
            assertTrue(r.err.contains("too-many-inputs") || r.err.contains("2^20"), r.err);
            assertTrue(r.err.contains("2097152") && r.err.contains("--input BITS"), r.err);
            assertEquals("", r.out);
            assertNoStackTrace(r);
        }
    }

    @Test
    void malformedJsonExitsTwoWithLineAndColumn() throws IOException {
        Path p = write("broken.json", "{\"format\": \"spanwright-scenario\",\n  \"version\": 1\n  \"title\": \"x\"}");
        Run r = run("analyze", p.toString());
        assertEquals(2, r.status);
        assertTrue(r.err.contains("$: malformed JSON at line 3, column 3"), r.err);
        assertNoStackTrace(r);
    }

    @Test
    void otherInvalidScenariosExitTwo() throws IOException {
        // an unknown variable in a condition, and a promise whose domain is empty (derived: a & !a is never 1)
        Path unknown = write("unknown.json", parallel("").replace("\"when\": \"b\"", "\"when\": \"c\""));
        Run r = run("analyze", unknown.toString());
        assertEquals(2, r.status);
        assertTrue(r.err.contains("$.graph.edges[1].when") && r.err.contains("unknown variable \"c\""), r.err);
        Path empty = write("empty.json", parallel("\"promise\": \"a & !a\","));
        Run e = run("analyze", empty.toString());
        assertEquals(2, e.status);
        assertTrue(e.err.contains("$.promise") && e.err.contains("none of the"), e.err);
        assertNoStackTrace(r);
        assertNoStackTrace(e);
    }

    @Test
    void badUsageExitsTwo() throws IOException {
        Run unknownOption = run("analyze", "--frobnicate");
        assertEquals(2, unknownOption.status);
        assertTrue(unknownOption.err.contains("unknown option --frobnicate"), unknownOption.err);

        Path missing = dir.resolve("no-such-file.json");
        Run missingFile = run("analyze", missing.toString());
        assertEquals(2, missingFile.status);
        assertTrue(missingFile.err.contains("no such file") && missingFile.err.contains("no-such-file.json"),
            missingFile.err);

        Path a = write("a.json", parallel(""));
        Run twoFiles = run("analyze", a.toString(), a.toString());
        assertEquals(2, twoFiles.status);
        assertTrue(twoFiles.err.contains("one FILE at most"), twoFiles.err);

        Run unknownCommand = run("analyse-this");
        assertEquals(2, unknownCommand.status);
        assertTrue(unknownCommand.err.contains("unknown command \"analyse-this\""), unknownCommand.err);

        Run directory = run("analyze", dir.toString());
        assertEquals(2, directory.status, "a folder is not a scenario file");

        Run none = run();
        assertEquals(2, none.status);
        assertTrue(none.err.contains("usage:"), "usage goes to stderr when no command is given: " + none.err);

        Run help = run("--help");
        assertEquals(0, help.status);
        assertTrue(help.out.contains("analyze [FILE] [--json] [--inputs]"), help.out);

        for (Run r : List.of(unknownOption, missingFile, twoFiles, unknownCommand, directory, none)) {
            assertNoStackTrace(r);
        }
    }

    @Test
    void selfLoopWarningGoesToStderrAndTheRunSucceeds() throws IOException {
        Path p = write("loop.json", parallel("\"function\": \"a | b\",").replace("]}}",
            ", {\"id\": \"spin\", \"u\": \"t\", \"v\": \"t\", \"when\": \"a\"}]}}"));
        Run r = run("analyze", p.toString());
        assertEquals(0, r.status, r.err);
        assertTrue(r.err.contains("warning") && r.err.contains("\"spin\"") && r.err.contains("self-loop"), r.err);
    }

    // ------------------------------------------------------------------ --json keys

    @Test
    void jsonHasEveryKeyOfTheIssue() {
        Map<String, Object> m = run("analyze", "--json").json();
        for (String k : new String[] {"title", "variables", "vertices", "edges", "domainSize", "reduction",
            "positive", "negative", "complexity"}) {
            assertTrue(m.containsKey(k), "key " + k + " in " + m.keySet());
        }
        assertTrue(m.get("title") instanceof String);
        assertTrue(m.get("variables") instanceof List);
        for (Object v : (List<?>) m.get("variables")) {
            assertTrue(v instanceof String, "variable names are strings");
        }
        assertTrue(m.get("vertices") instanceof Double);
        assertTrue(m.get("edges") instanceof Double);
        assertTrue(m.get("domainSize") instanceof Double);
        assertNumberOrNull(m.get("complexity"), "complexity");

        Map<String, Object> red = obj(m, "reduction");
        for (String k : new String[] {"checked", "correct", "counterexampleCount", "counterexamples"}) {
            assertTrue(red.containsKey(k), "reduction." + k);
        }
        assertTrue(red.get("checked") instanceof Boolean);
        assertTrue(red.get("correct") instanceof Boolean || red.get("correct") == Json.NULL);
        assertTrue(red.get("counterexampleCount") instanceof Double);
        assertTrue(red.get("counterexamples") instanceof List);

        int n = ((List<?>) m.get("variables")).size();
        for (String side : new String[] {"positive", "negative"}) {
            Map<String, Object> s = obj(m, side);
            String max = side.equals("positive") ? "maxResistance" : "maxCapacitance";
            for (String k : new String[] {"count", max, "worst"}) {
                assertTrue(s.containsKey(k), side + "." + k);
            }
            assertTrue(s.get("count") instanceof Double);
            assertNumberOrNull(s.get(max), side + "." + max);
            String worst = (String) s.get("worst");
            assertEquals(n, worst.length(), "worst is an input string");
            assertTrue(worst.matches("[01]+"), worst);
        }
        // Source: definition — complexity = sqrt(W+ W-)
        double wPlus = (Double) obj(m, "positive").get("maxResistance");
        double wMinus = (Double) obj(m, "negative").get("maxCapacitance");
        assertEquals(Math.sqrt(wPlus * wMinus), (Double) m.get("complexity"), 1e-12);
        assertEquals((Double) m.get("domainSize"),
            (Double) obj(m, "positive").get("count") + (Double) obj(m, "negative").get("count"));
        assertFalse(m.containsKey("inputs"), "inputs only with --inputs");
    }

    @Test
    void jsonCorrectIsNullWithoutAFunction() throws IOException {
        Path p = write("nofunction.json", parallel(""));
        Run r = run("analyze", p.toString(), "--json");
        assertEquals(0, r.status, r.err);
        Map<String, Object> red = obj(r.json(), "reduction");
        assertEquals(false, red.get("checked"));
        assertSame(Json.NULL, red.get("correct"));
        assertEquals(0.0, red.get("counterexampleCount"));
        Run h = run("analyze", p.toString());
        assertTrue(h.out.contains("not checked"), h.out);
    }

    @Test
    void jsonValuesOfTheParallelScenario() throws IOException {
        // Derived: edges s–t of resistance 1 (a) and 2 (b). Positive inputs 01 (R = 2), 10 (R = 1),
        // 11 (R = 1·2/(1+2) = 2/3); W+ = 2 at 01. Negative input 00: both edges absent, capacitors
        // 1/1 and 1/2 in parallel between s and t, C = 1.5 = W-. Bound sqrt(2 · 1.5) = sqrt(3).
        Path p = write("parallel.json", parallel("\"function\": \"a | b\","));
        Map<String, Object> m = run("analyze", p.toString(), "--json").json();
        assertEquals(4.0, m.get("domainSize"));
        assertEquals(2.0, m.get("vertices"));
        assertEquals(2.0, m.get("edges"));
        assertEquals(3.0, obj(m, "positive").get("count"));
        assertEquals(2.0, (Double) obj(m, "positive").get("maxResistance"), 1e-12);
        assertEquals("01", obj(m, "positive").get("worst"));
        assertEquals(1.0, obj(m, "negative").get("count"));
        assertEquals(1.5, (Double) obj(m, "negative").get("maxCapacitance"), 1e-12);
        assertEquals("00", obj(m, "negative").get("worst"));
        assertEquals(Math.sqrt(3), (Double) m.get("complexity"), 1e-12);
    }

    @Test
    void complexityIsNullWhenASideIsEmpty() throws IOException {
        // Derived: a single always-present s–t edge connects s and t on every input, so there is
        // no negative input: W- and the bound are undefined.
        Path p = write("always.json", parallel("\"function\": \"1\",")
            .replace("\"when\": \"a\"", "\"when\": \"1\"").replace("\"when\": \"b\"", "\"when\": \"1\""));
        Run r = run("analyze", p.toString(), "--json");
        assertEquals(0, r.status, r.err);
        Map<String, Object> m = r.json();
        assertSame(Json.NULL, m.get("complexity"));
        assertEquals(0.0, obj(m, "negative").get("count"));
        assertSame(Json.NULL, obj(m, "negative").get("maxCapacitance"));
        assertSame(Json.NULL, obj(m, "negative").get("worst"));
        assertEquals(4.0, obj(m, "positive").get("count"));
        // derived: 1 ∥ 2 = 2/3 on every input
        assertEquals(2.0 / 3.0, (Double) obj(m, "positive").get("maxResistance"), 1e-12);
        Run h = run("analyze", p.toString());
        assertTrue(h.out.contains("no negative inputs"), h.out);
    }

    // ------------------------------------------------------------------ --inputs

    @Test
    void inputsAddsOneRowPerInput() throws IOException {
        Path p = write("parallel.json", parallel("\"function\": \"a | b\","));
        Map<String, Object> m = run("analyze", p.toString(), "--json", "--inputs").json();
        assertTrue(m.get("inputs") instanceof List, "inputs array");
        List<?> rows = (List<?>) m.get("inputs");
        assertEquals(4, rows.size());
        // Derived (see jsonValuesOfTheParallelScenario): 00 → C 1.5; 01 → R 2; 10 → R 1; 11 → R 2/3.
        String[] x = {"00", "01", "10", "11"};
        boolean[] connected = {false, true, true, true};
        double[] value = {1.5, 2.0, 1.0, 2.0 / 3.0};
        for (int i = 0; i < 4; i++) {
            @SuppressWarnings("unchecked")
            Map<String, Object> row = (Map<String, Object>) rows.get(i);
            for (String k : new String[] {"x", "connected", "f", "value"}) {
                assertTrue(row.containsKey(k), "inputs[" + i + "]." + k);
            }
            assertEquals(x[i], row.get("x"));
            assertEquals(connected[i], row.get("connected"));
            assertEquals(connected[i] ? 1.0 : 0.0, row.get("f"));
            assertEquals(value[i], (Double) row.get("value"), 1e-12);
        }
        // without a function, f is null
        Path q = write("nofunction.json", parallel(""));
        List<?> rows2 = (List<?>) run("analyze", q.toString(), "--inputs", "--json").json().get("inputs");
        for (Object o : rows2) {
            assertSame(Json.NULL, ((Map<?, ?>) o).get("f"));
        }
        // the human form gets a table with one line per input
        Run h = run("analyze", p.toString(), "--inputs");
        assertEquals(0, h.status);
        assertTrue(h.out.contains("00  0  no   C = 1.5"), h.out);
        assertTrue(h.out.contains("01  1  yes  R = 2"), h.out);
        assertTrue(h.out.contains("11  1  yes  R = 0.6666666667"), h.out);
    }

    @Test
    void inputsRowsAgreeWithTheSummaryOnTheDefaultScenario() {
        // Source: definitions — W+ is the largest R over connected rows, W- the largest C over the
        // others; the counts are the numbers of such rows; worst names a row holding the maximum.
        Map<String, Object> m = run("analyze", "--json", "--inputs").json();
        List<?> rows = (List<?>) m.get("inputs");
        assertEquals(((Double) m.get("domainSize")).intValue(), rows.size());
        double maxR = Double.NEGATIVE_INFINITY;
        double maxC = Double.NEGATIVE_INFINITY;
        int pos = 0;
        String worstP = (String) obj(m, "positive").get("worst");
        String worstN = (String) obj(m, "negative").get("worst");
        Double worstPValue = null;
        Double worstNValue = null;
        String previous = "";
        for (Object o : rows) {
            Map<?, ?> row = (Map<?, ?>) o;
            String x = (String) row.get("x");
            assertTrue(x.compareTo(previous) > 0, "rows in input order");
            previous = x;
            double v = (Double) row.get("value");
            boolean c = (Boolean) row.get("connected");
            assertEquals(c ? 1.0 : 0.0, row.get("f"), "the default scenario is a correct reduction");
            if (c) {
                pos++;
                maxR = Math.max(maxR, v);
            } else {
                maxC = Math.max(maxC, v);
            }
            if (x.equals(worstP)) {
                worstPValue = v;
            }
            if (x.equals(worstN)) {
                worstNValue = v;
            }
        }
        assertEquals(((Double) obj(m, "positive").get("count")).intValue(), pos);
        assertEquals(maxR, (Double) obj(m, "positive").get("maxResistance"), 1e-12 * maxR);
        assertEquals(maxC, (Double) obj(m, "negative").get("maxCapacitance"), 1e-12 * maxC);
        assertNotNull(worstPValue);
        assertNotNull(worstNValue);
        assertEquals(maxR, worstPValue, 1e-12 * maxR);
        assertEquals(maxC, worstNValue, 1e-12 * maxC);
    }

    // ------------------------------------------------------------------ JSON versus human summary

    private static final Pattern DOMAIN = Pattern.compile("(?m)^  domain\\s+(\\d+) inputs");
    private static final Pattern GRAPH = Pattern.compile("(?m)^  graph\\s+(\\d+) vertices, (\\d+) edges");
    private static final Pattern POSITIVE = Pattern.compile("(?m)^  positive\\s+(\\d+) inputs\\s+W\\+ = max R = (\\S+)\\s*(?:worst ([01]+))?$");
    private static final Pattern NEGATIVE = Pattern.compile("(?m)^  negative\\s+(\\d+) inputs\\s+W- = max C = (\\S+)\\s*(?:worst ([01]+))?$");
    private static final Pattern BOUND = Pattern.compile("(?m)^  bound\\s+sqrt\\(W\\+ W-\\) = (\\S+)");

    private static Matcher find(Pattern p, String text) {
        Matcher m = p.matcher(text);
        assertTrue(m.find(), p + " in:\n" + text);
        return m;
    }

    /** The summary shows 10 significant digits; the JSON value must print the same. */
    private static void assertSameNumber(Object json, String shown, String what) {
        if (json == Json.NULL) {
            assertEquals(NumberText.sig(Double.NaN, 10), shown, what);
            return;
        }
        double v = (Double) json;
        assertEquals(NumberText.sig(v, 10), shown, what);
        assertEquals(v, Double.parseDouble(shown), 1e-9 * Math.abs(v), what);
    }

    private void assertJsonMatchesSummary(String... fileArgs) {
        String[] j = new String[fileArgs.length + 2];
        String[] h = new String[fileArgs.length + 1];
        j[0] = "analyze";
        h[0] = "analyze";
        System.arraycopy(fileArgs, 0, j, 1, fileArgs.length);
        System.arraycopy(fileArgs, 0, h, 1, fileArgs.length);
        j[j.length - 1] = "--json";
        Run jr = run(j);
        Run hr = run(h);
        assertEquals(jr.status, hr.status);
        Map<String, Object> m = jr.json();
        String s = hr.out;
        assertTrue(s.startsWith((String) m.get("title")), s);
        assertEquals(((Double) m.get("domainSize")).longValue(), Long.parseLong(find(DOMAIN, s).group(1)));
        Matcher g = find(GRAPH, s);
        assertEquals(((Double) m.get("vertices")).longValue(), Long.parseLong(g.group(1)));
        assertEquals(((Double) m.get("edges")).longValue(), Long.parseLong(g.group(2)));
        Matcher pm = find(POSITIVE, s);
        Map<String, Object> pos = obj(m, "positive");
        assertEquals(((Double) pos.get("count")).longValue(), Long.parseLong(pm.group(1)));
        assertSameNumber(pos.get("maxResistance"), pm.group(2), "W+");
        assertEquals(pos.get("worst") == Json.NULL ? null : pos.get("worst"), pm.group(3));
        Matcher nm = find(NEGATIVE, s);
        Map<String, Object> neg = obj(m, "negative");
        assertEquals(((Double) neg.get("count")).longValue(), Long.parseLong(nm.group(1)));
        assertSameNumber(neg.get("maxCapacitance"), nm.group(2), "W-");
        assertEquals(neg.get("worst") == Json.NULL ? null : neg.get("worst"), nm.group(3));
        assertSameNumber(m.get("complexity"), find(BOUND, s).group(1), "bound");
    }

    @Test
    void jsonNumbersEqualTheHumanSummary() throws IOException {
        assertJsonMatchesSummary();
        assertJsonMatchesSummary(write("parallel.json", parallel("\"function\": \"a | b\",")).toString());
        assertJsonMatchesSummary(write("wrong.json", parallel("\"function\": \"a & b\",")).toString());
        for (String name : new String[] {"ferry-bridge.json", "inverter-ladder.json"}) {
            Path p = Path.of("..", "scenarios", name);
            if (Files.exists(p)) {
                assertJsonMatchesSummary(p.toString());
            }
        }
    }
}
