// Turns the compare query's rows into what the page shows: labels, phase events, stick figures read from
// each analysis's stored track, and the measures of the difference table. Server-only (reads storage).
import "server-only";
import type { CompareRep } from "@/db/queries/compare";
import { parseTrack, type Track } from "@/lib/analysis/track";
import { getJson } from "@/lib/clips/storage";
import { clipView } from "@/lib/clips/view";
import { formatDay } from "@/components/ui/date-text";
import { formatNumber } from "@/components/ui/measure";
import type { CompareRepView } from "./types";
import { COMPARE_MEASURES, type RepMeasures } from "./differences";
import { COMPARE_PHASES, stickFigureAt } from "./stick-figure";
import { displayMass, type DisplayUnits } from "./units";

async function readTrack(key: string | null): Promise<Track | null> {
  if (!key) return null;
  try {
    return parseTrack(await getJson(key));
  } catch {
    // A missing or unreadable track only costs the stick figures; the rest of compare still works.
    return null;
  }
}

async function clipUrl(set: CompareRep["set"]): Promise<string | null> {
  // Only the read URLs are needed: the clip's other facts stay out of the compare query.
  const clip = await clipView({
    setId: set.id,
    status: set.clipStatus,
    storageKey: set.clipStorageKey,
    convertedKey: set.clipConvertedKey,
    uploadId: null,
    sizeBytes: null,
    container: null,
    codec: null,
    durationS: null,
    widthPx: set.clipWidthPx,
    heightPx: set.clipHeightPx,
    error: null,
  });
  return clip.convertedUrl ?? clip.url;
}

export async function compareViews(rows: readonly CompareRep[], units: DisplayUnits): Promise<CompareRepView[]> {
  const analysisIds = [...new Set(rows.map((r) => r.analysis.id))];
  const tracks = new Map(
    await Promise.all(
      analysisIds.map(async (id) => [id, await readTrack(rows.find((r) => r.analysis.id === id)?.analysis.trackStorageKey ?? null)] as const),
    ),
  );
  const setIds = [...new Set(rows.map((r) => r.set.id))];
  const urls = new Map(await Promise.all(setIds.map(async (id) => [id, await clipUrl(rows.find((r) => r.set.id === id)!.set)] as const)));
  const manySets = setIds.length > 1;
  return rows.map(({ rep, set, analysis, series }) => {
    const events = { startS: rep.startS, bottomS: rep.bottomS, lockoutS: rep.concentricEndS ?? rep.endS };
    const track = tracks.get(analysis.id) ?? null;
    const timeOf = { start: events.startS, bottom: events.bottomS ?? events.startS, lockout: events.lockoutS };
    const figures = track
      ? (Object.fromEntries(COMPARE_PHASES.map((p) => [p, stickFigureAt(track, timeOf[p], analysis.metresPerPixel)])) as CompareRepView["figures"])
      : null;
    const day = formatDay(set.sessionDate);
    const load = `${formatNumber(displayMass(set.loadKg, units), 1)} ${units.mass}`;
    return {
      repId: rep.id,
      setId: set.id,
      label: `Rep ${rep.repIndex} · ${day} · ${load}${set.variant ? ` · ${set.variant}` : ""}`,
      shortLabel: manySets ? `Rep ${rep.repIndex} (${day}, ${load})` : `Rep ${rep.repIndex}`,
      events,
      videoUrl: urls.get(set.id) ?? null,
      figures,
      series,
      measures: Object.fromEntries(COMPARE_MEASURES.map((m) => [m.key, rep[m.key]])) as RepMeasures,
    };
  });
}
