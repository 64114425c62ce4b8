import { describe, expect, it } from "vitest";
import { readMultipart } from "@/lib/api/multipart";
import { bytesResponse } from "@/lib/api/respond";
import { AppError } from "@/lib/errors";

/** A form encoded by undici's own FormData serialiser (an independent multipart writer), as a browser would send it. */
async function encoded(fields: Record<string, string>, file?: { name: string; bytes: Uint8Array<ArrayBuffer> }) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  if (file) form.set("file", new File([file.bytes], file.name));
  const req = new Request("http://127.0.0.1/", { method: "POST", body: form });
  return { body: req.body, type: req.headers.get("content-type")! };
}
const tooLarge = () => new AppError("too_large", "too large", [{ path: "file", message: "File too large" }]);

describe("readMultipart", () => {
  it("returns the text fields and the file's bytes unchanged, in shared memory", async () => {
    const bytes = new Uint8Array(3_000_000).map((_, i) => (i * 31) % 251);
    const { body, type } = await encoded({ layer: "reaches", epsg: "", csvX: "É x" }, { name: "river.geojson", bytes });
    const form = await readMultipart(body, type, 5_000_000, "file", tooLarge);
    expect(form.fields).toEqual({ layer: "reaches", csvX: "É x" }); // empty fields are left out
    expect(form.file?.name).toBe("river.geojson");
    expect(Buffer.compare(form.file!.bytes, Buffer.from(bytes))).toBe(0);
    expect(form.file!.bytes.buffer).toBeInstanceOf(SharedArrayBuffer);
  });

  it("has no file when the field is missing, and ignores a file under another name", async () => {
    const { body, type } = await encoded({ layer: "reaches" });
    expect((await readMultipart(body, type, 1000, "file", tooLarge)).file).toBeNull();
    const other = await encoded({}, { name: "x.csv", bytes: new Uint8Array([1, 2, 3]) });
    expect((await readMultipart(other.body, other.type, 1000, "upload", tooLarge)).file).toBeNull();
  });

  it("refuses a file over the limit with the caller's error", async () => {
    const { body, type } = await encoded({ layer: "reaches" }, { name: "big.geojson", bytes: new Uint8Array(200_000) });
    await expect(readMultipart(body, type, 100_000, "file", tooLarge)).rejects.toMatchObject({ code: "too_large" });
  });

  it("refuses a long form field and a body without a boundary", async () => {
    const { body, type } = await encoded({ layer: "x".repeat(5000) });
    await expect(readMultipart(body, type, 100_000, "file", tooLarge)).rejects.toMatchObject({ code: "too_large", details: [{ path: "layer" }] });
    await expect(readMultipart(null, "multipart/form-data", 100, "file", tooLarge)).rejects.toMatchObject({ code: "bad_request" });
  });
});

describe("bytesResponse", () => {
  it("streams the parts in slices whose concatenation is the parts, with the length declared", async () => {
    const parts = [new TextEncoder().encode('{"a":'), new Uint8Array(700_000).fill(0x31), new TextEncoder().encode("}")];
    const res = bytesResponse(parts, "application/json");
    expect(res.headers.get("content-length")).toBe(String(700_006));
    const seen: number[] = [];
    const chunks: Uint8Array[] = [];
    for await (const c of res.body!) {
      seen.push(c.byteLength);
      chunks.push(c);
    }
    expect(Math.max(...seen)).toBeLessThanOrEqual(256 * 1024);
    expect(Buffer.concat(chunks).equals(Buffer.concat(parts))).toBe(true);
  });
});
