package spanwright.model;

/**
 * The normalisation stated beside every number Spanwright shows, and the caution shown beside
 * every bound. One place, so the command line, the JSON results, the sweeps and the page say the
 * same words.
 */
public final class Normalisation {
    /** Normalisation stated with every number. */
    public static final String CONVENTION = "weight = resistance; each edge counted once; "
            + "R = effective resistance of present edges, C = effective capacitance (1/weight) of absent edges";
    /** The caution shown with every bound. */
    public static final String CAUTION = "sqrt(W+ W-) is an asymptotic query-complexity bound for the span-program "
            + "algorithm (constants not included), not a run-time estimate for real hardware";

    private Normalisation() {}
}
