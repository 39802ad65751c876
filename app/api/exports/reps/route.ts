// GET /api/exports/reps?set=<id> | ?athlete=<id>[&lift=…][&from=YYYY-MM-DD&to=YYYY-MM-DD] | ?from=…&to=…
// CSV of rep measures the viewer may read, in their display units (headers name the unit).
import { requireSession } from "@/lib/access";
import { parseOrThrow, withErrors } from "@/lib/errors";
import { exportFileName, repMeasuresCsv } from "@/lib/exports/rep-csv";
import { repExportQuerySchema } from "@/lib/validation/preferences";
import { listRepsForExport } from "@/db/queries/exports";
import { getPreferences } from "@/db/queries/preferences";

export const GET = withErrors(async (request: Request) => {
  const viewer = await requireSession(request);
  const query = parseOrThrow(repExportQuerySchema, Object.fromEntries(new URL(request.url).searchParams), "export");
  const [rows, units] = await Promise.all([listRepsForExport(viewer, query), getPreferences(viewer.userId)]);
  const name = exportFileName([
    "plumbline-reps",
    query.set ? `set-${query.set.slice(0, 8)}` : "",
    query.athlete && rows[0] ? rows[0].athleteName : "",
    query.lift ?? "",
    query.from ?? "",
    query.to ?? "",
  ]);
  return new Response(repMeasuresCsv(rows, units), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${name}"`,
      "cache-control": "private, no-store",
    },
  });
});
