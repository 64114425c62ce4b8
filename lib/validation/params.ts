import { z } from "zod";

const id = (name: string) => z.uuid(`${name} is not a valid id`);

export const basinParams = z.object({ basinId: id("basinId") });
export const memberParams = basinParams.extend({ userId: id("userId") });
export const facilityParams = basinParams.extend({ facilityId: id("facilityId") });
export const facilityUserParams = facilityParams.extend({ userId: id("userId") });
