package spanwright.facade;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import spanwright.analysis.Analysis;
import spanwright.analysis.InputDetail;
import spanwright.io.Json;
import spanwright.io.ScenarioReader;
import spanwright.model.Inputs;
import spanwright.model.Scenario;

/**
 * The TikZ figure: its structure (one {@code \draw} per edge, dashed exactly on the absent
 * edges of the focused input, arrows only on edges that carry current, s and t shapes, the
 * caption's numbers) and, when pdflatex is installed, that both forms compile.
 */
class TikzFigureTest {
    private static final Pattern DRAW = Pattern.compile("(?m)^\\\\draw\\[(swpresent|swabsent)([^\\]]*)\\]");

    @TempDir
    Path dir;

    private static Scenario scenario(String name) throws IOException {
        return ScenarioReader.read(Files.readString(Path.of("../scenarios", name)));
    }

    @Test
    void oneDrawPerEdgeDashedExactlyWhereAbsent() throws IOException {
        for (String name : new String[] {"default.json", "inverter-ladder.json"}) {
            Scenario sc = scenario(name);
            int n = sc.variableCount();
            for (long mask : new long[] {0, (1L << n) - 1, 0b101 % (1L << n)}) {
                InputDetail d = Analysis.detail(sc, mask);
                String body = TikzFigure.draw(sc, mask, new double[] {1, 1}).body;
                Matcher m = DRAW.matcher(body);
                int k = 0;
                while (m.find()) {
                    // the k-th \draw is the k-th edge: solid when present in G(x), dashed (swabsent) when not
                    assertEquals(d.present[k] ? "swpresent" : "swabsent", m.group(1), name + " edge " + k);
                    boolean arrow = m.group(2).contains("Stealth");
                    boolean carries = d.witness.connected && d.present[k] && Math.abs(d.witness.current[k]) > 1e-12;
                    assertEquals(carries, arrow, name + " edge " + k + ": an arrow exactly where current flows");
                    k++;
                }
                assertEquals(sc.edges().size(), k, name + ": one \\draw per edge");
                assertTrue(body.contains("\\node[swsource") && body.contains("\\node[swtarget"), "s and t shapes");
                assertTrue(body.contains("swabsent/.style={draw=black!40, line width=0.8pt, dashed}"), "absent = dashed");
                String caption = d.witness.connected ? "R = " : "C = ";
                assertTrue(body.contains("Input x = " + Inputs.format(mask, n)) && body.contains(caption), body);
                if (!d.witness.connected) {
                    assertTrue(body.contains("\\shade[left color=swlow"), "the potential colour key");
                }
            }
        }
    }

    @Test
    void withoutAnInputEveryEdgeIsSolidAndTheCaptionCarriesTheBound() throws IOException {
        Scenario sc = scenario("default.json");
        String body = TikzFigure.draw(sc, -1, null).body;
        Matcher m = DRAW.matcher(body);
        int k = 0;
        while (m.find()) {
            assertEquals("swpresent", m.group(1));
            k++;
        }
        assertEquals(sc.edges().size(), k);
        // the caption's bound is the analysis's (an independent run of the same entry, printed alike)
        double c = Analysis.run(sc).complexity();
        assertTrue(body.contains("bound sqrt(W+ W-) = " + spanwright.io.NumberText.sig(c, 6)), body);
        assertTrue(body.contains("weight = resistance"), "the normalisation");
        assertFalse(body.contains("\u2212") || body.contains("\u221e"), "no raw non-ASCII signs for pdflatex");
    }

