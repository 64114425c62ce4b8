import { NextResponse, type NextRequest } from "next/server";
import type { z } from "zod";
import { getDb, type Db } from "@/db/client";
import { loadActor, requireActor, requireSiteAction, type Actor } from "@/lib/auth/guard";
import type { BasinAction, SiteAction } from "@/lib/auth/permissions";
import { basinScope, sessionBasinScope, type BasinScope } from "@/lib/auth/scope";
import { sessionFromRequest } from "@/lib/auth/session";
import { appUrl } from "@/lib/email/app-url";
import { AppError, notFound } from "@/lib/errors";
import { readMultipart, type UploadedForm } from "./multipart";
import { errorResponse, invalid } from "./respond";

/**
 * What a handler needs before it runs. `{ basin: true }`: a signed-in caller
 * and a basin that exists (the `basinId` path parameter); route() builds the
 * request's basin scope once and hands it over as `ctx.scope`, and the service
 * requires the action next to its data, so each endpoint names its permission
 * in one place. `{ basin: action }` also refuses in route() (for handlers that
 * call no basin service).
 */
export type Access =
  | { public: true }
  | { signedIn: true }
  | { site: SiteAction }
  | { basin: true | BasinAction };

interface Spec<A extends Access, P extends z.ZodType, B extends z.ZodType, Q extends z.ZodType> {
  access: A;
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
  /** A JSON body's most bytes (default DEFAULT_MAX_JSON_BYTES), counted as it is read; more is a 413. */
  maxBodyBytes?: number;
  /** HTTP status of a successful response (default 200). */
  status?: number;
}

export interface RouteContext<P, B, Q = Record<string, string>, S = BasinScope | null> {
  db: Db;
  req: NextRequest;
  actor: Actor | null;
  params: P;
  body: B;
  query: Q;
  /** With access { basin }: this request's basin scope (the basin and the caller's role, read once). */
  scope: S;
  /** The uploaded file, when the spec names a fileField. */
  file: { name: string; bytes: Buffer } | null;
}

type ScopeOf<A> = A extends { basin: unknown } ? BasinScope : null;
type Handler<A, P, B, Q> = (ctx: RouteContext<P, B, Q, ScopeOf<A>>) => Promise<unknown>;

/**
 * The most bytes a JSON body may have unless a route says otherwise: every
 * form's body is a few KB; a route taking more (scenario inputs) says so.
 */
export const DEFAULT_MAX_JSON_BYTES = 256 * 1024;

/** The cap for JSON bodies holding a value per reach (scenario inputs on a large network). */
export const LARGE_JSON_BYTES = 8 * 1024 * 1024;

const tooLarge = (limit: number, field = "body") =>
  new AppError("too_large", `The request body is larger than the ${limit >= 1048576 ? `${Math.floor(limit / 1048576)} MB` : `${Math.floor(limit / 1024)} KB`} limit`, [
    { path: field, message: "Too large" },
  ]);

/**
 * The body's bytes, counted while they arrive and refused once past `limit`
 * (a chunked body has no Content-Length to check first), so an oversized
 * body is never held in memory whole.
 */
async function readCapped(req: NextRequest, limit: number, field?: string): Promise<Buffer> {
  const declared = Number(req.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > limit) throw tooLarge(limit, field);
  if (!req.body) return Buffer.alloc(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge(limit, field);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks, total);
}

/** The first text value holding a NUL character (PostgreSQL cannot store one), as a dotted path. */
function nulPath(value: unknown, path: string): string | null {
  if (typeof value === "string") return value.includes("\u0000") ? path : null;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const p = nulPath(value[i], path ? `${path}.${i}` : String(i));
      if (p !== null) return p;
    }
    return null;
  }
  if (value && typeof value === "object") {
    for (const [k, v] of Object.entries(value)) {
      if (k.includes("\u0000")) return path ? `${path}.${k}` : k;
      const p = nulPath(v, path ? `${path}.${k}` : k);
      if (p !== null) return p;
    }
  }
  return null;
}

function refuseNul(value: unknown, where: string): void {
  const path = nulPath(value, "");
  if (path !== null) {
    throw new AppError("invalid", `A NUL character is not allowed in ${path || where}`, [{ path: path || where, message: "Contains a NUL character" }]);
  }
}

const basinNotFound = (): never => {
  throw notFound("Basin");
};

const foreign = (path: string, value: string) =>
  new AppError("forbidden", "This request came from another site; Sagline accepts changes only from its own pages", [{ path, message: value }]);

/** Sagline's own origins: NEXTAUTH_URL's (appUrl) and the one the request was addressed to. */
function ownOrigins(req: NextRequest): Set<string> {
  const own = new Set<string>([new URL(appUrl()).origin]);
  const host = req.headers.get("x-forwarded-host") ?? req.headers.get("host");
  const proto = req.headers.get("x-forwarded-proto") ?? req.nextUrl.protocol.replace(/:$/, "");
  if (host) own.add(`${proto}://${host}`);
  return own;
}

/**
 * A write must come from Sagline's own pages. Origin is checked when sent
 * (browsers send it on every POST, PATCH, PUT and DELETE); without it the
 * Referer, then Sec-Fetch-Site, must not name another site. A request with none
 * of them (scripts, the CLI) carries no other site's cookies and passes.
 */
