package spanwright.cli;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.io.GraphFile;
import spanwright.io.GraphFormats;
import spanwright.reduction.Built;
import spanwright.reduction.BuildRequest;
import spanwright.reduction.HostGraphBuilder;
import spanwright.io.Json;
import spanwright.model.ScenarioException;
import spanwright.io.ScenarioWriter;

/**
 * {@code build}: writes a format-v1 scenario built from a formula, a function, a host graph or a
 * composition, to stdout or {@code -o FILE}; a summary of the construction goes to stderr. The
 * arguments become the same request the page sends ({@link spanwright.facade.JsonFacade#build}), run
 * by {@link BuildRequest}. Exit status 0, or 2 for bad usage or input (the message names the
 * argument or file at fault).
 */
final class BuildCommand {
    private BuildCommand() {}

    static String usage() {
        return "  build formula EXPR [--vars a,b,c] [--weights rule|unit] [-o FILE] [--quiet]\n"
                + "  build tree EXPR|TABLE [--vars a,b,c] [--diagram] [--order a,b,c] [--weights guess|unit] [-o FILE]\n"
                + "  build host FAMILY SIZE [--s V] [--t V] [--seed N] [--at-most-missing K] [-o FILE]\n"
                + "  build host given FILE [--s V] [--t V] [--at-most-missing K] [-o FILE]\n"
                + "  build host import GRAPHFILE [--format graphml|dot|gml|csv] [--s V] [--t V]\n"
                + "                  [--literal-key NAME] [--weight-key NAME] [--at-most-missing K] [-o FILE]\n"
                + "  build compose OUTER.json INNER.json|GADGET [-o FILE]\n"
                + "      Write a scenario built from a formula (series-parallel), a function (decision tree\n"
                + "      or diagram; TABLE = 2^n characters 0/1), a host graph (FAMILY: path, cycle, grid,\n"
                + "      complete, bipartite, hypercube, random; SIZE like 3x4; or a GraphML, DOT, GML or\n"
                + "      CSV edge-list file: one variable per edge, or the literal from the edge attribute\n"
                + "      --literal-key; weight from --weight-key, default \"weight\") or a composition\n"
                + "      (GADGET: a built-in inner scenario, either-of-2 (p | q), both-of-2 (p & q),\n"
                + "      two-of-3 (majority)).\n"
                + "      A summary goes to stderr; --quiet (any form) leaves it and the progress lines out.\n";
    }