    @Test
    @SuppressWarnings("unchecked")
    void theCaptionLinesSayWhenTheBoundIsNoBoundForF() throws IOException {
        // the default graph is an OR of three ANDs; f = n1 & n2 is not what it decides, so sqrt(W+ W-)
        // bounds no algorithm for f (common practice, no source: a reduction must decide f)
        String json = Files.readString(Path.of("../scenarios/default.json"))
                .replace("\"function\": \"(n1 & n2) | (s1 & s2) | (p & q)\"", "\"function\": \"n1 & n2\"");
        assertTrue(json.contains("\"n1 & n2\""), "the function was replaced");
        Map<String, Object> wrong = (Map<String, Object>) Json.parse(JsonFacade.tikz(json, "{}"));
        List<Object> caption = (List<Object>) wrong.get("caption");
        Map<String, Object> bound = (Map<String, Object>) caption.stream()
                .filter(l -> "bound".equals(((Map<String, Object>) l).get("role"))).findFirst().orElseThrow();
        assertTrue(((String) bound.get("text")).contains("not a bound for f"), bound.toString());
        assertTrue(((String) wrong.get("body")).contains("not a bound for f"), "the TikZ caption says it too");
        // the caller's note (the page passes the Summary's) with given W+ and W-
        Map<String, Object> given = (Map<String, Object>) Json.parse(JsonFacade.tikz(json,
                "{\"positive\":2,\"negative\":4,\"note\":\"not a bound for f: the caller says so\"}"));
        assertTrue(given.get("body").toString().contains("bound sqrt(W+ W-) = 2.82843; not a bound for f: the caller says so."));
        // the right f: no mark, and the lines in order
        Map<String, Object> right = (Map<String, Object>) Json.parse(JsonFacade.tikz(
                Files.readString(Path.of("../scenarios/default.json")), "{\"input\":\"110000\"}"));
        List<String> roles = new java.util.ArrayList<>();
        for (Object l : (List<Object>) right.get("caption")) {
            roles.add((String) ((Map<String, Object>) l).get("role"));
            assertFalse(((String) ((Map<String, Object>) l).get("text")).contains("not a bound"));
        }
        assertEquals(List.of("input", "value", "bound", "normalisation", "caution"), roles);
    }

    @Test
    void facadeAnswersBothFormsAndLocatesABadInput() throws IOException {
        String json = Files.readString(Path.of("../scenarios/default.json"));
        @SuppressWarnings("unchecked")
        Map<String, Object> ok = (Map<String, Object>) Json.parse(JsonFacade.tikz(json, "{\"input\":\"110000\"}"));
        assertEquals(Boolean.TRUE, ok.get("ok"));
        assertTrue(((String) ok.get("standalone")).contains("\\documentclass"));
        assertTrue(((String) ok.get("body")).startsWith("% Input x = 110000"));
        @SuppressWarnings("unchecked")
        Map<String, Object> bad = (Map<String, Object>) Json.parse(JsonFacade.tikz(json, "{\"input\":\"11\"}"));
        assertEquals(Boolean.FALSE, bad.get("ok"));
        @SuppressWarnings("unchecked")
        Map<String, Object> err = (Map<String, Object>) bad.get("error");
        assertEquals("$.input", err.get("path"));
    }

    /** Whether pdflatex runs here. */
    private static boolean pdflatex() {
        for (String p : System.getenv().getOrDefault("PATH", "").split(File.pathSeparator)) {
            if (Files.isExecutable(Path.of(p, "pdflatex"))) {
                return true;
            }
        }
        return false;
    }

    @Test
    @Tag("latex")
    void bothFormsCompileWithPdflatex() throws IOException, InterruptedException {
        Assumptions.assumeTrue(pdflatex(), "pdflatex is not installed: the TikZ compile check is skipped"
                + " (install texlive-latex-base and texlive-pictures; .ci/run does)");
        Scenario sc = scenario("default.json");
        // a positive input (currents) and a negative one (potentials and their key)
        for (long mask : new long[] {0b110000, 0b101000}) {
            TikzFigure.Text t = TikzFigure.draw(sc, mask, null);
            Files.writeString(dir.resolve("figure.tex"), t.standalone, StandardCharsets.UTF_8);
            Files.writeString(dir.resolve("body.tex"), t.body, StandardCharsets.UTF_8);
            Files.writeString(dir.resolve("paper.tex"), "\\documentclass{article}\n\\usepackage{tikz}\n"
                    + "\\begin{document}\nSome text.\n\n\\begin{figure}[h]\\centering\n\\input{body}\n"
                    + "\\caption{A figure.}\\end{figure}\n\\end{document}\n", StandardCharsets.UTF_8);
            for (String doc : new String[] {"figure", "paper"}) {
                Process p = new ProcessBuilder("pdflatex", "-interaction=nonstopmode", "-halt-on-error", doc + ".tex")
                        .directory(dir.toFile()).redirectErrorStream(true).redirectOutput(dir.resolve(doc + ".out").toFile())
                        .start();
                assertTrue(p.waitFor(120, TimeUnit.SECONDS), "pdflatex finished");
                assertEquals(0, p.exitValue(), doc + " (input " + mask + "):\n" + Files.readString(dir.resolve(doc + ".out")));
                assertTrue(Files.size(dir.resolve(doc + ".pdf")) > 1000, doc + ".pdf written");
            }
        }
    }
}
