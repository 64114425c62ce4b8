/** A file to send: bytes or text, its media type and the name to save it under. */
export interface PlanDownload {
  body: Uint8Array | string;
  contentType: string;
  fileName: string;
}

/** A download as an HTTP response: an attachment, not cached by shared caches. */
export function downloadResponse(d: PlanDownload): Response {
  return new Response(d.body as BodyInit, {
    headers: {
      "content-type": d.contentType,
      "content-disposition": `attachment; filename="${d.fileName.replace(/[^\w.-]+/g, "-")}"`,
      "cache-control": "private, no-store",
    },
  });
}
