import { createDb } from "@/db/client";
import { seedDemo } from "@/db/seed/demo";
import { DEMO_PASSWORD_NOTE, DEMO_USERS } from "@/db/seed/demo-data";
import { loadDemoNetwork } from "@/lib/services/demo";
import { hashPassword } from "@/lib/services/users";
import { fileURLToPath } from "node:url";

const db = createDb();
try {
  const { created } = await seedDemo(db, hashPassword);
  console.log(created ? `Demo basin loaded (${created} new records).` : "Demo basin already loaded.");
  const version = await loadDemoNetwork(db, fileURLToPath(new URL("..", import.meta.url)));
  if (version) console.log(`Demo network imported from the demo shapefile and CSV (version ${version}).`);
  console.log("\nDemo sign-in accounts (" + DEMO_PASSWORD_NOTE + "):");
  for (const u of DEMO_USERS) console.log(`  ${u.key.padEnd(12)} ${u.email.padEnd(28)} ${u.password}`);
} catch (error) {
  console.error(error instanceof Error ? error.message : String(error));
  process.exitCode = 1;
} finally {
  await db.destroy();
}
