import type { Db } from "@/db/client";
import type { Actor } from "@/lib/auth/guard";
import { basinScope, type BasinScope } from "@/lib/auth/scope";

/**
 * Calls a scope-taking service the way a request does: builds the scope from
 * (db, actor, basinId) with the real builder (401 signed out, 404 unknown
 * basin), then calls the service, whose own `require` decides the action.
 * A refusal from either step is a rejected promise, so `expect(...).rejects`
 * sees both.
 */
export function scoped<A extends unknown[], R>(service: (scope: BasinScope, ...args: A) => R | Promise<R>) {
  return (db: Db, actor: Actor | null, basinId: string, ...args: A): Promise<R> =>
    basinScope(db, actor, basinId).then((scope) => service(scope, ...args));
}