    static int run(List<String> args, PrintStream out, PrintStream err) {
        if (args.isEmpty()) {
            throw new Main.UsageException("build: say what to build from: formula, tree, host or compose\n" + usage());
        }
        String what = args.get(0);
        List<String> positional = new ArrayList<>();
        Map<String, String> options = new LinkedHashMap<>();
        boolean quiet = false;
        for (int i = 1; i < args.size(); i++) {
            String a = args.get(i);
            if (a.equals("--quiet")) {
                quiet = true;
            } else if (a.equals("--diagram")) {
                options.put(a, "true");
            } else if (a.equals("-o") || (a.startsWith("--") && a.length() > 2)) {
                if (i + 1 >= args.size()) {
                    throw new Main.UsageException("build " + what + ": " + a + " needs a value");
                }
                options.put(a, args.get(++i));
            } else {
                positional.add(a);
            }
        }
        Map<String, Object> request = new LinkedHashMap<>();
        Map<String, String> files = new LinkedHashMap<>();
        String importFile = null;
        switch (what) {
            case "formula":
                allow(what, options, "--vars", "--weights", "-o");
                request.put("kind", "formula");
                request.put("expression", one(what, positional, "EXPR"));
                putList(request, "variables", options.get("--vars"));
                putString(request, "weights", options.get("--weights"));
                break;
            case "tree":
                allow(what, options, "--vars", "--diagram", "--order", "--weights", "-o");
                request.put("kind", "tree");
                request.put("function", one(what, positional, "EXPR|TABLE"));
                putList(request, "variables", options.get("--vars"));
                putList(request, "order", options.get("--order"));
                putString(request, "weights", options.get("--weights"));
                request.put("diagram", options.containsKey("--diagram"));
                break;
            case "host": {
                if (positional.size() == 2 && positional.get(0).equals("import")) {
                    allow(what, options, "--s", "--t", "--format", "--literal-key", "--weight-key", "--at-most-missing",
                            "-o");
                    files.put("$.graph", positional.get(1));
                    importFile = positional.get(1);
                    break;
                }
                allow(what, options, "--s", "--t", "--seed", "--at-most-missing", "-o");
                if (positional.size() != 2) {
                    throw new Main.UsageException("build host: give FAMILY and SIZE (e.g. grid 3x4), given FILE.json"
                            + " or import GRAPHFILE");
                }
                request.put("kind", "host");
                request.put("family", positional.get(0));
                if (positional.get(0).equals("given")) {
                    files.put("$.scenario", positional.get(1));
                    request.put("scenario", readJson(positional.get(1)));
                } else {
                    request.put("size", size(positional.get(1)));
                }
                putString(request, "s", options.get("--s"));
                putString(request, "t", options.get("--t"));
                putNumber(request, "seed", options.get("--seed"), "--seed");
                putNumber(request, "atMostMissing", options.get("--at-most-missing"), "--at-most-missing");
                break;
            }
            case "compose":
                allow(what, options, "-o");
                if (positional.size() != 2) {
                    throw new Main.UsageException("build compose: give OUTER.json and INNER.json (or a built-in gadget: "
                            + String.join(", ", spanwright.reduction.Gadgets.names()) + ")");
                }
                request.put("kind", "compose");
                files.put("$.outer", positional.get(0));
                request.put("outer", readJson(positional.get(0)));
                String inner = positional.get(1);
                if (spanwright.reduction.Gadgets.find(inner) != null && !java.nio.file.Files.exists(java.nio.file.Path.of(inner))) {
                    request.put("inner", inner); // a built-in gadget
                } else {
                    files.put("$.inner", inner);
                    request.put("inner", readJson(inner));
                }
                break;
            default:
                throw new Main.UsageException("build: unknown kind \"" + what + "\" (formula, tree, host, compose)");
        }
        List<String> inputs = new ArrayList<>(files.values());
        inputs.add(importFile);
        OutputFiles.refuseClashes("build " + what, inputs, Arrays.asList(options.get("-o")));
        Built built;
        try (Progress progress = Progress.start("build " + what, err, quiet)) {
            progress.phase("building the scenario and checking that it decides its function");
            built = importFile != null ? importHost(importFile, options) : BuildRequest.run(request);
        } catch (ScenarioException e) {
            err.println("spanwright: build " + what + ": " + where(e.path(), files) + ": " + e.getMessage() + " ["
                    + e.code() + "]");
            return Main.INVALID;
        }
        String text = ScenarioWriter.write(built.scenario());
        String file = options.get("-o");
        if (file == null) {
            out.print(text);
        } else {
            OutputFiles.write("build", file, text);
            if (!quiet) {
                err.println("spanwright: wrote " + file);
            }
        }
        if (!quiet) {
            err.print(builtText(built.stats()));
        }
        return Main.OK;
    }

    /**
     * {@code build host import}: the graph file read through {@link GraphFormats} (format from
     * {@code --format} or the file name's ending), then {@link spanwright.reduction.HostGraphBuilder#imported}.
     * Not a {@link BuildRequest}: the page's build must not reach jgrapht-io (see GraphFormats).
     */
    private static Built importHost(String file, Map<String, String> options) {
        String named = options.get("--format");
        GraphFile.Format format = named != null ? GraphFile.Format.named(named) : GraphFile.Format.ofFileName(file);
        if (format == null) {
            throw new Main.UsageException("build host import: " + (named != null ? "unknown format \"" + named + "\""
                    : "cannot tell the format of " + file + " from its name") + "; give --format graphml, dot, gml or csv");
        }
        int missing = -1;
        if (options.get("--at-most-missing") != null) {
            try {
                missing = Integer.parseInt(options.get("--at-most-missing").trim());
            } catch (NumberFormatException e) {
                missing = -2;
            }
            if (missing < 0) {
                throw new Main.UsageException("build host: --at-most-missing takes a whole number >= 0, got \""
                        + options.get("--at-most-missing") + "\"");
            }
        }
        GraphFile g = GraphFormats.read(Main.readScenarioText(file), format, "$.graph");
        return HostGraphBuilder.imported(g, options.get("--s"), options.get("--t"), missing,
                options.get("--literal-key"), options.getOrDefault("--weight-key", GraphFormats.WEIGHT));
    }

