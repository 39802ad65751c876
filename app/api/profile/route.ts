// GET/PUT /api/profile: the signed-in person's athlete profile (SI units; the form converts pounds first).
import { requireSession } from "@/lib/access";
import { parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { profileInputSchema } from "@/lib/validation/profile";
import { getProfile, saveProfile } from "@/db/queries/profiles";

export const GET = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  return Response.json({ profile: await getProfile(viewer.userId) });
});

export const PUT = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  const data = parseOrThrow(profileInputSchema, await readJson(request, "profile"), "profile");
  return Response.json({ profile: await saveProfile(viewer.userId, data) });
});
