/** The planning caution every results view and export carries (PRODUCT.md, Cautions). */
export const PLANNING_CAUTION = [
  "Planning-level estimates only: these allocations and DO results must be confirmed with a calibrated model and reviewed by a qualified (licensed) engineer.",
  "The water-quality standards and permitting rules of the jurisdiction take precedence over anything Sagline shows.",
] as const;

/** Leading lines of an export: the caution, then what the file holds (each becomes a `# ` line in a CSV). */
export function exportPreface(...about: string[]): string[] {
  return [...PLANNING_CAUTION, ...about.filter((s) => s.trim() !== "")];
}
