import { route } from "@/lib/api/route";
import { createUser, listUsers } from "@/lib/services/users";
import { userCreateSchema } from "@/lib/validation/user";

export const GET = route({ access: { site: "users.manage" } }, ({ db, actor }) => listUsers(db, actor));

export const POST = route(
  { access: { site: "users.manage" }, body: userCreateSchema, status: 201 },
  ({ db, actor, body }) => createUser(db, actor, body),
);
