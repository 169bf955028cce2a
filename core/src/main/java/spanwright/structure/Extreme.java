package spanwright.structure;

import java.math.BigInteger;

/**
 * A maximum with one maximiser and a count: the result of {@link PathsAndBonds}.
 *
 * @param value the maximum; NaN when there is nothing to maximise over (no s–t path)
 * @param edges one maximiser as an edge set (indexed like the {@link HostGraph}'s edges), or
 *     {@code null} when {@code value} is NaN; the record keeps its own copy and hands out copies
 * @param count how many objects were maximised over: distinct simple s–t paths (as edge sets) or
 *     distinct s–t bonds; 0 when there is none
 * @param method one line saying how it was computed, for a person
 */
public record Extreme(double value, boolean[] edges, BigInteger count, String method) {
    public Extreme {
        edges = edges == null ? null : edges.clone();
    }

    @Override
    public boolean[] edges() {
        return edges == null ? null : edges.clone();
    }

    /** Whether there is a maximiser (value is not NaN). */
    public boolean exists() {
        return edges != null;
    }
}
