/**
 * Recorded with every run: the version of the computation (bump when a formula
 * or a default changes, so stored runs are not served for new inputs) and the
 * saturation method used.
 */
export const MODEL_VERSION = "sagline-model-1";
export const SATURATION_METHOD = "Benson & Krause (1984), Standard Methods 4500-O, with elevation pressure correction";
