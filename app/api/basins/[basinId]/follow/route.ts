import { route } from "@/lib/api/route";
import { followBasin, followState, unfollowBasin } from "@/lib/services/follows";
import { basinParams } from "@/lib/validation/params";

// Any signed-in person may follow any basin for its notices (lib/services/follows.ts says why).
export const GET = route({ access: { signedIn: true }, params: basinParams }, ({ db, actor, params }) =>
  followState(db, actor, params.basinId),
);
export const PUT = route({ access: { signedIn: true }, params: basinParams }, ({ db, actor, params }) =>
  followBasin(db, actor, params.basinId),
);
export const DELETE = route({ access: { signedIn: true }, params: basinParams }, ({ db, actor, params }) =>
  unfollowBasin(db, actor, params.basinId),
);
