// Pure GIS import: readers, field mapping, topology, snapping and the validation report.
export * from "./errors";
export * from "./types";
export * from "./units";
export { crsFromEpsg, crsFromPrj, epsgDefinition, type Reprojector } from "./crs";
export { readShapefileZip, type ShapefileOptions } from "./read-shapefile";
export { readGeoJson, type GeoJsonOptions } from "./read-geojson";
export { readPointCsv, detectCsvFields, guessCsvCoordinates, type CsvCoordinates } from "./read-csv";
export * from "./field-mapping";
export * from "./problems";
export * from "./topology";
export * from "./snapping";
export * from "./validate";
export { readUploadLayer, type ReadOptions, type UploadLayer } from "./read-upload";
