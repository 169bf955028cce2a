/**
 * Lower bounds and classical measures for the function a scenario's graph should decide, and how
 * the graph compares: {@link spanwright.bounds.Bounds} is the one entry (used by the {@code bounds}
 * command and {@code JsonFacade.bounds}); {@link spanwright.bounds.GeneralAdversary} (ADV± by
 * semidefinite programming), {@link spanwright.bounds.PositiveAdversary} (ADV by its minimax form,
 * and by the same SDP with Γ ≥ 0 up to six variables) and {@link spanwright.bounds.ClassicalMeasures} (D, C₀, C₁, C, s, bs, deg) each return an
 * immutable result with its witness, certified independently of the solver that found it.
 * Formulations, algorithms, limits and references: {@code docs/bounds.md}.
 */
package spanwright.bounds;
