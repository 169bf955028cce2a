package spanwright.analysis;

import java.util.List;
import spanwright.electric.ElectricalNetwork;
import spanwright.electric.Witness;
import spanwright.model.Edge;
import spanwright.model.Scenario;
import spanwright.model.ScenarioException;

/**
 * The main job, one entry for the command-line tool and the page alike: enumerate the scenario's
 * domain, check the reduction against the target function, compute every input's witness size
 * (effective resistance on positive inputs, effective capacitance on negative inputs; weight =
 * resistance, each edge counted once), and the bound √(W₊W₋) on the span-program algorithm's query
 * complexity (Belovs &amp; Reichardt, ESA 2012, arXiv:1203.2603; Jarret, Jeffery, Kimmel &amp;
 * Piedrafita, ESA 2018, arXiv:1804.10591). Asymptotic query complexity, not a run-time estimate.
 */
public final class Analysis {
    private Analysis() {}

    /** How to analyse: choose automatically, enumerate the domain, or compute by structure. */
    public enum Method {
        AUTO("auto"), ENUMERATE("enumerate"), STRUCTURE("structure");

        /** The name on the command line and in JSON. */
        public final String word;

        Method(String word) {
            this.word = word;
        }

        /** The method named {@code word}, or null. */
        public static Method of(String word) {
            for (Method m : values()) {
                if (m.word.equals(word)) {
                    return m;
                }
            }
            return null;
        }
    }

    /**
     * Why √(W₊W₋) is not a bound for f when the graph does not decide it, in words shown by the
     * command line, the JSON results and the page alike (null when the reduction holds or is not
     * checked). {@code counterexamples} is a decimal count.
     */
    public static String notABound(String counterexamples) {
        return "not a bound for f: the graph does not decide f on " + counterexamples + " input(s) of the domain"
                + " (s-t connectivity differs from f there), so sqrt(W+ W-) bounds no algorithm for f";
    }

    /** Largest domain {@link Method#AUTO} enumerates: beyond it, structure is cheaper. */
    public static final int AUTO_ENUMERATION_VARIABLES = 20;

    /**
     * Most inputs an enumeration keeps per-input values for (one double and one byte each, about
     * 151 MB at this size): 2^24, the reader's limit for an enumerated promise. The same in the
     * command-line tool and the page (docs/scenario-format.md, "Limits").
     */
    public static final long MAX_ENUMERATED_INPUTS = 1L << 24;

    /**
     * Most inputs whose rows are listed one by one (analyze --inputs, the page's input table): 2^20.
     * A list of 2^22 rows is about 300 million characters of JSON, more than a browser can hold in
     * one string. The same in the command-line tool and the page.
     */
    public static final long MAX_LISTED_INPUTS = 1L << 20;

    /**
     * Refuses, before any allocation, a domain too large to enumerate with per-input values.
     *
     * @throws ScenarioException {@code too-many-inputs}, naming the limit and what to use instead
     */
    public static void checkEnumerable(long domainSize) {
        if (domainSize > MAX_ENUMERATED_INPUTS) {
            throw new ScenarioException("too-many-inputs", "$.promise", "the domain has " + domainSize
                    + " inputs, more than the 2^24 = " + MAX_ENUMERATED_INPUTS + " an enumeration can keep; without a"
                    + " promise, scenarios beyond " + AUTO_ENUMERATION_VARIABLES + " variables are analysed by structure"
                    + " (analyze --method structure), or narrow the promise");
        }
    }

    /**
     * Refuses, before any allocation, a per-input list longer than {@link #MAX_LISTED_INPUTS}.
     *
     * @throws ScenarioException {@code too-many-inputs}, naming the limit and what to use instead
     */
    public static void checkListable(long domainSize) {
        if (domainSize > MAX_LISTED_INPUTS) {
            throw new ScenarioException("too-many-inputs", "$", "listing every input's row is limited to 2^20 = "
                    + MAX_LISTED_INPUTS + " inputs and this domain has " + domainSize + "; drop the list (analyze"
                    + " without --inputs) for W+, W- and the worst inputs, or look at single inputs (analyze --input BITS)");
        }
    }

    /** The method that will run, and why, in one line a researcher understands. */
    public record Choice(Method method, String reason) {}

