import type { BasinRecord, BasinWithRole } from "@/db/queries/basins";
import type { FacilityWithUsers } from "@/db/queries/facilities";
import type { MemberRow } from "@/db/queries/memberships";
import type { BasinRole, UnitSystem, UserRow } from "@/db/schema";

// What leaves the server: plain JSON shapes, never raw rows.

export interface BasinDto {
  id: string;
  slug: string;
  name: string;
  description: string;
  doCriterionMgL: number;
  unitSystem: UnitSystem;
  /** Shortest review period a plan of this basin may have, days (0: none). */
  minReviewDays: number;
  /** The basin's time zone (IANA); null until the lead sets it or the first review opens. */
  timeZone: string | null;
  createdAt: string;
  updatedAt: string;
  myRole: BasinRole | null;
  memberCount?: number;
}

export function basinDto(b: BasinRecord, myRole: BasinRole | null, memberCount?: number): BasinDto {
  return {
    id: b.id,
    slug: b.slug,
    name: b.name,
    description: b.description,
    doCriterionMgL: b.do_criterion_mg_l,
    unitSystem: b.unit_system,
    minReviewDays: b.min_review_days,
    timeZone: b.time_zone,
    createdAt: b.created_at.toISOString(),
    updatedAt: b.updated_at.toISOString(),
    myRole,
    ...(memberCount === undefined ? {} : { memberCount }),
  };
}

export const basinListDto = (b: BasinWithRole) => basinDto(b, b.role, b.member_count);

export interface UserDto {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
  createdAt: string;
}

export function userDto(u: UserRow): UserDto {
  return { id: u.id, email: u.email, name: u.name, isAdmin: u.is_admin, createdAt: u.created_at.toISOString() };
}

export interface MemberDto {
  userId: string;
  email: string;
  name: string;
  role: BasinRole;
  since: string;
}

export function memberDto(m: MemberRow): MemberDto {
  return { userId: m.user_id, email: m.email, name: m.name, role: m.role, since: m.created_at.toISOString() };
}

export interface FacilityDto {
  id: string;
  name: string;
  permitId: string;
  users: { id: string; name: string; email: string }[];
}

export function facilityDto(f: FacilityWithUsers): FacilityDto {
  return { id: f.id, name: f.name, permitId: f.permit_id, users: f.users };
}
