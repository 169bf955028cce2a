package spanwright.web.build;

import spanwright.io.Json;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.Base64;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * Build step (run by exec-maven-plugin in the {@code package} phase): assembles the page.
 *
 * <ol>
 *   <li>{@code target/spanwright/}: the webapp sources, Cytoscape.js, the TeaVM engines wrapped
 *       as plain scripts (the JavaScript engine's source text, the WebAssembly-GC runtime and the
 *       module bytes in base64), and the gallery of scenarios — every file loadable from file://
 *       with classic {@code <script src>} tags, no fetch, no ES modules.</li>
 *   <li>{@code target/spanwright.html}: the same page with every script and style sheet inlined,
 *       one file that can be e-mailed.</li>
 * </ol>
 * The engine sources are kept as strings because the page builds its Web Worker from a Blob URL
 * (the only way a worker starts from file://) and must hand the worker the engine's code.
 */
public final class PageAssembler {
    private static final Pattern SCRIPT = Pattern.compile("<script src=\"([^\"]+)\"></script>");
    private static final Pattern STYLE = Pattern.compile("<link rel=\"stylesheet\" href=\"([^\"]+)\">");

    private PageAssembler() {}

    public static void main(String[] args) throws IOException {
        if (args.length != 8) {
            throw new IllegalArgumentException("usage: PageAssembler WEBAPP ENGINE_JS ENGINE_WASM WASM_RUNTIME"
                    + " CYTOSCAPE SCENARIOS OUT_DIR OUT_SINGLE");
        }
        Path webapp = Paths.get(args[0]);
        Path engineJs = Paths.get(args[1]);
        Path engineWasm = Paths.get(args[2]);
        Path wasmRuntime = Paths.get(args[3]);
        Path cytoscape = Paths.get(args[4]);
        Path scenarios = Paths.get(args[5]);
        Path outDir = Paths.get(args[6]);
        Path single = Paths.get(args[7]);

        copyTree(webapp, outDir);
        write(outDir.resolve("lib/cytoscape.min.js"), read(cytoscape));

        String js = read(engineJs);
        String runtime = read(wasmRuntime);
        byte[] wasm = Files.readAllBytes(engineWasm);
        if (js.isEmpty() || wasm.length == 0) {
            throw new IllegalStateException("TeaVM produced an empty engine: " + engineJs + ", " + engineWasm);
        }
        String sources = "(self.SpanwrightSources = self.SpanwrightSources || {})";
        write(outDir.resolve("engine/engine-js.js"),
                sources + ".js = " + jsString(js) + ";\n");
        write(outDir.resolve("engine/engine-wasm.js"),
                sources + ".wasmRuntime = " + jsString(runtime) + ";\n"
                        + "self.SpanwrightSources.wasmBase64 = \"" + Base64.getEncoder().encodeToString(wasm) + "\";\n");
        write(outDir.resolve("engine/gallery.js"), gallery(scenarios));

        String index = read(outDir.resolve("index.html"));
        write(single, inline(index, outDir));
        System.out.println("[spanwright] page: " + outDir.resolve("index.html").toAbsolutePath());
        System.out.println("[spanwright] single file: " + single.toAbsolutePath()
                + " (" + Files.size(single) / 1024 + " KiB)");
    }

    /** The gallery: every {@code *.json} of the scenarios folder, as text, sorted by file name. */
    private static String gallery(Path scenarios) throws IOException {
        List<Path> files = new ArrayList<>();
        if (Files.isDirectory(scenarios)) {
            try (Stream<Path> s = Files.list(scenarios)) {
                s.filter(p -> p.getFileName().toString().endsWith(".json")).sorted().forEach(files::add);
            }
        }
        StringBuilder sb = new StringBuilder("self.SpanwrightGallery = [\n");
        for (Path p : files) {
            sb.append("  {\"file\": ").append(jsString(p.getFileName().toString()))
                    .append(", \"text\": ").append(jsString(read(p))).append("},\n");
        }
        return sb.append("];\n").toString();
    }

    private static String inline(String html, Path base) throws IOException {
        StringBuilder out = new StringBuilder();
        Matcher m = SCRIPT.matcher(html);
        int last = 0;
        while (m.find()) {
            out.append(html, last, m.start());
            String code = read(base.resolve(m.group(1)));
            out.append("<script>").append(safeInScript(code)).append("</script>");
            last = m.end();
        }
        out.append(html.substring(last));
        String withScripts = out.toString();
        out.setLength(0);
        m = STYLE.matcher(withScripts);
        last = 0;
        while (m.find()) {
            out.append(withScripts, last, m.start());
            out.append("<style>").append(read(base.resolve(m.group(1))).replace("</style", "<\\/style")).append("</style>");
            last = m.end();
        }
        out.append(withScripts.substring(last));
        return out.toString();
    }

    /**
     * Makes script text safe inside an inline {@code <script>} element. {@code </script} and
     * {@code <!--} can only occur inside string or regular-expression literals of the scripts we
     * inline, where {@code <\/} and {@code <\!} mean the same characters.
     */
    private static String safeInScript(String code) {
        return code.replace("</script", "<\\/script").replace("<!--", "<\\!--");
    }

    /**
     * A JavaScript string literal for any text (a JSON string is one), also safe inside an inline
     * script element: core's JSON quoting, with '<' and '>' escaped as well.
     */
    static String jsString(String s) {
        StringBuilder sb = new StringBuilder(s.length() + 16);
        spanwright.io.Json.quote(sb, s);
        return sb.toString().replace("<", "\\u003c").replace(">", "\\u003e");
    }

    private static void copyTree(Path from, Path to) throws IOException {
        try (Stream<Path> s = Files.walk(from)) {
            for (Path p : (Iterable<Path>) s::iterator) {
                Path target = to.resolve(from.relativize(p).toString());
                if (Files.isDirectory(p)) {
                    Files.createDirectories(target);
                } else {
                    Files.createDirectories(target.getParent());
                    Files.copy(p, target, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
                }
            }
        }
    }

    private static String read(Path p) throws IOException {
        return new String(Files.readAllBytes(p), StandardCharsets.UTF_8);
    }

    private static void write(Path p, String text) throws IOException {
        Files.createDirectories(p.toAbsolutePath().getParent());
        Files.write(p, text.getBytes(StandardCharsets.UTF_8));
    }
}
