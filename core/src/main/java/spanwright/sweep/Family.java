package spanwright.sweep;

import java.util.Map;

/**
 * A parameterised family of st-connectivity instances: for each size of its parameter (n, a
 * depth, a side length …) a scenario built by one of the builders, with what is known about its
 * symmetry. Built-in families are in {@link BuiltInFamilies}; user families are templates
 * ({@link FamilyTemplate}). Implementations are immutable and stateless.
 */
public interface Family {
    /** Identifier: the built-in family's name, or {@code "template"} for a user family. */
    String id();

    /** A title for tables, e.g. "OR_n as parallel edges". */
    String title();

    /** The size parameter's name as written in tables ({@code n}, {@code d}, {@code k}). */
    String parameterName();

    /** What the size parameter means, e.g. "number of variables" or "depth of the tree". */
    String parameterMeaning();

    /** The sizes swept when the user gives none (the {@link SizeList} syntax). */
    String defaultSizes();

    /** The smallest valid size. */
    int minimumSize();

    /**
     * The instance of size {@code size}.
     *
     * @throws spanwright.model.ScenarioException when the size is invalid or the builder refuses it
     *     (too large), with a plain message
     */
    FamilyInstance instance(int size);

    /** A JSON object that recreates this family with {@link BuiltInFamilies#fromSpec}. */
    Map<String, Object> spec();
}
