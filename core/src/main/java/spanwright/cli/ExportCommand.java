package spanwright.cli;

import java.io.PrintStream;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.facade.SimulationJson;
import spanwright.facade.TikzFigure;
import spanwright.io.GraphFormats;
import spanwright.io.ScenarioReader;
import spanwright.model.Scenario;

/**
 * {@code export}: a scenario's graph as GraphML or DOT ({@link GraphFormats}), its drawing as a
 * TikZ figure ({@link TikzFigure}: a document for pdflatex and/or the picture for {@code \input}),
 * optionally with one input's witness. Every file is written through a temporary file and a
 * rename in its folder; an output naming the input file, or two outputs naming the same file, is
 * refused. Exit status 0, or 2 for bad usage or input.
 */
final class ExportCommand {
    private ExportCommand() {}

    static String usage() {
        return "  export FILE.json [--graphml OUT] [--dot OUT] [--tikz OUT.tex] [--tikz-body OUT.tex] [--input X]\n"
                + "      The scenario's graph as GraphML or DOT (literal and weight as edge attributes, s and t\n"
                + "      as graph attributes; build host import reads them back), the drawing as a TikZ figure\n"
                + "      (--tikz: compiles alone with pdflatex; --tikz-body: the picture for \\input), with\n"
                + "      the input X's currents or potentials and a caption (R or C, the bound, the convention).\n";
    }

    static int run(List<String> args, PrintStream out, PrintStream err) {
        String file = null;
        Map<String, String> outputs = new LinkedHashMap<>();
        String input = null;
        for (int i = 0; i < args.size(); i++) {
            String a = args.get(i);
            switch (a) {
                case "--graphml":
                case "--dot":
                case "--tikz":
                case "--tikz-body":
                case "--input": {
                    if (i + 1 >= args.size()) {
                        throw new Main.UsageException("export: " + a + " needs a value");
                    }
                    String v = args.get(++i);
                    if (a.equals("--input")) {
                        input = v;
                    } else if (outputs.put(a, v) != null) {
                        throw new Main.UsageException("export: " + a + " given twice");
                    }
                    break;
                }
                default:
                    if (a.startsWith("-")) {
                        throw new Main.UsageException("export: unknown option " + a + "\n" + usage());
                    }
                    if (file != null) {
                        throw new Main.UsageException("export: one FILE.json (got " + file + " and " + a + ")");
                    }
                    file = a;
            }
        }
        if (file == null) {
            throw new Main.UsageException("export: give the scenario FILE.json\n" + usage());
        }
        if (outputs.isEmpty()) {
            throw new Main.UsageException("export: say what to write: --graphml, --dot, --tikz or --tikz-body\n" + usage());
        }
        if (input != null && !outputs.containsKey("--tikz") && !outputs.containsKey("--tikz-body")) {
            throw new Main.UsageException("export: --input chooses the input the TikZ figure shows; add --tikz or --tikz-body");
        }
        OutputFiles.refuseClashes("export", java.util.List.of(file), new java.util.ArrayList<>(outputs.values()));
        Scenario sc = ScenarioReader.read(Main.readScenarioText(file));
        for (String w : sc.warnings()) {
            err.println("spanwright: warning: " + w);
        }
        boolean[] x = input == null ? null : SimulationJson.bits(input, sc, "--input");
        TikzFigure.Text tikz = null;
        if (outputs.containsKey("--tikz") || outputs.containsKey("--tikz-body")) {
            tikz = TikzFigure.draw(sc, x, null, null);
        }
        for (Map.Entry<String, String> o : outputs.entrySet()) {
            String text;
            switch (o.getKey()) {
                case "--graphml":
                    text = GraphFormats.writeGraphML(sc);
                    break;
                case "--dot":
                    text = GraphFormats.writeDot(sc);
                    break;
                case "--tikz":
                    text = tikz.standalone;
                    break;
                default:
                    text = tikz.body;
            }
            OutputFiles.write("export", o.getValue(), text);
            err.println("spanwright: wrote " + o.getValue());
        }
        return Main.OK;
    }
}
