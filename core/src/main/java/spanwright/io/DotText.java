package spanwright.io;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import spanwright.model.ScenarioException;

/**
 * A reader by hand of Graphviz's DOT language, for the page (why: {@link GraphTextReader}). The
 * grammar is Graphviz's (graphviz.org, "The DOT Language"): {@code [strict] graph|digraph [ID]
 * { … }} with node statements, edge statements and chains ({@code a -- b -- c}), attribute
 * statements ({@code node [shape=box]}), graph attributes ({@code rankdir=LR}) and subgraphs
 * ({@code subgraph name { … }} or {@code { … }}, also as an end of an edge, which joins every
 * vertex named in it); attribute lists {@code [k=v, k="v"; k=v]}; ids as names, numerals or
 * double-quoted strings (joined by {@code +}); ports ({@code a:p:ne}) are dropped; comments
 * {@code //}, {@code /* … *}{@code /} and lines beginning with {@code #}. Keywords are
 * case-insensitive. HTML-like values ({@code <…>}) are refused.
 *
 * <p>Read as JGraphT's DOT importer reads it (checked by the differential test), so the page and
 * the command line make the same scenario of a file: vertices in the order they are first named;
 * a new vertex takes the {@code node [...]} defaults in force where it is first named, a later
 * node statement adds or replaces attributes; an edge takes the {@code edge [...]} defaults in
 * force plus its own list; a subgraph starts with its parent's defaults and its changes stay in
 * it; only top-level {@code k=v} statements and the graph's id (as {@code ID}) are graph
 * attributes. In a quoted id only {@code \"} is an escape (other backslashes stay, for
 * Graphviz's label escapes); a backslash before a line end joins the lines. {@code strict} is
 * accepted but repeated edges are kept, {@code --} and {@code ->} are both read as undirected
 * edges, as in the command line's reader. Beyond JGraphT: {@code +} joins quoted strings, and
 * a subgraph as an edge end stands for every vertex named in it.
 *
 * <p>Single use: one instance per text. Cost: O(text length); subgraphs nest at most
 * {@link #MAX_DEPTH} deep.
 */
final class DotText {
    private static final GraphFile.Format FORMAT = GraphFile.Format.DOT;
    /** Deepest subgraph nesting read (bounds the parser's recursion). */
    static final int MAX_DEPTH = 100;

    private enum Kind { ID, LBRACE, RBRACE, LBRACKET, RBRACKET, EQUALS, SEMI, COMMA, COLON, EDGEOP, EOF }

    /** One token: kind, text (an id's value, unquoted), where it starts, whether it was quoted. */
    private static final class Token {
        final Kind kind;
        final String text;
        final int at;
        final boolean quoted;

        Token(Kind kind, String text, int at, boolean quoted) {
            this.kind = kind;
            this.text = text;
            this.at = at;
            this.quoted = quoted;
        }

        /** The unquoted keyword this token is (lower case), or null. */
        String keyword() {
            if (kind != Kind.ID || quoted) {
                return null;
            }
            String k = text.toLowerCase(Locale.ROOT);
            switch (k) {
                case "graph":
                case "digraph":
                case "node":
                case "edge":
                case "subgraph":
                case "strict":
                    return k;
                default:
                    return null;
            }
        }

        String show() {
            switch (kind) {
                case EOF:
                    return "the end of the file";
                case ID:
                    return quoted ? "\"" + text + "\"" : "'" + text + "'";
                default:
                    return "'" + text + "'";
            }
        }
    }

    /** Defaults in force and vertices named, per graph or subgraph. */
    private static final class Scope {
        final Map<String, String> nodeDefaults;
        final Map<String, String> edgeDefaults;
        final Set<String> named = new LinkedHashSet<>();

        Scope(Scope parent) {
            nodeDefaults = parent == null ? new LinkedHashMap<>() : new LinkedHashMap<>(parent.nodeDefaults);
            edgeDefaults = parent == null ? new LinkedHashMap<>() : new LinkedHashMap<>(parent.edgeDefaults);
        }
    }

