import type { Db } from "@/db/client";
import { findBasinById } from "@/db/queries/basins";
import { deleteFollow, insertFollow, isFollowing } from "@/db/queries/follows";
import { requireActor, type Actor } from "@/lib/auth/guard";
import { notFound } from "@/lib/errors";

export interface FollowDto {
  basinId: string;
  followed: boolean;
}

/**
 * Any signed-in person may follow any basin, member or not: following only
 * asks for notices (review opened or closing, plan published), and each
 * notice links to a page that checks access again. So following reveals and
 * grants nothing beyond the basin existing.
 */
async function basinFor(db: Db, actor: Actor | null, basinId: string) {
  const me = requireActor(actor);
  const basin = await findBasinById(db, basinId);
  if (!basin) throw notFound("Basin");
  return { me, basin };
}

export async function followState(db: Db, actor: Actor | null, basinId: string): Promise<FollowDto> {
  const { me, basin } = await basinFor(db, actor, basinId);
  return { basinId: basin.id, followed: await isFollowing(db, basin.id, me.id) };
}

export async function followBasin(db: Db, actor: Actor | null, basinId: string): Promise<FollowDto> {
  const { me, basin } = await basinFor(db, actor, basinId);
  await insertFollow(db, basin.id, me.id);
  return { basinId: basin.id, followed: true };
}

export async function unfollowBasin(db: Db, actor: Actor | null, basinId: string): Promise<FollowDto> {
  const { me, basin } = await basinFor(db, actor, basinId);
  await deleteFollow(db, basin.id, me.id);
  return { basinId: basin.id, followed: false };
}
