import { NextResponse, type NextRequest } from "next/server";
import type { z } from "zod";
import { getDb, type Db } from "@/db/client";
import { requireActor, requireBasinAction, requireSiteAction, type Actor, type BasinAccess } from "@/lib/auth/guard";
import type { BasinAction, SiteAction } from "@/lib/auth/permissions";
import { actorFromRequest } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { errorResponse, invalid } from "./respond";

/** What a handler needs before it runs. */
export type Access =
  | { public: true }
  | { signedIn: true }
  | { site: SiteAction }
  | { basin: BasinAction };

interface Spec<P extends z.ZodType, B extends z.ZodType, Q extends z.ZodType> {
  access: Access;
  params?: P;
  body?: B;
  /** The query string (each parameter once, as text); a bad one is a 422 naming it. */
  query?: Q;
  /**
   * multipart/form-data instead of JSON: the text fields are validated by
   * `body`, and the one file field named here arrives as `ctx.file`.
   */
  fileField?: string;
  /**
   * With fileField: the most bytes the whole upload may have. A request whose
   * Content-Length says more is refused before any of it is read.
   */
  maxUploadBytes?: () => number;
  /** HTTP status of a successful response (default 200). */
  status?: number;
}

export interface RouteContext<P, B, Q = Record<string, string>> {
  db: Db;
  req: NextRequest;
  actor: Actor | null;
  params: P;
  body: B;
  query: Q;
  /** Set when access is { basin: … }: the basin and the actor's role in it. */
  access: BasinAccess | null;
  /** The uploaded file, when the spec names a fileField. */
  file: { name: string; bytes: Buffer } | null;
}

type Handler<P, B, Q> = (ctx: RouteContext<P, B, Q>) => Promise<unknown>;

async function readJson(req: NextRequest): Promise<unknown> {
  const text = await req.text();
  if (text.trim() === "") throw new AppError("bad_request", "The request body is empty; send a JSON object");
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("bad_request", "The request body is not valid JSON");
  }
}

async function readForm(req: NextRequest): Promise<FormData> {
  const type = req.headers.get("content-type") ?? "";
  if (!type.startsWith("multipart/form-data")) {
    throw new AppError("bad_request", "Send the upload as multipart/form-data");
  }
  try {
    return await req.formData();
  } catch {
    throw new AppError("bad_request", "The multipart upload could not be read");
  }
}

/**
 * The only way to write an API route: session → permission → params/body
 * validation → service → JSON, with every error mapped in one place.
 */
export function route<
  P extends z.ZodType = z.ZodType<Record<string, string>>,
  B extends z.ZodType = z.ZodType<undefined>,
  Q extends z.ZodType = z.ZodType<Record<string, string>>,
>(spec: Spec<P, B, Q>, handler: Handler<z.infer<P>, z.infer<B>, z.infer<Q>>) {
  return async (req: NextRequest, ctx: { params: Promise<Record<string, string | string[]>> }): Promise<Response> => {
    try {
      const db = getDb();
      const rawParams = (await ctx?.params) ?? {};
      const actor = "public" in spec.access ? await actorFromRequest(req).catch(() => null) : await actorFromRequest(req);
      if (!("public" in spec.access)) requireActor(actor);
      if ("site" in spec.access) requireSiteAction(actor, spec.access.site);

      let params = rawParams as z.infer<P>;
      if (spec.params) {
        const parsed = spec.params.safeParse(rawParams);
        // A malformed id in the path cannot name anything: 404, naming the parameter.
        if (!parsed.success) {
          throw new AppError("not_found", `${parsed.error.issues[0].message}`, invalid(parsed.error, "path").details);
        }
        params = parsed.data;
      }

      let access: BasinAccess | null = null;
      if ("basin" in spec.access) {
        const basinId = (params as { basinId?: string }).basinId;
        if (!basinId) throw new Error("route with basin access needs a basinId parameter");
        access = await requireBasinAction(db, actor, basinId, spec.access.basin);
      }

      let query = Object.fromEntries(req.nextUrl.searchParams) as z.infer<Q>;
      if (spec.query) {
        const parsed = spec.query.safeParse(query);
        if (!parsed.success) throw invalid(parsed.error, "query string");
        query = parsed.data;
      }

      let body = undefined as z.infer<B>;
      let file: RouteContext<unknown, unknown, unknown>["file"] = null;
      if (spec.fileField) {
        const declared = Number(req.headers.get("content-length") ?? NaN);
        const limit = spec.maxUploadBytes?.();
        if (limit !== undefined && Number.isFinite(declared) && declared > limit) {
          throw new AppError("too_large", `The upload is larger than the ${Math.floor(limit / 1048576)} MB limit`, [
            { path: spec.fileField, message: "File too large" },
          ]);
        }
        const form = await readForm(req);
        const entry = form.get(spec.fileField);
        if (!(entry instanceof File)) {
          throw new AppError("invalid", `Attach the file as the "${spec.fileField}" field`, [
            { path: spec.fileField, message: "Required" },
          ]);
        }
        file = { name: entry.name || "upload", bytes: Buffer.from(await entry.arrayBuffer()) };
        const fields: Record<string, string> = {};
        for (const [k, v] of form.entries()) if (typeof v === "string" && v !== "") fields[k] = v;
        if (spec.body) {
          const parsed = spec.body.safeParse(fields);
          if (!parsed.success) throw invalid(parsed.error, "form fields");
          body = parsed.data;
        }
      } else if (spec.body) {
        const parsed = spec.body.safeParse(await readJson(req));
        if (!parsed.success) throw invalid(parsed.error, "request body");
        body = parsed.data;
      }

      const result = await handler({ db, req, actor, params, body, query, access, file });
      if (result instanceof Response) return result;
      const status = spec.status ?? 200;
      if (status === 204 || result === undefined) return new NextResponse(null, { status: 204 });
      return NextResponse.json(result, { status });
    } catch (error) {
      return errorResponse(error);
    }
  };
}