    /**
     * Words for the builders' statistics, as the options and docs/builders.md name things (the JSON
     * keys stay in the page's answer and in {@code stats}); a key not listed is split into words.
     */
    private static final String[][] STAT_WORDS = {
        {"strategy", "tree shape"}, {"order", "query order (--order)"}, {"output", "output (--diagram: diagram)"},
        {"depth", "depth T (queries on the longest path)"}, {"wrongGuesses", "guess rank G (most wrong guesses on a path)"},
        {"treeDecisionVertices", "tree: decision vertices"}, {"treeVertices", "tree: vertices"}, {"treeEdges", "tree: edges"},
        {"diagramDecisionVertices", "diagram: decision vertices"}, {"diagramVertices", "diagram: vertices"},
        {"diagramEdges", "diagram: edges"}, {"weights", "weights (--weights)"},
        {"boundPositive", "W+ at most (guaranteed)"}, {"boundNegative", "W- at most (guaranteed)"},
        {"leaves", "leaves (literal occurrences)"}, {"readOnce", "read-once"},
        {"predictedPositive", "predicted W+"}, {"predictedNegative", "predicted W-"},
        {"predictedComplexity", "predicted sqrt(W+ W-)"},
        {"outerPositive", "outer W+"}, {"outerNegative", "outer W-"}, {"innerPositive", "inner W+"},
        {"innerNegative", "inner W-"}, {"negatedInnerPositive", "negated inner W+"},
        {"negatedInnerNegative", "negated inner W-"}, {"productBound", "W+ W- at most (outer x inner)"},
        {"gadgets", "inner copies"}, {"inner", "inner scenario"}, {"family", "host family"}, {"size", "SIZE"},
        {"s", "s (--s)"}, {"t", "t (--t)"}, {"paths", "simple s-t paths"}, {"promise", "promise"},
        {"functionOmitted", "function omitted"}, {"format", "file format (--format)"}
    };

    /** The construction's summary for stderr: a header with the sizes, then one labelled line per statistic. */
    static String builtText(Map<String, Object> stats) {
        StringBuilder sb = new StringBuilder("spanwright: built a scenario of ");
        sb.append(statValue(stats.get("vertices"))).append(" vertices, ").append(statValue(stats.get("edges")))
                .append(" edges and ").append(statValue(stats.get("variables"))).append(" variables\n");
        int width = 0;
        for (String k : stats.keySet()) {
            width = Math.max(width, statLabel(k).length());
        }
        for (Map.Entry<String, Object> e : stats.entrySet()) {
            String k = e.getKey();
            if (k.equals("vertices") || k.equals("edges") || k.equals("variables")) {
                continue;
            }
            sb.append("  ").append(Main.pad(statLabel(k), width + 2)).append(statValue(e.getValue())).append('\n');
        }
        return sb.toString();
    }

    static String statLabel(String key) {
        for (String[] w : STAT_WORDS) {
            if (w[0].equals(key)) {
                return w[1];
            }
        }
        StringBuilder sb = new StringBuilder();
        for (char c : key.toCharArray()) {
            if (Character.isUpperCase(c)) {
                sb.append(' ').append(Character.toLowerCase(c));
            } else {
                sb.append(c);
            }
        }
        return sb.toString();
    }

