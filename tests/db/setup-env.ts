import { inject } from "vitest";

// Route handlers and services use the process-wide pool (db/client getDb()),
// which reads DATABASE_URL: point it at this run's throwaway database.
process.env.DATABASE_URL = inject("databaseUrl");
process.env.NEXTAUTH_SECRET = "test-secret-for-sagline-db-tests-only";
