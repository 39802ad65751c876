// /app sends each person to their start page: coaches to the review desk, athletes home, newcomers to name a team.
import { redirect } from "next/navigation";
import { requireServerViewer } from "@/lib/access";
import { listMemberships } from "@/db/queries/teams";

export default async function AppIndexPage() {
  const viewer = await requireServerViewer();
  const roles = new Set((await listMemberships(viewer.userId)).map((m) => m.role));
  if (roles.has("coach")) redirect("/app/desk");
  if (roles.has("athlete")) redirect("/app/home");
  redirect("/app/team/new");
}