    static String statValue(Object v) {
        if (v == null || v == Json.NULL) {
            return "not counted";
        }
        if (v instanceof Boolean) {
            return (Boolean) v ? "yes" : "no";
        }
        if (v instanceof Number) {
            double d = ((Number) v).doubleValue();
            return d == Math.rint(d) && Math.abs(d) < 1e15 ? String.valueOf((long) d) : spanwright.io.NumberText.sig(d, 10);
        }
        if (v instanceof List) {
            List<?> l = (List<?>) v;
            boolean numbers = !l.isEmpty();
            StringBuilder sb = new StringBuilder();
            for (Object o : l) {
                numbers &= o instanceof Number;
            }
            for (int i = 0; i < l.size(); i++) {
                sb.append(i == 0 ? "" : numbers ? "x" : ", ").append(statValue(l.get(i)));
            }
            return sb.toString();
        }
        return String.valueOf(v);
    }

    private static void allow(String what, Map<String, String> options, String... allowed) {
        for (String o : options.keySet()) {
            if (!List.of(allowed).contains(o)) {
                throw new Main.UsageException("build " + what + ": unknown option " + o);
            }
        }
    }

    private static String one(String what, List<String> positional, String name) {
        if (positional.size() != 1) {
            throw new Main.UsageException("build " + what + ": give exactly one " + name + " (quote it)"
                    + (positional.isEmpty() ? "" : "; got " + positional.size() + " arguments"));
        }
        return positional.get(0);
    }

    private static void putString(Map<String, Object> request, String key, String value) {
        if (value != null) {
            request.put(key, value);
        }
    }

    private static void putList(Map<String, Object> request, String key, String value) {
        if (value != null) {
            List<Object> l = new ArrayList<>();
            for (String part : value.split(",", -1)) {
                l.add(part.trim());
            }
            request.put(key, l);
        }
    }

    private static void putNumber(Map<String, Object> request, String key, String value, String option) {
        if (value != null) {
            try {
                request.put(key, (double) Long.parseLong(value.trim()));
            } catch (NumberFormatException e) {
                throw new Main.UsageException("build host: " + option + " takes a whole number, got \"" + value + "\"");
            }
        }
    }

    /** "3x4", "3,4" or "5" → a list of numbers. */
    private static List<Object> size(String text) {
        List<Object> l = new ArrayList<>();
        for (String part : text.split("[x×,]", -1)) {
            try {
                l.add((double) Integer.parseInt(part.trim()));
            } catch (NumberFormatException e) {
                throw new Main.UsageException("build host: SIZE is whole numbers joined by x, like 3x4 or 5; got \""
                        + text + "\"");
            }
        }
        return l;
    }

    private static Object readJson(String file) {
        String text = Main.readScenarioText(file);
        try {
            return Json.parse(text);
        } catch (ScenarioException e) {
            throw new Main.UsageException(file + ": " + e.getMessage());
        }
    }

    /** The argument (or file and path inside it) that a request path refers to. */
    static String where(String path, Map<String, String> files) {
        for (Map.Entry<String, String> f : files.entrySet()) {
            if (path.equals(f.getKey()) || path.startsWith(f.getKey() + ".") || path.startsWith(f.getKey() + "[")) {
                return f.getValue() + " at $" + path.substring(f.getKey().length());
            }
        }
        String head = path;
        int cut = path.indexOf('[');
        if (cut > 0) {
            head = path.substring(0, cut);
        }
        switch (head) {
            case "$.expression":
                return "EXPR";
            case "$.function":
                return "EXPR|TABLE";
            case "$.variables":
                return "--vars";
            case "$.order":
                return "--order";
            case "$.size":
                return "SIZE";
            case "$.family":
                return "FAMILY";
            case "$.s":
                return "--s";
            case "$.t":
                return "--t";
            case "$.seed":
                return "--seed";
            case "$.atMostMissing":
                return "--at-most-missing";
            case "$.literal":
                return "--literal-key";
            case "$.weights":
                return "--weights";
            default:
                return path;
        }
    }
}
