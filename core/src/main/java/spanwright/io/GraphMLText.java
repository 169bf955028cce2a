package spanwright.io;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import spanwright.model.ScenarioException;

/**
 * A GraphML reader by hand, for the page (why: {@link GraphTextReader}). It reads the XML that
 * GraphML files use: an optional XML declaration and processing instructions, comments, CDATA
 * sections, the five named entities ({@code &amp; &lt; &gt; &quot; &apos;}) and numeric
 * character references ({@code &#65;}, {@code &#x41;}), single- or double-quoted attributes.
 * Namespace prefixes are ignored ({@code <g:node>} is a node), as are namespace declarations. A
 * DOCTYPE without an internal subset is skipped; entity declarations are refused. The file must
 * be well-formed: every element closed in order, one root element {@code graphml}.
 *
 * <p>GraphML is read as JGraphT's importer reads it (checked by the differential test), so the
 * page and the command line make the same scenario of a file:
 * <ul>
 *   <li>{@code <key id for attr.name>} with {@code for} = {@code node}, {@code edge} or
 *       {@code all} declares an attribute (its {@code <default>} text applies where a node or
 *       edge has no data for it); a key without {@code for} or {@code attr.name}, or for the
 *       graph, is ignored, and so is data naming an undeclared key;</li>
 *   <li>a node's or edge's attributes are its {@code <data>} texts (all text inside, unchanged,
 *       spaces included; empty data counts as absent), keyed by the key's {@code attr.name};</li>
 *   <li>nodes and edges of nested graphs belong to the one graph; nodes and edges are taken in
 *       the order their elements end; an edge's XML {@code id} is not read (its data
 *       {@code id}, as Spanwright writes it, is the edge id);</li>
 *   <li>{@code edgedefault} must be {@code directed} or {@code undirected}; edges are read as
 *       undirected either way, as every host graph is.</li>
 * </ul>
 * Beyond JGraphT: a hyperedge is refused (JGraphT drops it silently), and so is a root element
 * other than {@code graphml}.
 *
 * <p>Single use: one instance per text. Cost: O(text length).
 */
final class GraphMLText {
    private static final GraphFile.Format FORMAT = GraphFile.Format.GRAPHML;

    private final String text;
    private final String path;
    private int pos;

    /** A declared attribute: key id, attr.name, default text or null. */
    private static final class Key {
        final String id;
        final String name;
        StringBuilder defaultValue;

        Key(String id, String name) {
            this.id = id;
            this.name = name;
        }
    }

    /** A graph, node or edge being read: its id (or source and target), data by key id, where it began. */
    private static final class Part {
        final String id;
        final String target;
        final int at;
        final Map<String, String> data = new HashMap<>();

        Part(String id, String target, int at) {
            this.id = id;
            this.target = target;
            this.at = at;
        }
    }

    /** An open element: its name as written, its local name, where its start tag began. */
    private static final class Open {
        final String name;
        final String local;
        final int at;

        Open(String name, String local, int at) {
            this.name = name;
            this.local = local;
            this.at = at;
        }
    }

    private final Deque<Open> open = new ArrayDeque<>();
    private final Deque<Part> parts = new ArrayDeque<>();
    private final Map<String, Key> nodeKeys = new LinkedHashMap<>();
    private final Map<String, Key> edgeKeys = new LinkedHashMap<>();
    private final Map<String, Part> nodes = new LinkedHashMap<>();
    private final List<Part> edges = new ArrayList<>();
    private Key key;
    private String keyFor;
    private boolean inDefault;
    private String dataKey;
    private StringBuilder dataValue;
    private boolean inData;

    private GraphMLText(String text, String path) {
        this.text = text;
        this.path = path;
    }

    static GraphFile read(String text, String path) {
        GraphMLText r = new GraphMLText(text, path);
        r.parse();
        return r.graph();
    }

    private ScenarioException error(int at, String message) {
        return GraphTextReader.error(text, at, FORMAT, path, message);
    }

    // ------------------------------------------------------------------ XML

