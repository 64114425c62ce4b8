import { createRequire } from "node:module";
import { dirname, join } from "node:path";
import { pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";

/**
 * Starts a worker on `url`. A .ts entry (running from sources under tsx or vitest) is
 * started through a small bootstrap that registers tsx's ESM loader inside the worker
 * first: Node 20 does not apply an `--import` loader from execArgv to a worker's entry.
 */
export function startWorker(url: URL): Worker {
  if (!url.pathname.endsWith(".ts")) return new Worker(url);
  // Resolved at run time from the project folder: a bundler turns a literal
  // `require.resolve("tsx/…")` into its own module id (seen in the Next.js build).
  const tsxManifest = ["tsx", "package.json"].join("/");
  const tsxDir = dirname(createRequire(pathToFileURL(join(process.cwd(), "package.json")).href).resolve(tsxManifest));
  const api = pathToFileURL(join(tsxDir, "dist/esm/api/index.mjs")).href;
  const code = `import(${JSON.stringify(api)}).then((m) => { m.register(); return import(${JSON.stringify(url.href)}); });`;
  return new Worker(code, { eval: true });
}
