/** Pure helpers behind the results views (DO map, profile, tables, exports). */
export * from "./do-scale";
export * from "./path";
export * from "./profile-series";
export * from "./line-cut";
export * from "./results-geojson";
export * from "./caution";
export * from "./csv-rows";
export * from "./reach-rows";
export * from "./compare";
export * from "./binding-rows";
export * from "./diagnosis-rows";
export * from "./governing";
export * from "./run-conditions";
export * from "./objective-text";
export * from "./input-diff";
