import type { Db } from "@/db/client";
import { findReach, latestNetworkId } from "@/db/queries/networks";
import { AppError } from "@/lib/errors";

/** A problem with an uploaded field record (a gauge's or temperature record, a survey), named on the form's file field. */
export const fileProblem = (message: string) => new AppError("invalid", message, [{ path: "file", message }]);

/** Refuses an empty file or one over `maxBytes` (a 413 naming the file field). */
export function checkRecordFile(file: { name: string; bytes: Buffer }, maxBytes: number, what: string): void {
  if (file.bytes.byteLength > maxBytes) {
    throw new AppError("too_large", `${file.name} is larger than the ${maxBytes / 1048576} MB limit for ${what}`, [{ path: "file", message: "File too large" }]);
  }
  if (file.bytes.byteLength === 0) throw fileProblem(`${file.name} is empty`);
}

/** Refuses a reach id the basin's newest network does not have (a 422 naming `reachId`). */
export async function checkReachOnNewestNetwork(db: Db, basinId: string, reachId: string): Promise<void> {
  const networkId = await latestNetworkId(db, basinId);
  if (!networkId || !(await findReach(db, networkId, reachId))) {
    throw new AppError("invalid", `There is no reach "${reachId}" in the basin's newest network`, [{ path: "reachId", message: "Unknown reach" }]);
  }
}