    private final String text;
    private final String path;
    private int pos;
    private Token peeked;
    private final List<String> ids = new ArrayList<>();
    private final Map<String, Integer> index = new HashMap<>();
    private final List<Map<String, String>> vertexAttributes = new ArrayList<>();
    private final List<int[]> ends = new ArrayList<>();
    private final List<Map<String, String>> edgeAttributes = new ArrayList<>();
    private final Map<String, String> graphAttributes = new LinkedHashMap<>();

    private DotText(String text, String path) {
        this.text = text;
        this.path = path;
    }

    static GraphFile read(String text, String path) {
        DotText r = new DotText(text, path);
        r.graph();
        return GraphTextReader.assemble(FORMAT, r.ids, r.vertexAttributes, r.ends, r.edgeAttributes, r.graphAttributes);
    }

    private ScenarioException error(int at, String message) {
        return GraphTextReader.error(text, at, FORMAT, path, message);
    }

    // ------------------------------------------------------------------ tokens

    private Token peek() {
        if (peeked == null) {
            peeked = lex();
        }
        return peeked;
    }

    private Token next() {
        Token t = peek();
        peeked = null;
        return t;
    }

    private void skipSpaceAndComments() {
        int n = text.length();
        while (pos < n) {
            char c = text.charAt(pos);
            if (c == ' ' || c == '\t' || c == '\r' || c == '\n' || c == '\f' || c == '\uFEFF') {
                pos++;
            } else if (text.startsWith("//", pos) || (c == '#' && atLineStart(pos))) {
                while (pos < n && text.charAt(pos) != '\n' && text.charAt(pos) != '\r') {
                    pos++;
                }
            } else if (text.startsWith("/*", pos)) {
                int end = text.indexOf("*/", pos + 2);
                if (end < 0) {
                    throw error(pos, "a comment /* begins here and never ends; close it with */");
                }
                pos = end + 2;
            } else {
                return;
            }
        }
    }

    /** Whether only spaces stand before {@code at} on its line (Graphviz drops such '#' lines). */
    private boolean atLineStart(int at) {
        for (int i = at - 1; i >= 0; i--) {
            char c = text.charAt(i);
            if (c == '\n' || c == '\r') {
                return true;
            }
            if (c != ' ' && c != '\t') {
                return false;
            }
        }
        return true;
    }

    private Token lex() {
        skipSpaceAndComments();
        int n = text.length();
        if (pos >= n) {
            return new Token(Kind.EOF, "", n, false);
        }
        int at = pos;
        char c = text.charAt(pos);
        switch (c) {
            case '{':
                pos++;
                return new Token(Kind.LBRACE, "{", at, false);
            case '}':
                pos++;
                return new Token(Kind.RBRACE, "}", at, false);
            case '[':
                pos++;
                return new Token(Kind.LBRACKET, "[", at, false);
            case ']':
                pos++;
                return new Token(Kind.RBRACKET, "]", at, false);
            case '=':
                pos++;
                return new Token(Kind.EQUALS, "=", at, false);
            case ';':
                pos++;
                return new Token(Kind.SEMI, ";", at, false);
            case ',':
                pos++;
                return new Token(Kind.COMMA, ",", at, false);
            case ':':
                pos++;
                return new Token(Kind.COLON, ":", at, false);
            case '"':
                return quoted();
            case '<':
                throw error(at, "an HTML-like value <…> is not read here; write the value in double quotes"
                        + " (\"…\")");
            default:
                break;
        }
        if (c == '-' && pos + 1 < n && (text.charAt(pos + 1) == '-' || text.charAt(pos + 1) == '>')) {
            pos += 2;
            return new Token(Kind.EDGEOP, text.substring(at, pos), at, false);
        }
        if (c == '-' || c == '.' || (c >= '0' && c <= '9')) {
            return numeral();
        }
        if (nameStart(c)) {
            while (pos < n && (nameStart(text.charAt(pos)) || isDigit(text.charAt(pos)))) {
                pos++;
            }
            return new Token(Kind.ID, text.substring(at, pos), at, false);
        }
        throw error(at, "unexpected character '" + c + "'; an id is a name (letters, digits, _), a number or"
                + " a text in double quotes");
    }

