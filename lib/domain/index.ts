/**
 * Sagline's domain vocabulary, held once: each list of codes as a tuple (zod enums are
 * built with z.enum(TUPLE), types are `(typeof TUPLE)[number]`), its default where it has
 * one, and the names a reader sees for it. db/schema.ts, lib/validation, lib/model, geo and
 * the components derive from here; lib/format/labels.ts re-exports the names beside the
 * display names that are not vocabulary (audit actions, field labels).
 *
 * Pure: imports nothing.
 */
export * from "./roles";
export * from "./units";
export * from "./reaeration";
export * from "./temperature";
export * from "./objectives";
export * from "./statuses";
export * from "./imports";
export * from "./hydraulics";
export * from "./hydrology";
export * from "./calibration";
export * from "./surveys";