    private void parse() {
        int n = text.length();
        pos = n > 0 && text.charAt(0) == '\uFEFF' ? 1 : 0;
        boolean rootSeen = false;
        while (pos < n) {
            char c = text.charAt(pos);
            if (c != '<') {
                int start = pos;
                int next = text.indexOf('<', pos);
                pos = next < 0 ? n : next;
                String raw = text.substring(start, pos);
                if (open.isEmpty()) {
                    if (!raw.trim().isEmpty()) {
                        throw error(start + firstNonBlank(raw), "text outside the root element; a GraphML file is"
                                + " one <graphml> element (with an optional <?xml …?> line and comments around it)");
                    }
                } else {
                    characters(decode(raw, start, false));
                }
            } else if (text.startsWith("<!--", pos)) {
                int end = text.indexOf("-->", pos + 4);
                if (end < 0) {
                    throw error(pos, "a comment begins here and never ends; close it with -->");
                }
                pos = end + 3;
            } else if (text.startsWith("<![CDATA[", pos)) {
                int end = text.indexOf("]]>", pos + 9);
                if (end < 0) {
                    throw error(pos, "a CDATA section begins here and never ends; close it with ]]>");
                }
                if (open.isEmpty()) {
                    throw error(pos, "a CDATA section outside the root element; put it inside <data>");
                }
                characters(lines(text.substring(pos + 9, end)));
                pos = end + 3;
            } else if (text.startsWith("<?", pos)) {
                int end = text.indexOf("?>", pos + 2);
                if (end < 0) {
                    throw error(pos, "a processing instruction (<?…) begins here and never ends; close it with ?>");
                }
                String target = name(pos + 2);
                if (target.equalsIgnoreCase("xml") && pos > (text.charAt(0) == '\uFEFF' ? 1 : 0)) {
                    throw error(pos, "the XML declaration <?xml …?> may only stand at the very start of the file;"
                            + " move it there or remove it");
                }
                pos = end + 2;
            } else if (text.startsWith("<!DOCTYPE", pos)) {
                doctype(rootSeen);
            } else if (text.startsWith("<!", pos)) {
                throw error(pos, "unknown markup <!…; GraphML uses elements, comments <!-- … --> and <![CDATA[ … ]]>");
            } else if (text.startsWith("</", pos)) {
                endTag();
            } else {
                if (open.isEmpty() && rootSeen) {
                    throw error(pos, "a second root element; a GraphML file has one <graphml> element holding"
                            + " everything");
                }
                boolean wasEmpty = open.isEmpty();
                startTag();
                rootSeen |= wasEmpty;
            }
        }
        if (!open.isEmpty()) {
            Open o = open.peek();
            throw error(n, "the file ends inside <" + o.name + "> (opened at " + GraphTextReader.place(text, o.at)
                    + "); close it with </" + o.name + ">, or check that the whole file was saved");
        }
        if (!rootSeen) {
            throw error(n, "no element found; a GraphML file holds <graphml><graph …> with <node> and <edge> elements");
        }
    }

    private static int firstNonBlank(String s) {
        int i = 0;
        while (i < s.length() && Character.isWhitespace(s.charAt(i))) {
            i++;
        }
        return i;
    }

    private void doctype(boolean rootSeen) {
        int start = pos;
        if (rootSeen || !open.isEmpty()) {
            throw error(start, "a DOCTYPE may only stand before the root element");
        }
        int i = pos + 9;
        char quote = 0;
        while (i < text.length()) {
            char c = text.charAt(i);
            if (quote != 0) {
                if (c == quote) {
                    quote = 0;
                }
            } else if (c == '"' || c == '\'') {
                quote = c;
            } else if (c == '[') {
                throw error(i, "a DOCTYPE with declarations ([…]) is not read here; remove the DOCTYPE (GraphML"
                        + " needs none)");
            } else if (c == '>') {
                pos = i + 1;
                return;
            }
            i++;
        }
        throw error(start, "a DOCTYPE begins here and never ends; close it with >");
    }

