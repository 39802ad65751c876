// What the app needs to know about the signed-in person: account, team memberships and athlete profile.
import "server-only";
import type { Profile } from "@/lib/validation/profile";
import { getProfile } from "./profiles";
import { listMemberships, type MembershipSummary } from "./teams";
import type { Viewer } from "./viewer";

export interface Me {
  user: { id: string; name: string; email: string; role: "user" | "admin"; emailVerified: boolean };
  memberships: MembershipSummary[];
  profile: Profile | null;
}

export async function getMe(viewer: Viewer): Promise<Me> {
  const [memberships, profile] = await Promise.all([listMemberships(viewer.userId), getProfile(viewer.userId)]);
  return {
    user: { id: viewer.userId, name: viewer.name, email: viewer.email, role: viewer.role, emailVerified: viewer.emailVerified },
    memberships,
    profile,
  };
}
