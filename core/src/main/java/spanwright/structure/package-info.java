/**
 * Exact worst cases without enumerating the input cube (layer 3: uses expr, model, electric,
 * domain, io only). {@link spanwright.structure.PathsAndBonds} gives W₊ (heaviest simple s–t path)
 * and W₋ (heaviest s–t bond) of a one-variable-per-edge monotone {@link
 * spanwright.structure.HostGraph}, each with a maximiser and a count, by frontier-based search or
 * by dynamic programming over vertex subsets; {@link spanwright.structure.StructureBench} times them.
 */
package spanwright.structure;
