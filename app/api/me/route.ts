import { route } from "@/lib/api/route";
import { canCreateBasin } from "@/lib/services/basins";

export const GET = route({ access: { signedIn: true } }, async ({ db, actor }) => ({
  id: actor!.id,
  email: actor!.email,
  name: actor!.name,
  isAdmin: actor!.isAdmin,
  canCreateBasin: await canCreateBasin(db, actor),
}));