    private static boolean isDigit(char c) {
        return c >= '0' && c <= '9';
    }

    private static boolean nameStart(char c) {
        return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c == '_' || c >= 0x80;
    }

    /** A numeral: {@code -?(.[0-9]+ | [0-9]+(.[0-9]*)?)}. */
    private Token numeral() {
        int at = pos;
        int n = text.length();
        if (text.charAt(pos) == '-') {
            pos++;
        }
        int digits = 0;
        while (pos < n && isDigit(text.charAt(pos))) {
            pos++;
            digits++;
        }
        if (pos < n && text.charAt(pos) == '.') {
            pos++;
            while (pos < n && isDigit(text.charAt(pos))) {
                pos++;
                digits++;
            }
        }
        if (digits == 0) {
            throw error(at, "'" + text.substring(at, pos) + "' is neither a number nor an edge (-- or ->)");
        }
        if (pos < n && (nameStart(text.charAt(pos)) || text.charAt(pos) == '.')) {
            throw error(at, "an id that starts with a digit or '-' but goes on with other characters; put it in"
                    + " double quotes, as \"" + word(at) + "\"");
        }
        return new Token(Kind.ID, text.substring(at, pos), at, false);
    }

    private String word(int at) {
        int i = at;
        while (i < text.length() && (nameStart(text.charAt(i)) || isDigit(text.charAt(i)) || text.charAt(i) == '.'
                || text.charAt(i) == '-')) {
            i++;
        }
        return text.substring(at, i);
    }

    /** A double-quoted string, and any {@code + "…"} that follows it. */
    private Token quoted() {
        int at = pos;
        StringBuilder sb = new StringBuilder();
        while (true) {
            int open = pos;
            pos++;
            int n = text.length();
            boolean closed = false;
            while (pos < n) {
                char c = text.charAt(pos);
                if (c == '"') {
                    pos++;
                    closed = true;
                    break;
                }
                if (c == '\\' && pos + 1 < n) {
                    char d = text.charAt(pos + 1);
                    if (d == '"') {
                        sb.append('"');
                        pos += 2;
                        continue;
                    }
                    if (d == '\n' || d == '\r') {
                        pos += d == '\r' && pos + 2 < n && text.charAt(pos + 2) == '\n' ? 3 : 2;
                        continue;
                    }
                }
                sb.append(c);
                pos++;
            }
            if (!closed) {
                throw error(open, "a quoted text begins here and never ends; close it with \" (write \\\" for a"
                        + " quote inside it)");
            }
            int save = pos;
            skipSpaceAndComments();
            if (pos < n && text.charAt(pos) == '+') {
                pos++;
                skipSpaceAndComments();
                if (pos >= n || text.charAt(pos) != '"') {
                    throw error(pos, "'+' joins two quoted texts; a quoted text must follow it");
                }
                continue;
            }
            pos = save;
            return new Token(Kind.ID, sb.toString(), at, true);
        }
    }

    private Token expect(Kind kind, String what) {
        Token t = next();
        if (t.kind != kind) {
            throw error(t.at, "expected " + what + ", found " + t.show());
        }
        return t;
    }

    // ------------------------------------------------------------------ grammar

