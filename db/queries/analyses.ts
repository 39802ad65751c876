// A set's analysis: saved in one transaction (analysis, reps with measures and flags, per-rep series,
// set measures) and read back whole. Re-analysis replaces the old one under a lock on the set row,
// so concurrent saves leave exactly one consistent analysis.
import "server-only";
import { and, asc, eq, getTableColumns, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { analyses, repSeries, reps, setMeasures, sets, type Analysis, type NewRep, type Rep, type SetMeasures } from "@/db/schema";
import type { AnalysisResult, RepResult } from "@/lib/analysis/result";
import { SERIES_POINTS } from "@/lib/analysis/result";
import { packBarFrames, unpackBarFrames, type BarFrame } from "@/lib/analysis/packed-frames";
import { ApiError } from "@/lib/errors";
import { canReadSet } from "./access";
import type { Viewer } from "./viewer";

export interface NewAnalysisInput {
  /** Pose model as `id@version`. */
  model: string;
  settings: Record<string, unknown>;
  calibration: Record<string, unknown>;
  result: AnalysisResult;
  trackStorageKey: string | null;
}

export interface SavedAnalysis {
  analysisId: string;
  /** Track objects of the analyses this one replaced, for the caller to delete after the commit. */
  replacedTrackKeys: string[];
}

/** The series stored per rep (the 0..100 % axis is implied by the 101 points). */
export const STORED_SERIES = ["barXM", "barYM", "barVelocityMps", "kneeAngleDeg", "hipAngleDeg", "torsoAngleDeg"] as const;
export type StoredSeriesName = (typeof STORED_SERIES)[number];

function repRow(analysisId: string, rep: RepResult): NewRep {
  return {
    analysisId,
    repIndex: rep.index,
    startS: rep.startS,
    endS: rep.endS,
    eccentricStartS: rep.eccentricStartS,
    eccentricEndS: rep.eccentricEndS,
    concentricStartS: rep.concentricStartS,
    concentricEndS: rep.concentricEndS,
    bottomS: rep.bottomS,
    romM: rep.romM,
    meanConcentricVelocityMps: rep.meanConcentricVelocityMps,
    peakConcentricVelocityMps: rep.peakConcentricVelocityMps,
    meanPropulsiveVelocityMps: rep.meanPropulsiveVelocityMps,
    propulsiveDurationS: rep.propulsiveDurationS,
    concentricDurationS: rep.concentricDurationS,
    eccentricDurationS: rep.eccentricDurationS,
    pauseDurationS: rep.pauseDurationS,
    stickingPointTimeS: rep.stickingPoint?.timeS ?? null,
    stickingPointHeightM: rep.stickingPoint?.heightM ?? null,
    stickingPointVelocityMps: rep.stickingPoint?.velocityMps ?? null,
    maxHorizontalDeviationCm: rep.maxHorizontalDeviationCm,
    netHorizontalDriftCm: rep.netHorizontalDriftCm,
    pathLengthM: rep.pathLengthM,
    benchPathShapeCm: rep.benchPathShapeCm,
    kneeAngleAtStartDeg: rep.kneeAngleAtStartDeg,
    kneeAngleAtBottomDeg: rep.kneeAngleAtBottomDeg,
    kneeAngleAtLockoutDeg: rep.kneeAngleAtLockoutDeg,
    hipAngleAtStartDeg: rep.hipAngleAtStartDeg,
    hipAngleAtBottomDeg: rep.hipAngleAtBottomDeg,
    hipAngleAtLockoutDeg: rep.hipAngleAtLockoutDeg,
    ankleAngleAtStartDeg: rep.ankleAngleAtStartDeg,
    ankleAngleAtBottomDeg: rep.ankleAngleAtBottomDeg,
    ankleAngleAtLockoutDeg: rep.ankleAngleAtLockoutDeg,
    torsoAngleAtStartDeg: rep.torsoAngleAtStartDeg,
    torsoAngleAtBottomDeg: rep.torsoAngleAtBottomDeg,
    torsoAngleAtLockoutDeg: rep.torsoAngleAtLockoutDeg,
    shinAngleAtStartDeg: rep.shinAngleAtStartDeg,
    shinAngleAtBottomDeg: rep.shinAngleAtBottomDeg,
    shinAngleAtLockoutDeg: rep.shinAngleAtLockoutDeg,
    hipRiseIndex: rep.hipRiseIndex,
    depthReached: rep.depthReached,
    depthMarginCm: rep.depthMarginCm,
    barOverMidFootOffsetCm: rep.barOverMidFootOffsetCm,
    barOverMidFootMethod: rep.barOverMidFootMethod,
    kneeProjectionAngleDeg: rep.kneeProjectionAngleDeg,
    kneeProjectionAngleLeftDeg: rep.kneeProjectionAngleLeftDeg,
    kneeProjectionAngleRightDeg: rep.kneeProjectionAngleRightDeg,
    stanceToShoulderWidthRatio: rep.stanceToShoulderWidthRatio,
    leftRightAsymmetry: rep.leftRightAsymmetry,
    barCoverage: rep.barCoverage,
    flags: rep.flags,
  };
}

function seriesRows(repId: string, rep: RepResult) {
  return STORED_SERIES.flatMap((name) => {
    const points = rep.series[name];
    return points ? [{ repId, name, points }] : [];
  });
}

function setMeasuresRow(analysisId: string, set: AnalysisResult["set"]) {
  const oneRepMax = set.estimatedOneRepMaxKg;
  // The velocity-based estimate is the headline figure; the rep-based formulas stay in the detail.
  const headline = oneRepMax?.fromVelocity ?? oneRepMax?.epley ?? null;
  return {
    analysisId,
    repCount: set.repCount,
    bestMeanVelocityMps: set.bestMeanVelocityMps,
    lastMeanVelocityMps: set.lastMeanVelocityMps,
    velocityLossPct: set.velocityLossPct,
    startPositionSpreadCm: set.startPositionSpreadCm,
    startTorsoAngleSpreadDeg: set.startTorsoAngleSpreadDeg,
    barPathConsistencyCm: set.barPathConsistencyCm,
    estimatedRepsInReserve: set.estimatedRepsInReserve?.reps ?? null,
    estimatedRepsInReserveSource: set.estimatedRepsInReserve?.source ?? null,
    estimatedPercentOneRepMax: set.estimatedPercentOneRepMax?.percent ?? null,
    estimatedPercentOneRepMaxSource: set.estimatedPercentOneRepMax?.source ?? null,
    estimatedOneRepMaxKg: headline?.valueKg ?? null,
    estimatedOneRepMaxKgSource: headline?.source ?? null,
    estimatedOneRepMaxDetail: oneRepMax,
    flags: set.flags,
  };
}

async function insertAnalysis(tx: Transaction, viewer: Viewer, setId: string, input: NewAnalysisInput): Promise<string> {
  const { result } = input;
  const [analysis] = await tx
    .insert(analyses)
    .values({
      setId,
      model: input.model,
      engineVersion: result.engineVersion,
      settings: { engine: result.settings, pipeline: input.settings },
      calibration: input.calibration,
      scaleMetresPerPixel: result.scale.metresPerPixel,
      scaleMethod: result.scale.method,
      scaleUncertaintyPct: result.scale.uncertaintyPct,
      scaleNote: result.scale.note,
      cautions: result.cautions,
      notes: result.notes,
      barFrames: result.frames ? packBarFrames(result.frames) : null,
      trackStorageKey: input.trackStorageKey,
      createdBy: viewer.userId,
    })
    .returning({ id: analyses.id });
  if (result.reps.length > 0) {
    const inserted = await tx
      .insert(reps)
      .values(result.reps.map((rep) => repRow(analysis.id, rep)))
      .returning({ id: reps.id, repIndex: reps.repIndex });
    const idOf = new Map(inserted.map((r) => [r.repIndex, r.id]));
    const series = result.reps.flatMap((rep) => seriesRows(idOf.get(rep.index) as string, rep));
    if (series.length > 0) await tx.insert(repSeries).values(series);
  }
  await tx.insert(setMeasures).values(setMeasuresRow(analysis.id, result.set));
  return analysis.id;
}

/** Saves an analysis as the set's only one, replacing any earlier one, all in one transaction. */
export async function saveAnalysis(viewer: Viewer, setId: string, input: NewAnalysisInput): Promise<SavedAnalysis> {
  return db.transaction(async (tx) => {
    // The row lock serialises saves of the same set: the later one replaces the earlier one whole.
    const [set] = await tx.select().from(sets).where(eq(sets.id, setId)).for("update");
    if (!set) throw new ApiError("not_found:set", "There is no such set.");
    if (!(await canReadSet(viewer, set))) throw new ApiError("forbidden:set", "You do not have access to this set.");
    if (set.clipStatus !== "uploaded" && set.clipStatus !== "ready") {
      throw new ApiError("conflict:analysis", "The set has no checked clip to analyse yet. Upload the clip first.");
    }
    return replaceAnalysis(tx, viewer, setId, input);
  });
}

/**
 * saveAnalysis's writes inside the caller's transaction, for a caller that has already locked and
 * checked the set (the demo seed, which writes its sets and their analyses together).
 */
export async function replaceAnalysis(tx: Transaction, viewer: Viewer, setId: string, input: NewAnalysisInput): Promise<SavedAnalysis> {
  const replaced = await tx.delete(analyses).where(eq(analyses.setId, setId)).returning({ trackStorageKey: analyses.trackStorageKey });
  const analysisId = await insertAnalysis(tx, viewer, setId, input);
  await tx.update(sets).set({ status: "analysed" }).where(eq(sets.id, setId));
  return { analysisId, replacedTrackKeys: replaced.flatMap((r) => (r.trackStorageKey ? [r.trackStorageKey] : [])) };
}

export type StoredRep = Omit<Rep, "analysisId" | "createdAt"> & { series: Partial<Record<StoredSeriesName, number[]>> };

export interface StoredAnalysis {
  id: string;
  setId: string;
  model: string;
  engineVersion: string;
  settings: Analysis["settings"];
  calibration: Analysis["calibration"];
  scale: { metresPerPixel: number; method: Analysis["scaleMethod"]; uncertaintyPct: number; note: string | null };
  cautions: string[];
  notes: string[];
  frames: BarFrame[] | null;
  createdAt: Date;
  createdBy: string | null;
  reps: StoredRep[];
  set: Omit<SetMeasures, "analysisId"> | null;
}

function withoutAnalysisId({ analysisId: _analysisId, ...rest }: SetMeasures): Omit<SetMeasures, "analysisId"> {
  return rest;
}

const { barFrames: _barFrames, ...measureColumns } = getTableColumns(analyses);

/**
 * The set's current analysis, or null when the set is not analysed yet. The per-frame bar positions are
 * most of its bytes: callers that only need the measures leave them out (`frames: false`).
 */
export async function getAnalysis(setId: string, options: { frames?: boolean } = {}): Promise<StoredAnalysis | null> {
  return (await getAnalysisWithTrackKey(setId, options))?.analysis ?? null;
}

/**
 * The current analysis and the key of its track object, in two round trips: the analysis row, then its
 * reps, series and measures at once (the series found through their reps' analysis id).
 */
export async function getAnalysisWithTrackKey(
  setId: string,
  { frames = true }: { frames?: boolean } = {},
): Promise<{ analysis: StoredAnalysis; trackStorageKey: string | null } | null> {
  const [analysis] = await db
    .select({ ...measureColumns, barFrames: frames ? analyses.barFrames : sql<null>`null` })
    .from(analyses)
    .where(and(eq(analyses.setId, setId), eq(analyses.isCurrent, true)));
  if (!analysis) return null;
  // One round trip for the rest: reps, their series (joined through the analysis id) and set measures.
  const [repRows, measureRows, seriesRowsFound] = await Promise.all([
    db.select().from(reps).where(eq(reps.analysisId, analysis.id)).orderBy(asc(reps.repIndex)),
    db.select().from(setMeasures).where(eq(setMeasures.analysisId, analysis.id)),
    db
      .select(getTableColumns(repSeries))
      .from(repSeries)
      .innerJoin(reps, eq(reps.id, repSeries.repId))
      .where(eq(reps.analysisId, analysis.id)),
  ]);
  const seriesByRep = new Map<string, Partial<Record<StoredSeriesName, number[]>>>();
  for (const row of seriesRowsFound) {
    if (row.points.length !== SERIES_POINTS) continue;
    const bucket = seriesByRep.get(row.repId) ?? {};
    bucket[row.name as StoredSeriesName] = row.points;
    seriesByRep.set(row.repId, bucket);
  }
  const stored: StoredAnalysis = {
    id: analysis.id,
    setId: analysis.setId,
    model: analysis.model,
    engineVersion: analysis.engineVersion,
    settings: analysis.settings,
    calibration: analysis.calibration,
    scale: {
      metresPerPixel: analysis.scaleMetresPerPixel,
      method: analysis.scaleMethod,
      uncertaintyPct: analysis.scaleUncertaintyPct,
      note: analysis.scaleNote,
    },
    cautions: analysis.cautions,
    notes: analysis.notes,
    frames: analysis.barFrames ? unpackBarFrames(analysis.barFrames) : null,
    createdAt: analysis.createdAt,
    createdBy: analysis.createdBy,
    reps: repRows.map(({ analysisId: _a, createdAt: _c, ...rep }) => ({ ...rep, series: seriesByRep.get(rep.id) ?? {} })),
    set: measureRows[0] ? withoutAnalysisId(measureRows[0]) : null,
  };
  return { analysis: stored, trackStorageKey: analysis.trackStorageKey };
}

