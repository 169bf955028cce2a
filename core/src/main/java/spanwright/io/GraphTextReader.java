package spanwright.io;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.model.ScenarioException;

/**
 * GraphML and DOT files read from their text for the page: the same {@link GraphFile} that
 * {@link GraphFormats#read} makes for the command line, so one builder
 * ({@code HostGraphBuilder.imported}) turns either into a scenario.
 *
 * <p><b>Why this exists.</b> The command line reads graph files with JGraphT's jgrapht-io, a
 * well-kept library, and keeps doing so. The page cannot: jgrapht-io parses GraphML with the
 * JDK's SAX parser ({@code javax.xml}) and DOT with an ANTLR-generated parser, neither of which
 * TeaVM's class library provides. These two readers are written by hand with plain string
 * scanning (no reflection, no regular expressions, no {@code javax.xml}) so that TeaVM compiles
 * them; a differential test (GraphTextReaderTest) checks them against jgrapht-io on the import
 * fixtures and on exported scenarios.
 *
 * <p>What they read, and where they deliberately follow jgrapht-io so that the page and the
 * command line make the same scenario from the same file, is on {@link GraphMLText} and
 * {@link DotText}. GML and CSV edge lists stay with the command line.
 *
 * <p>Errors are {@link ScenarioException}s with code {@code graph-file}, the given path, and a
 * message naming the line and column, what is wrong there and what to write instead.
 * Cost: O(file size). Stateless.
 */
public final class GraphTextReader {
    private GraphTextReader() {}

    /**
     * Reads {@code text} as {@code format} (GraphML or DOT).
     *
     * @param path the JSON path named in errors (where the text sits in a request)
     * @throws ScenarioException {@code graph-file} when the text is not a graph of that format,
     *     {@code format} for GML and CSV
     */
    public static GraphFile read(String text, GraphFile.Format format, String path) {
        switch (format) {
            case GRAPHML:
                return GraphMLText.read(text, path);
            case DOT:
                return DotText.read(text, path);
            default:
                throw new ScenarioException("format", path, format.title() + " files are read by the command line"
                        + " (build host import FILE); here, open GraphML (.graphml, .xml) or DOT (.dot, .gv)");
        }
    }

    /**
     * The format of a file: named by {@code formatName} ({@code graphml}, {@code dot}) when given,
     * else by the ending of {@code fileName} when it has a known one, else guessed from the text
     * (XML markup first means GraphML; {@code graph}, {@code digraph} or {@code strict} first,
     * after comments, means DOT).
     *
     * @throws ScenarioException {@code format} ({@code $.format}, or {@code path} when nothing tells)
     */
    public static GraphFile.Format formatOf(String formatName, String fileName, String text, String path) {
        if (formatName != null) {
            GraphFile.Format f = GraphFile.Format.named(formatName);
            if (f == null) {
                throw new ScenarioException("format", "$.format", "unknown graph format \"" + formatName
                        + "\"; name graphml or dot, or leave the format out to tell it from the file");
            }
            return f;
        }
        if (fileName != null) {
            GraphFile.Format f = GraphFile.Format.ofFileName(fileName);
            if (f != null) {
                return f;
            }
        }
        GraphFile.Format f = sniff(text);
        if (f == null) {
            throw new ScenarioException("format", path, "cannot tell the format of " + (fileName == null ? "the text"
                    : "\"" + fileName + "\"") + ": it begins neither with XML markup (GraphML) nor with graph or"
                    + " digraph (DOT); name the format, or give the file the ending .graphml or .dot");
        }
        return f;
    }

    /** GraphML when the text's first mark is {@code <}, DOT when its first word is a DOT graph keyword, else null. */
    static GraphFile.Format sniff(String text) {
        int i = 0;
        int n = text.length();
        while (i < n) {
            char c = text.charAt(i);
            if (c == '\uFEFF' || c == ' ' || c == '\t' || c == '\r' || c == '\n') {
                i++;
            } else if (text.startsWith("//", i) || c == '#') {
                while (i < n && text.charAt(i) != '\n') {
                    i++;
                }
            } else if (text.startsWith("/*", i)) {
                int end = text.indexOf("*/", i + 2);
                i = end < 0 ? n : end + 2;
            } else {
                break;
            }
        }
        if (i >= n) {
            return null;
        }
        if (text.charAt(i) == '<') {
            return GraphFile.Format.GRAPHML;
        }
        int j = i;
        while (j < n && Character.isLetter(text.charAt(j))) {
            j++;
        }
        String word = text.substring(i, j).toLowerCase(java.util.Locale.ROOT);
        return word.equals("graph") || word.equals("digraph") || word.equals("strict") ? GraphFile.Format.DOT : null;
    }

    /**
     * The {@link GraphFile} of what a reader found, shaped as {@link GraphFormats#read} shapes
     * jgrapht-io's output: the vertex attribute {@code ID} is dropped; an edge's id is its
     * attribute {@code ID}, else its attribute {@code id} (either is taken out of its attributes);
     * positions are GraphML's {@code x} and {@code y} (both or none) or DOT's {@code pos}.
     *
     * @param ends per edge, the two vertex indices
     */
    static GraphFile assemble(GraphFile.Format format, List<String> ids, List<Map<String, String>> vertexAttributes,
            List<int[]> ends, List<Map<String, String>> edgeAttributes, Map<String, String> graphAttributes) {
        int n = ids.size();
        double[] x = new double[n];
        double[] y = new double[n];
        List<Map<String, String>> attrs = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            Map<String, String> a = new LinkedHashMap<>(vertexAttributes.get(i));
            a.remove("ID");
            attrs.add(a);
            double[] p = GraphFile.position(format, a);
            x[i] = p[0];
            y[i] = p[1];
        }
        List<GraphFile.Link> links = new ArrayList<>();
        for (int i = 0; i < ends.size(); i++) {
            Map<String, String> a = new LinkedHashMap<>(edgeAttributes.get(i));
            String id = a.remove("ID");
            if (id == null) {
                id = a.remove("id");
            }
            links.add(new GraphFile.Link(ends.get(i)[0], ends.get(i)[1], id, a));
        }
        return new GraphFile(format, ids, x, y, attrs, links, graphAttributes);
    }

    /**
     * The bad-file error: "this is not a graph in FORMAT: line L, column C: MESSAGE". Lines and
     * columns count from 1; a line ends at \n, \r\n or \r; a column counts UTF-16 characters.
     */
    static ScenarioException error(String text, int offset, GraphFile.Format format, String path, String message) {
        return new ScenarioException("graph-file", path, "this is not a graph in " + format.title() + ": "
                + place(text, offset) + ": " + message);
    }

    /** "line L, column C" of {@code offset} in {@code text} (the end of the text when beyond it). */
    static String place(String text, int offset) {
        int line = 1;
        int lineStart = 0;
        int end = Math.min(offset, text.length());
        for (int i = 0; i < end; i++) {
            char c = text.charAt(i);
            if (c == '\n' || (c == '\r' && (i + 1 >= text.length() || text.charAt(i + 1) != '\n'))) {
                line++;
                lineStart = i + 1;
            }
        }
        return "line " + line + ", column " + (end - lineStart + 1);
    }
}