    /**
     * Chooses the method: enumeration while it is cheapest (at most
     * {@link #AUTO_ENUMERATION_VARIABLES} variables, or a promise), structure beyond.
     *
     * @throws ScenarioException {@code method} when the requested method cannot run on this scenario,
     *     with the reason and what to use instead
     */
    public static Choice choose(Scenario sc, Method requested) {
        int n = sc.variableCount();
        String structureRefusal = StructuralAnalysis.refusal(sc);
        boolean listed = sc.promise().kind() == spanwright.model.Promise.Kind.INPUTS;
        boolean enumerable = listed || n <= spanwright.io.ScenarioReader.MAX_ENUMERATED_VARIABLES;
        switch (requested) {
            case ENUMERATE:
                if (!enumerable) {
                    throw new ScenarioException("method", "$.variables", n + " variables: 2^" + n
                            + " inputs are too many to enumerate (limit 2^"
                            + spanwright.io.ScenarioReader.MAX_ENUMERATED_VARIABLES + "); use the structural method"
                            + " (--method structure)");
                }
                return new Choice(Method.ENUMERATE, "enumeration, as asked: every input of the domain");
            case STRUCTURE:
                if (structureRefusal != null) {
                    throw new ScenarioException("method", "$.promise", structureRefusal
                            + (enumerable ? "; use --method enumerate" : ""));
                }
                return new Choice(Method.STRUCTURE, "structure, as asked: worst cases without enumerating the cube");
            default:
                boolean promised = sc.promise().kind() != spanwright.model.Promise.Kind.NONE;
                if (structureRefusal != null || promised || n <= AUTO_ENUMERATION_VARIABLES) {
                    if (!enumerable) {
                        throw new ScenarioException("method", "$.promise", structureRefusal);
                    }
                    return new Choice(Method.ENUMERATE, listed ? "enumeration: the promise lists its inputs"
                            : n <= AUTO_ENUMERATION_VARIABLES ? "enumeration: 2^" + n + " inputs is cheapest to list"
                                    : promised ? "enumeration: the promise's domain is listed (--method structure"
                                            + " runs branch and bound under it)" : "enumeration: " + structureRefusal);
                }
                return new Choice(Method.STRUCTURE, "structure: 2^" + n
                        + " inputs are too many to list cheaply, so worst cases come from the graph's paths, bonds"
                        + " and decision diagrams");
        }
    }

    /**
     * Analyses the whole domain. Cost: |domain| × one {@link ElectricalNetwork#evaluate}
     * (O(|V| + |E|) plus the elimination of the s–t part).
     */
    public static AnalysisResult run(Scenario scenario) {
        AnalysisRun r = start(scenario);
        r.step(Long.MAX_VALUE);
        return r.result();
    }

    /** Starts a stepwise analysis (for progress reporting and cancellation). */
    public static AnalysisRun start(Scenario scenario) {
        return new AnalysisRun(scenario);
    }

    /**
     * The {@link Summary} of the inputs with ordinals [from, to) of the scenario's domain (input
     * order), with fixed-bin histograms. Summaries of adjacent ranges merge exactly
     * ({@link Summary#merge}), so a domain can be split across threads or machines. Memory
     * O(|V| + |E| + bins) plus the elimination's work arrays, independent of the range's length;
     * cost (to − from) evaluations.
     *
     * @throws IllegalArgumentException when the range is not inside the domain
     */
    public static Summary summarize(Scenario scenario, long from, long to) {
        spanwright.domain.InputDomain domain = spanwright.domain.InputDomain.of(scenario);
        if (from < 0 || to < from || to > domain.size()) {
            throw new IllegalArgumentException("range [" + from + ", " + to + ") is not inside the domain of "
                    + domain.size() + " inputs");
        }
        Summary.Builder b = new Summary.Builder(scenario, Summary.Coverage.DOMAIN, from, true);
        for (long k = from; k < to; k++) {
            b.add(domain.get(k));
        }
        return b.build();
    }

    /**
     * The {@link Summary} of candidates [from, to) of {@code candidates} (chosen for this
     * scenario's graph, under any weights for {@link CandidateInputs#undominated} and under weights
     * invariant under the symmetry for {@link CandidateInputs#orbits}). Histograms count the
     * candidates evaluated, not the inputs they stand for.
     */
    public static Summary summarize(Scenario scenario, CandidateInputs candidates, int from, int to) {
        if (from < 0 || to < from || to > candidates.size()) {
            throw new IllegalArgumentException("range [" + from + ", " + to + ") is not inside the "
                    + candidates.size() + " candidates");
        }
        Summary.Builder b = new Summary.Builder(scenario, Summary.Coverage.CANDIDATES, from, true);
        for (int k = from; k < to; k++) {
            b.add(candidates.input(k));
        }
        return b.build();
    }

    /** Which edges (indices into {@code scenario.edges()}) are present on input {@code mask}. */
    public static boolean[] presentEdges(Scenario scenario, long mask) {
        List<Edge> edges = scenario.edges();
        boolean[] p = new boolean[edges.size()];
        for (int i = 0; i < p.length; i++) {
            p[i] = edges.get(i).when().holds(mask, scenario.variableCount());
        }
        return p;
    }

    /**
     * One input's full witness (currents and potentials, or potentials and energies), over all
     * edges of the scenario in file order; self-loops get current 0 and energy 0.
     */
    public static InputDetail detail(Scenario scenario, long mask) {
        boolean[] present = presentEdges(scenario, mask);
        // ElectricalNetwork itself gives self-loops no current and no energy
        Witness full = new ElectricalNetwork(scenario).witness(present);
        Boolean f = scenario.function() == null ? null : scenario.function().eval(mask);
        return new InputDetail(mask, scenario.variableCount(), present, f, full);
    }
}
