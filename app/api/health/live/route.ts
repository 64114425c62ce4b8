import { route } from "@/lib/api/route";

export const dynamic = "force-dynamic";

/**
 * Liveness: the process answers, nothing more. It asks nothing of PostgreSQL
 * (GET /api/health does, and says 503 when the database is down), so it is
 * also the framework's own trivial route that `npm run bench` measures other
 * reads against. A signed-out caller costs no query; route() reads the user
 * row only when a session cookie is sent.
 */
export const GET = route({ access: { public: true } }, async () => ({ ok: true }));
