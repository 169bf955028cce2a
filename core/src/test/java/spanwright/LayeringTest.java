package spanwright;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * Keeps the core's layering as DEVELOPERS.md draws it. Each package has a layer; a class may use
 * (import, or name fully qualified) classes of its own package and of packages in strictly lower
 * layers, never of a package in its own layer or above. The order, lowest first:
 *
 * <pre>
 * 0  expr                         Boolean expression language
 * 1  model                        the immutable instance, its error type, the stated normalisation
 * 2  electric, domain, io         networks; input domains; file formats
 * 3  structure                    exact worst cases and decision diagrams without enumeration
 * 4  analysis                     the main job (chooses enumeration or structure)
 * 5  optimize, quantum, reduction weights; simulation; reductions to st-connectivity
 * 6  bounds                       lower bounds and classical measures
 * 7  sweep                        families, growth
 * 8  facade                       JSON-string entry points for the page and --json
 * 9  cli                          the command-line tool
 * </pre>
 *
 * Source: the project's own rule (DEVELOPERS.md, "Layout"); common practice, no source.
 */
class LayeringTest {
    static final Map<String, Integer> LAYER = Map.ofEntries(
            Map.entry("expr", 0),
            Map.entry("model", 1),
            Map.entry("electric", 2), Map.entry("domain", 2), Map.entry("io", 2),
            Map.entry("structure", 3),
            Map.entry("analysis", 4),
            Map.entry("optimize", 5), Map.entry("quantum", 5), Map.entry("reduction", 5),
            Map.entry("bounds", 6),
            Map.entry("sweep", 7),
            Map.entry("facade", 8),
            Map.entry("cli", 9));

    private static final Pattern USE = Pattern.compile("\\bspanwright\\.([a-z]+)\\.");

    @Test
    void noClassUsesAPackageOfItsOwnLayerOrAbove() throws IOException {
        Path root = Path.of("src/main/java/spanwright");
        assertTrue(Files.isDirectory(root), "run from the core module: " + root.toAbsolutePath());
        List<String> violations = new ArrayList<>();
        TreeSet<String> seen = new TreeSet<>();
        try (Stream<Path> files = Files.walk(root)) {
            for (Path f : (Iterable<Path>) files.filter(p -> p.toString().endsWith(".java"))::iterator) {
                String pkg = root.relativize(f.getParent()).toString().replace('/', '.');
                seen.add(pkg);
                Integer own = LAYER.get(pkg);
                if (own == null) {
                    fail("package spanwright." + pkg + " has no layer: add it to LayeringTest and DEVELOPERS.md");
                }
                List<String> lines = Files.readAllLines(f, StandardCharsets.UTF_8);
                for (int i = 0; i < lines.size(); i++) {
                    String line = lines.get(i).trim();
                    if (line.startsWith("*") || line.startsWith("/*") || line.startsWith("//")) {
                        continue; // documentation may name any class
                    }
                    Matcher m = USE.matcher(line);
                    while (m.find()) {
                        String target = m.group(1);
                        if (target.equals(pkg) || !LAYER.containsKey(target)) {
                            continue;
                        }
                        if (LAYER.get(target) >= own) {
                            violations.add(root.relativize(f) + ":" + (i + 1) + " (" + pkg + ", layer " + own
                                    + ") uses spanwright." + target + " (layer " + LAYER.get(target) + ")");
                        }
                    }
                }
            }
        }
        assertEquals(List.of(), violations, "imports from a lower layer to a higher one (or sideways)");
        assertTrue(seen.containsAll(List.of("expr", "model", "analysis", "facade", "cli")), "walked " + seen);
    }

    /** The checker itself catches an upward use (a test that can fail). */
    @Test
    void theCheckerSeesAnUpwardUse() {
        Matcher m = USE.matcher("import spanwright.facade.JsonFacade;");
        assertTrue(m.find());
        assertTrue(LAYER.get(m.group(1)) > LAYER.get("analysis"));
    }
}
