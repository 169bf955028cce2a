package spanwright.model;

/**
 * Bad input: a malformed file or link, an unknown vertex or variable, an invalid weight, a domain
 * too large to enumerate. Carries a stable machine-readable {@link #code()}, a message a person
 * understands, and the JSON path of the offending value (for example
 * {@code $.graph.edges[3].weight}); the path is {@code $} when the whole document is at fault.
 */
public final class ScenarioException extends RuntimeException {
    private static final long serialVersionUID = 1L;
    private final String code;
    private final String path;

    public ScenarioException(String code, String path, String message) {
        super(message);
        this.code = code;
        this.path = path == null ? "$" : path;
    }

    /** Stable error code, e.g. {@code unknown-vertex}, {@code weight}, {@code json-syntax}. */
    public String code() {
        return code;
    }

    /** JSON path of the value at fault. */
    public String path() {
        return path;
    }

    /** Message prefixed by the path, as printed by the command-line tool. */
    public String describe() {
        return path + ": " + getMessage();
    }
}