    /** An XML name at {@code at}, or "" when there is none. */
    private String name(int at) {
        int i = at;
        while (i < text.length()) {
            char c = text.charAt(i);
            boolean ok = (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c == '_' || c == ':' || c >= 0x80
                    || (i > at && ((c >= '0' && c <= '9') || c == '-' || c == '.'));
            if (!ok) {
                break;
            }
            i++;
        }
        return text.substring(at, i);
    }

    private static String local(String name) {
        int colon = name.lastIndexOf(':');
        return colon < 0 ? name : name.substring(colon + 1);
    }

    private void skipSpace() {
        while (pos < text.length() && isSpace(text.charAt(pos))) {
            pos++;
        }
    }

    private static boolean isSpace(char c) {
        return c == ' ' || c == '\t' || c == '\n' || c == '\r';
    }

    private void startTag() {
        int start = pos;
        String name = name(pos + 1);
        if (name.isEmpty()) {
            throw error(start, "a '<' that begins no element; write &lt; for a '<' inside text");
        }
        pos += 1 + name.length();
        Map<String, String> attributes = new LinkedHashMap<>();
        while (true) {
            int before = pos;
            skipSpace();
            if (pos >= text.length()) {
                throw error(start, "the tag <" + name + " is never closed; end it with > or />");
            }
            char c = text.charAt(pos);
            if (c == '>' || text.startsWith("/>", pos)) {
                boolean empty = c == '/';
                pos += empty ? 2 : 1;
                String local = local(name);
                open.push(new Open(name, local, start));
                startElement(local, attributes, start);
                if (empty) {
                    open.pop();
                    endElement(local);
                }
                return;
            }
            if (c == '<') {
                throw error(pos, "the tag <" + name + " (at " + GraphTextReader.place(text, start) + ") is not"
                        + " closed before this '<'; end it with > or />");
            }
            if (before == pos) {
                throw error(pos, "expected a space, > or /> after <" + name + (attributes.isEmpty() ? "" : " …")
                        + "; separate attributes by spaces");
            }
            int at = pos;
            String an = name(pos);
            if (an.isEmpty()) {
                throw error(pos, "expected an attribute name in <" + name + ">, found '" + c + "'");
            }
            pos += an.length();
            skipSpace();
            if (pos >= text.length() || text.charAt(pos) != '=') {
                throw error(pos, "the attribute " + an + " of <" + name + "> has no value; write " + an + "=\"…\"");
            }
            pos++;
            skipSpace();
            char q = pos < text.length() ? text.charAt(pos) : 0;
            if (q != '"' && q != '\'') {
                throw error(pos, "the value of " + an + " in <" + name + "> is not in quotes; write " + an + "=\"…\"");
            }
            int end = text.indexOf(q, pos + 1);
            if (end < 0) {
                throw error(pos, "the value of " + an + " in <" + name + "> opens a quote that never closes");
            }
            int lt = text.indexOf('<', pos + 1);
            if (lt >= 0 && lt < end) {
                throw error(lt, "a '<' inside the value of " + an + "; write &lt; instead");
            }
            String value = decode(text.substring(pos + 1, end), pos + 1, true);
            pos = end + 1;
            if (an.equals("xmlns") || an.startsWith("xmlns:")) {
                continue;
            }
            String la = local(an);
            if (attributes.containsKey(la)) {
                throw error(at, "<" + name + "> has the attribute " + la + " twice; keep one");
            }
            attributes.put(la, value);
        }
    }

    private void endTag() {
        int start = pos;
        String name = name(pos + 2);
        pos += 2 + name.length();
        skipSpace();
        if (name.isEmpty() || pos >= text.length() || text.charAt(pos) != '>') {
            throw error(start, "a malformed end tag; write </name>");
        }
        pos++;
        if (open.isEmpty()) {
            throw error(start, "</" + name + "> closes nothing: no element is open here");
        }
        Open o = open.peek();
        if (!o.name.equals(name)) {
            throw error(start, "</" + name + "> where </" + o.name + "> was expected (<" + o.name + "> opened at "
                    + GraphTextReader.place(text, o.at) + "); close the elements in the order they were opened");
        }
        open.pop();
        endElement(o.local);
    }

    /** Replaces the XML line ends \r\n and \r by \n, as an XML parser does in text. */
    private static String lines(String s) {
        return s.indexOf('\r') < 0 ? s : s.replace("\r\n", "\n").replace('\r', '\n');
    }

    /**
     * Text with its entity and character references replaced; {@code at} is where {@code raw}
     * starts in the file. In an attribute value, each line end and tab becomes a space (XML's
     * attribute-value normalisation).
     */
    private String decode(String raw, int at, boolean attribute) {
        StringBuilder out = new StringBuilder(raw.length());
        for (int i = 0; i < raw.length(); i++) {
            char c = raw.charAt(i);
            if (c == '\r' || c == '\n' || c == '\t') {
                if (c == '\r' && i + 1 < raw.length() && raw.charAt(i + 1) == '\n') {
                    i++;
                }
                out.append(attribute ? ' ' : c == '\t' ? '\t' : '\n');
                continue;
            }
            if (c != '&') {
                out.append(c);
                continue;
            }
            int semi = raw.indexOf(';', i);
            if (semi < 0 || semi - i > 12) {
                throw error(at + i, "a '&' that begins no entity; write &amp; for the character &");
            }
            String ref = raw.substring(i + 1, semi);
            switch (ref) {
                case "amp":
                    out.append('&');
                    break;
                case "lt":
                    out.append('<');
                    break;
                case "gt":
                    out.append('>');
                    break;
                case "quot":
                    out.append('"');
                    break;
                case "apos":
                    out.append('\'');
                    break;
                default:
                    if (ref.startsWith("#")) {
                        int cp = codePoint(ref);
                        if (cp < 0) {
                            throw error(at + i, "&" + ref + "; is not a character reference; write &#65; or"
                                    + " &#x41; (a character's number)");
                        }
                        out.appendCodePoint(cp);
                    } else {
                        throw error(at + i, "unknown entity &" + ref + "; — GraphML knows &amp; &lt; &gt; &quot;"
                                + " &apos; and numbers like &#233;; write the character itself (the file is UTF-8)");
                    }
            }
            i = semi;
        }
        return out.toString();
    }

    /** The code point of {@code #65} or {@code #x41}, or −1 when it is not a valid XML character. */
    private static int codePoint(String ref) {
        boolean hex = ref.length() > 1 && (ref.charAt(1) == 'x');
        String digits = ref.substring(hex ? 2 : 1);
        if (digits.isEmpty() || digits.length() > 8) {
            return -1;
        }
        int v = 0;
        for (int k = 0; k < digits.length(); k++) {
            int d = Character.digit(digits.charAt(k), hex ? 16 : 10);
            if (d < 0) {
                return -1;
            }
            v = v * (hex ? 16 : 10) + d;
        }
        boolean ok = v == 0x9 || v == 0xA || v == 0xD || (v >= 0x20 && v <= 0xD7FF) || (v >= 0xE000 && v <= 0xFFFD)
                || (v >= 0x10000 && v <= 0x10FFFF);
        return ok ? v : -1;
    }

    // ------------------------------------------------------------------ GraphML

    private void startElement(String local, Map<String, String> a, int at) {
        if (open.size() == 1 && !local.equals("graphml")) {
            throw error(at, "the root element is <" + open.peek().name + ">, not <graphml>: this XML file is not"
                    + " GraphML");
        }
        switch (local) {
            case "graph": {
                String d = a.get("edgedefault");
                if (d != null && !d.equals("directed") && !d.equals("undirected")) {
                    throw error(at, "edgedefault=\"" + d + "\"; GraphML allows \"directed\" or \"undirected\""
                            + " (both are read as undirected edges here)");
                }
                parts.push(new Part(a.get("id"), null, at));
                break;
            }
            case "node":
                parts.push(new Part(a.get("id"), null, at));
                break;
            case "edge":
                parts.push(new Part(a.get("source"), a.get("target"), at));
                break;
            case "hyperedge":
                throw error(at, "a hyperedge; a host graph's edges join two vertices: write it as <edge> elements");
            case "key":
                key = new Key(a.get("id"), a.get("attr.name"));
                keyFor = a.get("for");
                break;
            case "default":
                inDefault = key != null;
                break;
            case "data":
                inData = true;
                dataKey = a.get("key");
                dataValue = null;
                break;
            default:
                break;
        }
    }

    private void characters(String s) {
        if (s.isEmpty()) {
            return;
        }
        if (inDefault) {
            if (key.defaultValue == null) {
                key.defaultValue = new StringBuilder();
            }
            key.defaultValue.append(s);
        } else if (inData) {
            if (dataValue == null) {
                dataValue = new StringBuilder();
            }
            dataValue.append(s);
        }
    }

    private void endElement(String local) {
        switch (local) {
            case "graph":
                if (!parts.isEmpty()) {
                    parts.pop();
                }
                break;
            case "node": {
                Part p = parts.pop();
                if (p.id == null) {
                    throw error(p.at, "a <node> without id; give every node an id, as <node id=\"v1\">");
                }
                if (nodes.containsKey(p.id)) {
                    throw error(p.at, "a second node with id \"" + p.id + "\" (the first is at "
                            + GraphTextReader.place(text, nodes.get(p.id).at) + "); node ids must differ");
                }
                nodes.put(p.id, p);
                break;
            }
            case "edge":
                edges.add(parts.pop());
                break;
            case "key":
                if (key != null && key.id != null && key.name != null && keyFor != null) {
                    if (keyFor.equals("node") || keyFor.equals("all")) {
                        nodeKeys.put(key.id, key);
                    }
                    if (keyFor.equals("edge") || keyFor.equals("all")) {
                        edgeKeys.put(key.id, key);
                    }
                }
                key = null;
                inDefault = false;
                break;
            case "default":
                inDefault = false;
                break;
            case "data":
                if (dataKey != null && dataValue != null && !parts.isEmpty()) {
                    parts.peek().data.put(dataKey, dataValue.toString());
                }
                inData = false;
                dataKey = null;
                dataValue = null;
                break;
            default:
                break;
        }
    }

    private GraphFile graph() {
        List<String> ids = new ArrayList<>(nodes.keySet());
        Map<String, Integer> index = new HashMap<>();
        List<Map<String, String>> vertexAttributes = new ArrayList<>();
        for (String id : ids) {
            index.put(id, index.size());
            vertexAttributes.add(attributes(nodes.get(id), nodeKeys));
        }
        List<int[]> ends = new ArrayList<>();
        List<Map<String, String>> edgeAttributes = new ArrayList<>();
        for (Part e : edges) {
            Integer u = e.id == null ? null : index.get(e.id);
            Integer v = e.target == null ? null : index.get(e.target);
            for (String[] end : new String[][] {{"source", e.id}, {"target", e.target}}) {
                if (end[1] == null) {
                    throw error(e.at, "an <edge> without " + end[0] + "; write <edge source=\"u\" target=\"v\">");
                }
                if (!index.containsKey(end[1])) {
                    throw error(e.at, "the edge's " + end[0] + " \"" + end[1] + "\" is not a node of the file;"
                            + " declare it with <node id=\"" + end[1] + "\"/> or correct the id");
                }
            }
            ends.add(new int[] {u, v});
            edgeAttributes.add(attributes(e, edgeKeys));
        }
        return GraphTextReader.assemble(FORMAT, ids, vertexAttributes, ends, edgeAttributes, new LinkedHashMap<>());
    }

    /** The part's attributes by attr.name: its data for each declared key, else the key's default. */
    private static Map<String, String> attributes(Part p, Map<String, Key> keys) {
        Map<String, String> out = new LinkedHashMap<>();
        for (Key k : keys.values()) {
            String v = p.data.get(k.id);
            if (v != null) {
                out.put(k.name, v);
            } else if (k.defaultValue != null) {
                out.put(k.name, k.defaultValue.toString());
            }
        }
        return out;
    }
}