function refuseForeignOrigin(req: NextRequest): void {
  if (req.method === "GET" || req.method === "HEAD" || req.method === "OPTIONS") return;
  const origin = req.headers.get("origin");
  if (origin !== null) {
    if (!ownOrigins(req).has(origin)) throw foreign("Origin", origin);
    return;
  }
  const referer = req.headers.get("referer");
  if (referer) {
    let from: string;
    try {
      from = new URL(referer).origin;
    } catch {
      throw foreign("Referer", referer);
    }
    if (!ownOrigins(req).has(from)) throw foreign("Referer", from);
    return;
  }
  // same-site is another origin too (a sibling sub-domain or port)
  const site = req.headers.get("sec-fetch-site");
  if (site === "cross-site" || site === "same-site") throw foreign("Sec-Fetch-Site", site);
}

async function readJson(req: NextRequest, limit: number): Promise<unknown> {
  const type = (req.headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
  if (type !== "application/json" && !type.endsWith("+json")) {
    throw new AppError("unsupported_media_type", "Send the request body as JSON (Content-Type: application/json)", [{ path: "Content-Type", message: type || "missing" }]);
  }
  const text = (await readCapped(req, limit)).toString("utf8");
  if (text.trim() === "") throw new AppError("bad_request", "The request body is empty; send a JSON object");
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("bad_request", "The request body is not valid JSON");
  }
}

async function readForm(req: NextRequest, limit: number, field: string): Promise<UploadedForm> {
  // a declared length over the limit is refused before anything else is looked at
  const declared = Number(req.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > limit) throw tooLarge(limit, field);
  const type = req.headers.get("content-type") ?? "";
  if (!type.startsWith("multipart/form-data")) {
    throw new AppError("unsupported_media_type", "Send the upload as multipart/form-data", [{ path: "Content-Type", message: type || "missing" }]);
  }
  return readMultipart(req.body, type, limit, field, () => tooLarge(limit, field));
}

/**
 * The only way to write an API route: session → permission → params/body
 * validation → service → JSON, with every error mapped in one place.
 */
export function route<
  const A extends Access,
  P extends z.ZodType = z.ZodType<Record<string, string>>,
  B extends z.ZodType = z.ZodType<undefined>,
  Q extends z.ZodType = z.ZodType<Record<string, string>>,
>(spec: Spec<A, P, B, Q>, handler: Handler<A, z.infer<P>, z.infer<B>, z.infer<Q>>) {
  return async (req: NextRequest, ctx: { params: Promise<Record<string, string | string[]>> }): Promise<Response> => {
    try {
      refuseForeignOrigin(req);
      const db = getDb();
      const rawParams = (await ctx?.params) ?? {};
      // a basin route reads the account, the basin and the role in one query; the others read the account
      const session = "public" in spec.access ? await sessionFromRequest(req).catch(() => null) : await sessionFromRequest(req);
      const rawBasinId = "basin" in spec.access ? rawParams.basinId : undefined;
      let actor: Actor | null;
      let found: { scope: BasinScope | null } | null = null;
      if (session && typeof rawBasinId === "string") {
        const both = await sessionBasinScope(db, session, rawBasinId);
        actor = both.actor;
        found = { scope: both.scope };
      } else {
        actor = session ? await loadActor(db, session.userId, session.sessionVersion) : null;
      }
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

      let scope: BasinScope | null = null;
      if ("basin" in spec.access) {
        const basinId = (params as { basinId?: string }).basinId;
        if (!basinId) throw new Error("route with basin access needs a basinId parameter");
        if (found?.scope && found.scope.basin.id.toLowerCase() !== basinId.toLowerCase()) throw new Error("the basin scope was read for another basin id");
        scope = found ? (found.scope ?? basinNotFound()) : await basinScope(db, actor, basinId);
        if (spec.access.basin !== true) scope.require(spec.access.basin);
      }

      let query = Object.fromEntries(req.nextUrl.searchParams) as z.infer<Q>;
      refuseNul(query, "query string");
      if (spec.query) {
        const parsed = spec.query.safeParse(query);
        if (!parsed.success) throw invalid(parsed.error, "query string");
        query = parsed.data;
      }

      let body = undefined as z.infer<B>;
      let file: RouteContext<unknown, unknown, unknown>["file"] = null;
      if (spec.fileField) {
        const form = await readForm(req, spec.maxUploadBytes?.() ?? DEFAULT_MAX_JSON_BYTES, spec.fileField);
        if (!form.file) {
          throw new AppError("invalid", `Attach the file as the "${spec.fileField}" field`, [
            { path: spec.fileField, message: "Required" },
          ]);
        }
        file = form.file;
        const fields = form.fields;
        refuseNul(fields, "form fields");
        if (spec.body) {
          const parsed = spec.body.safeParse(fields);
          if (!parsed.success) throw invalid(parsed.error, "form fields");
          body = parsed.data;
        }
      } else if (spec.body) {
        const json = await readJson(req, spec.maxBodyBytes ?? DEFAULT_MAX_JSON_BYTES);
        refuseNul(json, "request body");
        const parsed = spec.body.safeParse(json);
        if (!parsed.success) throw invalid(parsed.error, "request body");
        body = parsed.data;
      }

      const result = await handler({ db, req, actor, params, body, query, scope: scope as ScopeOf<A>, file });
      if (result instanceof Response) return result;
      const status = spec.status ?? 200;
      if (status === 204 || result === undefined) return new NextResponse(null, { status: 204 });
      return NextResponse.json(result, { status });
    } catch (error) {
      return errorResponse(error);
    }
  };
}
