import busboy from "busboy";
import { AppError } from "@/lib/errors";

export interface UploadedForm {
  /** Text fields, empty ones left out. */
  fields: Record<string, string>;
  /** The named file field, if sent: its bytes in shared memory (see sharedBytes). */
  file: { name: string; bytes: Buffer } | null;
}

/** Work done on the request thread between two yields to the event loop while a body is read. */
const YIELD_EVERY_BYTES = 1024 * 1024;
const PARSE_SLICE_BYTES = 256 * 1024;
/** What a form may add to its file: part headers and short text fields (layer, EPSG code, column names). */
const FORM_OVERHEAD_BYTES = 64 * 1024;
const yieldToLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * Bytes copied into a SharedArrayBuffer: handed to a worker thread they are shared, not
 * copied again on this thread (a 30 MB upload cloned in postMessage stalls the loop for
 * tens of ms). The receiving worker copies them into its own memory before parsing.
 */
export function sharedBytes(chunks: readonly Uint8Array[], total = chunks.reduce((n, c) => n + c.byteLength, 0)): Buffer {
  const out = Buffer.from(new SharedArrayBuffer(total));
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

/**
 * Read a multipart/form-data body as it streams in (busboy), never holding more than
 * `limit` bytes of file and yielding to the event loop every few MB, so a large upload
 * neither buffers the whole body twice nor parses it in one long step.
 */
export async function readMultipart(
  body: ReadableStream<Uint8Array> | null,
  contentType: string,
  limit: number,
  fileField: string,
  tooLarge: () => AppError,
): Promise<UploadedForm> {
  const fields: Record<string, string> = {};
  let file: UploadedForm["file"] = null;
  let failure: AppError | null = null;
  const fail = (e: AppError) => (failure ??= e);

  let bb: busboy.Busboy;
  try {
    bb = busboy({ headers: { "content-type": contentType }, limits: { files: 1, fileSize: limit, fields: 50, fieldSize: 1024 } });
  } catch {
    throw new AppError("bad_request", "The multipart upload could not be read", [{ path: "Content-Type", message: "No multipart boundary" }]);
  }
  const finished = new Promise<void>((resolve) => {
    bb.on("close", resolve);
    bb.on("error", () => {
      fail(new AppError("bad_request", "The multipart upload could not be read"));
      resolve();
    });
  });
  bb.on("field", (name, value, info) => {
    if (info.valueTruncated) fail(new AppError("too_large", `The form field "${name}" is too long`, [{ path: name, message: "Too long" }]));
    else if (value !== "") fields[name] = value;
  });
  const fileEnds: Promise<void>[] = [];
  bb.on("file", (name, stream, info) => {
    if (name !== fileField) return void stream.resume();
    fileEnds.push(new Promise((resolve) => stream.on("close", resolve)));
    const chunks: Buffer[] = [];
    let total = 0;
    stream.on("data", (c: Buffer) => {
      chunks.push(c);
      total += c.byteLength;
    });
    stream.on("limit", () => fail(tooLarge()));
    stream.on("end", () => {
      file = { name: info.filename || "upload", bytes: sharedBytes(chunks, total) };
    });
  });

  if (body) {
    const reader = body.getReader();
    let sinceYield = 0;
    let total = 0;
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      // the file limit plus room for the form's part headers and its few short fields
      if (total > limit + FORM_OVERHEAD_BYTES) fail(tooLarge());
      if (failure) {
        await reader.cancel().catch(() => undefined);
        break;
      }
      // a chunk may be large (a body built in-process arrives whole): fed to the parser in slices
      for (let at = 0; at < value.byteLength; at += PARSE_SLICE_BYTES) {
        bb.write(value.subarray(at, at + PARSE_SLICE_BYTES));
        sinceYield += Math.min(PARSE_SLICE_BYTES, value.byteLength - at);
        if (sinceYield >= YIELD_EVERY_BYTES) {
          sinceYield = 0;
          await yieldToLoop();
        }
      }
    }
  }
  if (failure) {
    bb.destroy();
    throw failure;
  }
  bb.end();
  await finished;
  await Promise.all(fileEnds);
  if (failure) throw failure;
  return { fields, file };
}
