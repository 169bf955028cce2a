package spanwright.cli;

import java.io.PrintStream;
import java.util.Map;
import spanwright.analysis.Analysis;
import spanwright.analysis.InputDetail;
import spanwright.analysis.StructuralAnalysis;
import spanwright.facade.ResultJson;
import spanwright.facade.StructureJson;
import spanwright.io.Json;
import spanwright.model.Scenario;

/** {@code analyze} beyond enumeration: the structural method and one input's witness at any size. */
final class AnalyzeMore {
    private AnalyzeMore() {}

    static int structure(Scenario sc, Analysis.Choice choice, boolean json, boolean inputs, double seconds,
            PrintStream out, PrintStream err, boolean quiet) {
        if (inputs) {
            throw new Main.UsageException("analyze: --inputs lists every input, and this scenario has 2^"
                    + sc.variableCount() + " of them; the structural method shows the worst inputs instead (drop"
                    + " --inputs), and --input BITS shows any one input's witness");
        }
        StructuralAnalysis.Result r;
        try (Progress progress = Progress.start("analyze", err, quiet)) {
            progress.phase("structural analysis (heaviest path and bond, branch and bound at most "
                    + spanwright.io.NumberText.sig(seconds, 4) + " s per side, then the reduction check)");
            r = StructuralAnalysis.run(sc, seconds);
        }
        if (json) {
            out.println(Json.writePretty(StructureJson.analysis(r, choice)).trim());
        } else {
            out.print(StructureText.summary(r, choice));
        }
        return Boolean.FALSE.equals(r.reduction().correct()) ? Main.WRONG_REDUCTION : Main.OK;
    }

    static int oneInput(Scenario sc, String bits, boolean json, PrintStream out) {
        int n = sc.variableCount();
        if (bits.length() != n || !bits.matches("[01]*")) {
            throw new Main.UsageException("analyze: --input needs " + n + " characters 0/1 (one per variable, in the"
                    + " order of \"variables\"), got " + bits.length() + " characters");
        }
        boolean[] x = new boolean[n];
        for (int i = 0; i < n; i++) {
            x[i] = bits.charAt(i) == '1';
        }
        InputDetail d = StructuralAnalysis.detail(sc, x);
        if (json) {
            Map<String, Object> m = ResultJson.detail(sc, d);
            out.println(Json.writePretty(m).trim());
        } else {
            out.print(StructureText.detail(sc, d));
        }
        return Main.OK;
    }
}