    private void graph() {
        Token t = next();
        if ("strict".equals(t.keyword())) {
            t = next();
        }
        String k = t.keyword();
        if (!"graph".equals(k) && !"digraph".equals(k)) {
            throw error(t.at, "a DOT file begins with graph or digraph (optionally strict first), found " + t.show()
                    + "; if this is GraphML, open it as a .graphml file");
        }
        t = next();
        if (t.kind == Kind.ID) {
            if (t.keyword() != null) {
                throw error(t.at, "the keyword " + t.text + " cannot name the graph; put the name in double quotes");
            }
            graphAttributes.put("ID", t.text);
            t = next();
        }
        if (t.kind != Kind.LBRACE) {
            throw error(t.at, "expected '{' to open the graph's body, found " + t.show());
        }
        Scope root = new Scope(null);
        statements(root, 0);
        expect(Kind.RBRACE, "'}' to close the graph");
        Token after = next();
        if (after.kind != Kind.EOF) {
            throw error(after.at, "more after the graph's closing '}' (found " + after.show() + "); this reader takes"
                    + " one graph per file: keep only the one to import");
        }
    }

    /** Statements up to (not including) the closing brace. */
    private void statements(Scope scope, int depth) {
        while (true) {
            Token t = peek();
            if (t.kind == Kind.RBRACE) {
                return;
            }
            if (t.kind == Kind.EOF) {
                throw error(t.at, "the file ends before the graph is closed; add the missing '}'");
            }
            if (t.kind == Kind.SEMI) {
                next();
                continue;
            }
            statement(scope, depth);
            if (peek().kind == Kind.SEMI) {
                next();
            }
        }
    }

    private void statement(Scope scope, int depth) {
        Token t = next();
        String k = t.keyword();
        if ("graph".equals(k) || "node".equals(k) || "edge".equals(k)) {
            if (peek().kind != Kind.LBRACKET) {
                throw error(t.at, "'" + t.text + "' is a keyword: " + t.text + " [k=v] sets defaults; to name a vertex "
                        + t.text + ", put it in double quotes");
            }
            Map<String, String> a = attributeLists();
            if ("node".equals(k)) {
                scope.nodeDefaults.putAll(a);
            } else if ("edge".equals(k)) {
                scope.edgeDefaults.putAll(a);
            }
            return;
        }
        if ("digraph".equals(k) || "strict".equals(k)) {
            throw error(t.at, "'" + t.text + "' may only begin the file; put it in double quotes to use it as an id");
        }
        List<String> operand;
        if ("subgraph".equals(k) || t.kind == Kind.LBRACE) {
            operand = subgraph(t, scope, depth);
        } else if (t.kind == Kind.ID) {
            if (peek().kind == Kind.EQUALS) {
                next();
                Token v = expect(Kind.ID, "a value after '" + t.text + " ='");
                if (depth == 0) {
                    graphAttributes.put(t.text, v.text);
                }
                return;
            }
            String id = nodeId(t);
            if (peek().kind != Kind.EDGEOP) {
                Map<String, String> a = peek().kind == Kind.LBRACKET ? attributeLists() : new LinkedHashMap<>();
                Integer i = index.get(id);
                if (i == null) {
                    Map<String, String> all = new LinkedHashMap<>(scope.nodeDefaults);
                    all.putAll(a);
                    vertex(id, all, scope);
                } else {
                    vertexAttributes.get(i).putAll(a);
                    scope.named.add(id);
                }
                return;
            }
            operand = List.of(mention(id, scope));
        } else {
            throw error(t.at, "expected a statement (a vertex, an edge, an attribute or a subgraph), found "
                    + t.show());
        }
        if (peek().kind != Kind.EDGEOP) {
            return; // a subgraph statement
        }
        List<List<String>> chain = new ArrayList<>();
        chain.add(operand);
        while (peek().kind == Kind.EDGEOP) {
            Token op = next();
            Token u = next();
            if ("subgraph".equals(u.keyword()) || u.kind == Kind.LBRACE) {
                chain.add(subgraph(u, scope, depth));
            } else if (u.kind == Kind.ID && u.keyword() == null) {
                chain.add(List.of(mention(nodeId(u), scope)));
            } else {
                throw error(u.at, "expected a vertex id or a subgraph after '" + op.text + "', found " + u.show()
                        + "; an edge joins two vertices, as a " + op.text + " b");
            }
        }
        Map<String, String> own = peek().kind == Kind.LBRACKET ? attributeLists() : new LinkedHashMap<>();
        for (int i = 1; i < chain.size(); i++) {
            for (String from : chain.get(i - 1)) {
                for (String to : chain.get(i)) {
                    Map<String, String> a = new LinkedHashMap<>(scope.edgeDefaults);
                    a.putAll(own);
                    ends.add(new int[] {index.get(from), index.get(to)});
                    edgeAttributes.add(a);
                }
            }
        }
    }

