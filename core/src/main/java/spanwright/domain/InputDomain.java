package spanwright.domain;

import spanwright.model.ScenarioException;
import spanwright.model.Inputs;
import spanwright.model.Promise;
import spanwright.model.Scenario;

/**
 * The inputs a scenario is analysed on, in input order (increasing mask = lexicographic input
 * string). The full cube is implicit; a promise's inputs are listed once, at construction, by
 * filtering the cube (O(2^n) promise evaluations) or from the explicit list. Immutable.
 */
public final class InputDomain {
    /**
     * Most variables for a domain that is the whole cube or filtered from it: the members are
     * listed as int masks, and 2^30 inputs is already far beyond what can be analysed.
     */
    public static final int MAX_FILTERED_VARIABLES = 30;

    private final int variableCount;
    private final long size;
    private final int[] small;
    private final long[] large;

    private InputDomain(int variableCount, long size, int[] small, long[] large) {
        this.variableCount = variableCount;
        this.size = size;
        this.small = small;
        this.large = large;
    }

    /**
     * The domain of {@code scenario}.
     *
     * @throws ScenarioException code {@code empty-domain} when the promise allows no input
     */
    public static InputDomain of(Scenario scenario) {
        int n = scenario.variableCount();
        Promise p = scenario.promise();
        if (p.kind() != Promise.Kind.INPUTS && n > MAX_FILTERED_VARIABLES) {
            // scenarios built in code can exceed the reader's limit; the cube cannot be listed
            throw new ScenarioException("too-many-variables", "$.variables", n + " variables: the 2^" + n + " inputs of "
                    + (p.kind() == Promise.Kind.NONE ? "the whole cube" : "this promise") + " cannot be listed one by one (at most "
                    + MAX_FILTERED_VARIABLES + " variables); W+, W- and the worst inputs of such a scenario come from the"
                    + " structural analysis (analyze), or list the inputs of interest in \"promise\": {\"inputs\": [...]}");
        }
        switch (p.kind()) {
            case NONE:
                return new InputDomain(n, 1L << n, null, null);
            case INPUTS: {
                long[] x = p.inputs();
                return new InputDomain(n, x.length, null, x);
            }
            default: {
                long cube = 1L << n;
                int count = 0;
                for (long m = 0; m < cube; m++) {
                    if (p.allows(m)) {
                        count++;
                    }
                }
                if (count == 0) {
                    throw new ScenarioException("empty-domain", "$.promise", "the promise ("
                            + p.describe(scenario.variables()) + ") allows none of the 2^" + n + " inputs");
                }
                int[] members = new int[count];
                int k = 0;
                for (long m = 0; m < cube; m++) {
                    if (p.allows(m)) {
                        members[k++] = (int) m;
                    }
                }
                return new InputDomain(n, count, members, null);
            }
        }
    }

    /** Number of inputs. */
    public long size() {
        return size;
    }

    public int variableCount() {
        return variableCount;
    }

    /** Is this the whole cube {0,1}^n? */
    public boolean isFullCube() {
        return small == null && large == null;
    }

    /** The input with this ordinal (0 ≤ ordinal &lt; size), as a mask. */
    public long get(long ordinal) {
        if (small != null) {
            return small[(int) ordinal];
        }
        if (large != null) {
            return large[(int) ordinal];
        }
        return ordinal;
    }

    /** Whether {@code mask} is in the domain. */
    public boolean contains(long mask) {
        if (small != null) {
            return java.util.Arrays.binarySearch(small, (int) mask) >= 0;
        }
        if (large != null) {
            return java.util.Arrays.binarySearch(large, mask) >= 0;
        }
        return mask >= 0 && mask < size;
    }

    /** Ordinal of {@code mask} in the domain, or −1 when it is not in the domain. O(log size). */
    public long ordinalOf(long mask) {
        if (small != null) {
            int i = java.util.Arrays.binarySearch(small, (int) mask);
            return i >= 0 && mask <= Integer.MAX_VALUE ? i : -1;
        }
        if (large != null) {
            int i = java.util.Arrays.binarySearch(large, mask);
            return i >= 0 ? i : -1;
        }
        return mask >= 0 && mask < size ? mask : -1;
    }

    /** Input string of the input with this ordinal. */
    public String format(long ordinal) {
        return Inputs.format(get(ordinal), variableCount);
    }
}
