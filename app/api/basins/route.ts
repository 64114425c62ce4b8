import { route } from "@/lib/api/route";
import { createBasin, listMyBasins } from "@/lib/services/basins";
import { basinCreateSchema } from "@/lib/validation/basin";

export const GET = route({ access: { signedIn: true } }, ({ db, actor }) => listMyBasins(db, actor));

export const POST = route({ access: { signedIn: true }, body: basinCreateSchema, status: 201 }, ({ db, actor, body }) =>
  createBasin(db, actor, body),
);
