// Pure GIS import: readers, field mapping, topology, snapping and the validation report.
export * from "./errors";
export * from "./types";
export * from "./units";
export { crsFromEpsg, crsFromPrj, epsgDefinition, type Reprojector } from "./crs";
export { detectFields } from "./fields";
export { readShapefileZip, type ShapefileOptions } from "./read-shapefile";
export { readGeoJson, type GeoJsonOptions } from "./read-geojson";
export { readPointCsv, detectCsvFields, guessCsvCoordinates, type CsvCoordinates } from "./read-csv";
export * from "./field-mapping";
export * from "./problems";
export { prepareReachLine, type PreparedLine } from "./reach-line";
export * from "./topology";
export * from "./snapping";
export * from "./validate";
export { IMPORT_LIMITS, checkLimits } from "./limits";
export { readUploadLayer, type ReadOptions, type UploadLayer } from "./read-upload";
export { selfCrossings } from "./self-crossings";