    /** A node id (a non-keyword id) and its optional port, which is dropped. */
    private String nodeId(Token t) {
        if (t.keyword() != null) {
            throw error(t.at, "'" + t.text + "' is a DOT keyword; to use it as a vertex id, put it in double quotes");
        }
        if (peek().kind == Kind.COLON) {
            next();
            expect(Kind.ID, "a port name after ':'");
            if (peek().kind == Kind.COLON) {
                next();
                expect(Kind.ID, "a compass point after ':'");
            }
        }
        return t.text;
    }

    /** Names a vertex in an edge: created with the node defaults when new. */
    private String mention(String id, Scope scope) {
        if (!index.containsKey(id)) {
            vertex(id, new LinkedHashMap<>(scope.nodeDefaults), scope);
        } else {
            scope.named.add(id);
        }
        return id;
    }

    private void vertex(String id, Map<String, String> attributes, Scope scope) {
        index.put(id, ids.size());
        ids.add(id);
        vertexAttributes.add(attributes);
        scope.named.add(id);
    }

    /** A subgraph whose first token {@code t} (subgraph or '{') is read; returns the vertices named in it. */
    private List<String> subgraph(Token t, Scope parent, int depth) {
        if (depth + 1 > MAX_DEPTH) {
            throw error(t.at, "subgraphs nested more than " + MAX_DEPTH + " deep; flatten them");
        }
        Token open = t;
        if ("subgraph".equals(t.keyword())) {
            Token n = next();
            if (n.kind == Kind.ID && n.keyword() == null) {
                n = next();
            }
            open = n;
            if (open.kind != Kind.LBRACE) {
                throw error(open.at, "expected '{' to open the subgraph, found " + open.show());
            }
        }
        Scope scope = new Scope(parent);
        statements(scope, depth + 1);
        expect(Kind.RBRACE, "'}' to close the subgraph opened at " + GraphTextReader.place(text, open.at));
        parent.named.addAll(scope.named);
        return new ArrayList<>(scope.named);
    }

    /** One or more {@code [k=v, …]} lists, merged. */
    private Map<String, String> attributeLists() {
        Map<String, String> out = new LinkedHashMap<>();
        while (peek().kind == Kind.LBRACKET) {
            Token open = next();
            while (true) {
                Token k = next();
                if (k.kind == Kind.RBRACKET) {
                    break;
                }
                if (k.kind == Kind.COMMA || k.kind == Kind.SEMI) {
                    continue;
                }
                if (k.kind != Kind.ID) {
                    throw error(k.at, k.kind == Kind.EOF ? "the attribute list opened at "
                            + GraphTextReader.place(text, open.at) + " is never closed; add ']'"
                            : "expected an attribute name or the ']' that closes the list opened at "
                            + GraphTextReader.place(text, open.at) + ", found " + k.show());
                }
                Token eq = next();
                if (eq.kind != Kind.EQUALS) {
                    throw error(eq.at, "the attribute " + k.text + " has no value; write " + k.text + "=value"
                            + " (or " + k.text + "=\"text\")");
                }
                Token v = next();
                if (v.kind != Kind.ID) {
                    throw error(v.at, "expected a value after '" + k.text + "=', found " + v.show()
                            + "; write " + k.text + "=\"…\"");
                }
                out.put(k.text, v.text);
            }
        }
        return out;
    }
}
