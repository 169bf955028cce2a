package spanwright.io;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import spanwright.model.Edge;
import spanwright.model.Scenario;
import spanwright.model.Vertex;

/** Test helper: a scenario written by {@link ScenarioWriter} and read back is field-for-field equal. */
public final class RoundTrip {
    private RoundTrip() {}

    /** Writes, reads back, asserts equality of every written field; returns the read copy. */
    public static Scenario check(Scenario sc) {
        String text = ScenarioWriter.write(sc);
        Scenario back = ScenarioReader.read(text);
        assertSame(sc, back);
        // writing the copy gives the same text (a fixed point)
        assertEquals(text, ScenarioWriter.write(back));
        return back;
    }

    /** Every field the format carries is equal (numbers bit for bit, NaN = NaN). */
    public static void assertSame(Scenario a, Scenario b) {
        assertEquals(a.title(), b.title(), "title");
        assertEquals(a.notes(), b.notes(), "notes");
        assertEquals(a.variables(), b.variables(), "variables");
        assertEquals(a.functionText(), b.functionText(), "function");
        assertEquals(a.promise().kind(), b.promise().kind(), "promise kind");
        assertEquals(a.promise().text(), b.promise().text(), "promise text");
        assertArrayEquals(a.promise().weights(), b.promise().weights(), "promise weights");
        assertArrayEquals(a.promise().inputs(), b.promise().inputs(), "promise inputs");
        assertEquals(a.s(), b.s(), "s");
        assertEquals(a.t(), b.t(), "t");
        assertEquals(a.vertexCount(), b.vertexCount(), "vertex count");
        for (int i = 0; i < a.vertexCount(); i++) {
            Vertex u = a.vertices().get(i);
            Vertex v = b.vertices().get(i);
            assertEquals(u.id(), v.id(), "vertex id");
            assertEquals(Double.doubleToLongBits(u.x() + 0.0), Double.doubleToLongBits(v.x() + 0.0), "x of " + u.id());
            assertEquals(Double.doubleToLongBits(u.y() + 0.0), Double.doubleToLongBits(v.y() + 0.0), "y of " + u.id());
        }
        assertEquals(a.edges().size(), b.edges().size(), "edge count");
        for (int i = 0; i < a.edges().size(); i++) {
            Edge e = a.edges().get(i);
            Edge f = b.edges().get(i);
            assertEquals(e.id(), f.id(), "edge id");
            assertEquals(e.u(), f.u(), "u of " + e.id());
            assertEquals(e.v(), f.v(), "v of " + e.id());
            assertEquals(e.when().toString(), f.when().toString(), "when of " + e.id());
            assertEquals(e.when().variable(), f.when().variable(), "variable of " + e.id());
            assertEquals(Double.doubleToLongBits(e.weight()), Double.doubleToLongBits(f.weight()), "weight of " + e.id());
            assertEquals(e.group(), f.group(), "group of " + e.id());
            assertEquals(e.locked(), f.locked(), "locked of " + e.id());
        }
    }
}
