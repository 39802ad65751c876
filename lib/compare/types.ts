// What the compare page hands its client components: plain, serialisable data per compared rep.
import type { RepMeasures } from "./differences";
import type { ComparePhase, StickFigure } from "./stick-figure";
import type { RepEvents } from "./sync";

/** The stored series (STORED_SERIES in db/queries/analyses.ts, a server-only module the browser cannot import). */
export const SERIES_NAMES = ["barXM", "barYM", "barVelocityMps", "kneeAngleDeg", "hipAngleDeg", "torsoAngleDeg"] as const;
export type SeriesName = (typeof SERIES_NAMES)[number];

export interface CompareRepView {
  repId: string;
  setId: string;
  /** e.g. "Rep 1 · 3 Nov 2026 · 140 kg". */
  label: string;
  /** e.g. "Rep 1", or "Rep 1 (3 Nov)" when the reps come from several sets. */
  shortLabel: string;
  events: RepEvents;
  videoUrl: string | null;
  figures: Record<ComparePhase, StickFigure | null> | null;
  series: Partial<Record<SeriesName, number[]>>;
  measures: RepMeasures;
}
