package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * docs/bounds.md cannot drift from the code: its demo table (between the {@code bounds --doc-table}
 * markers) must be exactly what the command written above it prints now. The scenario files are
 * read from the command line in the document itself, so adding a scenario there is enough.
 */
class BoundsDocTableTest {
    static final Path DOC = Path.of("..", "docs", "bounds.md");
    static final String BEGIN = "<!-- bounds --doc-table: begin -->";
    static final String END = "<!-- bounds --doc-table: end -->";

    /** The scenario files named by the documented command (a shell line continued with '\'). */
    static List<String> documentedFiles(String doc) {
        int at = doc.indexOf("bounds --doc-table ");
        assertTrue(at >= 0, "docs/bounds.md shows no 'bounds --doc-table' command");
        int end = doc.indexOf("```", at);
        String command = doc.substring(at + "bounds --doc-table ".length(), end).replace("\\\n", " ");
        List<String> files = new ArrayList<>();
        for (String w : command.trim().split("\\s+")) {
            files.add(w);
        }
        return files;
    }

    static List<String> tableLines(String text) {
        List<String> lines = new ArrayList<>();
        for (String l : text.split("\n")) {
            if (l.startsWith("|")) {
                lines.add(l.strip());
            }
        }
        return lines;
    }

    @Tag("slow")
    @Test
    void demoTableIsWhatTheCommandPrints() throws IOException {
        String doc = Files.readString(DOC, StandardCharsets.UTF_8);
        int b = doc.indexOf(BEGIN);
        int e = doc.indexOf(END);
        assertTrue(b >= 0 && e > b, "docs/bounds.md lacks the doc-table markers");
        List<String> documented = tableLines(doc.substring(b + BEGIN.length(), e));
        List<String> args = new ArrayList<>(List.of("bounds", "--doc-table"));
        List<String> files = documentedFiles(doc);
        assertTrue(files.size() >= 5, "the demo scenarios: " + files);
        for (String f : files) {
            // the command is written for the repository root; tests run in core/
            args.add(Path.of("..").resolve(f).toString());
        }
        MainTest.Run r = MainTest.run(args.toArray(new String[0]));
        assertEquals(0, r.status, r.err);
        List<String> printed = tableLines(r.out);
        for (int k = 0; k < Math.max(printed.size(), documented.size()); k++) {
            String want = k < printed.size() ? printed.get(k) : "(no row)";
            String have = k < documented.size() ? documented.get(k) : "(no row)";
            assertEquals(want, have, "docs/bounds.md's demo table differs from 'bounds --doc-table' at row " + k
                    + "; rerun the command shown there and paste its output between the markers");
        }
    }
}
