/**
 * Reach and permit ids become keys of the scenario form's field paths
 * ("inputs.dischargers.<id>.bod5MgL"). The form library splits paths on "."
 * and reads all-digit parts as array indexes, so an id like "R.2" or "12"
 * would land in the wrong place. Ids are carried under a key that has neither:
 * "k" + the id percent-encoded, with "." encoded too.
 */
export const formKey = (id: string): string => `k${encodeURIComponent(id).replace(/\./g, "%2E")}`;

/** The id behind a form key (the inverse of formKey). */
export const idOfFormKey = (key: string): string => decodeURIComponent(key.slice(1));

/** A record keyed by ids, keyed by form keys instead. */
export const toFormKeys = <V>(record: Record<string, V>): Record<string, V> =>
  Object.fromEntries(Object.entries(record).map(([id, v]) => [formKey(id), v]));

/** A record keyed by form keys, keyed by ids again. */
export const fromFormKeys = <V>(record: Record<string, V>): Record<string, V> =>
  Object.fromEntries(Object.entries(record).map(([key, v]) => [idOfFormKey(key), v]));
