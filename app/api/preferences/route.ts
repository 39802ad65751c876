// GET/PUT /api/preferences: the signed-in person's display units (kg or lb, metric or imperial lengths).
import { requireSession } from "@/lib/access";
import { parseOrThrow, readJson, withErrors } from "@/lib/errors";
import { preferencesSchema } from "@/lib/validation/preferences";
import { getPreferences, savePreferences } from "@/db/queries/preferences";

export const GET = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  return Response.json({ preferences: await getPreferences(viewer.userId) });
});

export const PUT = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  const data = parseOrThrow(preferencesSchema, await readJson(request, "preferences"), "preferences");
  return Response.json({ preferences: await savePreferences(viewer.userId, data) });
});
