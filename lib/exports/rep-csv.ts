// CSV of rep measures: one header row whose names carry their units (`mean_concentric_velocity_mps`,
// `load_lb`), then one row per rep. Mass and lengths follow the viewer's display units; speeds, angles
// and times stay SI. csv-stringify does the quoting (RFC 4180: quotes around fields with commas,
// quotes or line breaks, inner quotes doubled).
import { stringify } from "csv-stringify/sync";
import { displayCm, displayMass, type DisplayUnits } from "@/lib/compare/units";
import type { Lift } from "@/lib/validation/common";

export interface CsvRep {
  athleteName: string;
  teamName: string | null;
  sessionDate: string;
  recordedAt: Date;
  setId: string;
  lift: Lift;
  variant: string | null;
  loadKg: number;
  rpe: number | null;
  flagCodes: string[];
  rep: {
    repIndex: number;
    romM: number | null;
    meanConcentricVelocityMps: number | null;
    peakConcentricVelocityMps: number | null;
    meanPropulsiveVelocityMps: number | null;
    concentricDurationS: number | null;
    eccentricDurationS: number | null;
    pauseDurationS: number | null;
    stickingPointHeightM: number | null;
    maxHorizontalDeviationCm: number | null;
    netHorizontalDriftCm: number | null;
    pathLengthM: number | null;
    kneeAngleAtBottomDeg: number | null;
    hipAngleAtBottomDeg: number | null;
    torsoAngleAtStartDeg: number | null;
    torsoAngleAtBottomDeg: number | null;
    depthMarginCm: number | null;
    depthReached: boolean | null;
    barOverMidFootOffsetCm: number | null;
    kneeProjectionAngleDeg: number | null;
  };
}

type Cell = string | number | null;
interface Column {
  header: (units: DisplayUnits) => string;
  value: (row: CsvRep, units: DisplayUnits) => Cell;
}

const len = (units: DisplayUnits) => (units.length === "metric" ? "cm" : "in");
const cm = (value: number | null, units: DisplayUnits) => (value === null ? null : round(displayCm(value, units), 2));
const mToLen = (value: number | null, units: DisplayUnits) => (value === null ? null : round(displayCm(value * 100, units), 2));
const fixed = (headerText: string, digits: number, pick: (r: CsvRep["rep"]) => number | null): Column => ({
  header: () => headerText,
  value: (row) => {
    const v = pick(row.rep);
    return v === null ? null : round(v, digits);
  },
});

function round(value: number, digits: number): number {
  return Number(value.toFixed(digits));
}

const COLUMNS: Column[] = [
  { header: () => "athlete", value: (r) => r.athleteName },
  { header: () => "team", value: (r) => r.teamName },
  { header: () => "session_date", value: (r) => r.sessionDate },
  { header: () => "recorded_at_utc", value: (r) => r.recordedAt.toISOString() },
  { header: () => "set_id", value: (r) => r.setId },
  { header: () => "lift", value: (r) => r.lift },
  { header: () => "variant", value: (r) => r.variant },
  { header: (u) => `load_${u.mass}`, value: (r, u) => round(displayMass(r.loadKg, u), 2) },
  { header: () => "rpe", value: (r) => r.rpe },
  { header: () => "rep", value: (r) => r.rep.repIndex },
  { header: (u) => `range_of_motion_${len(u)}`, value: (r, u) => mToLen(r.rep.romM, u) },
  fixed("mean_concentric_velocity_mps", 3, (r) => r.meanConcentricVelocityMps),
  fixed("peak_concentric_velocity_mps", 3, (r) => r.peakConcentricVelocityMps),
  fixed("mean_propulsive_velocity_mps", 3, (r) => r.meanPropulsiveVelocityMps),
  fixed("concentric_duration_s", 3, (r) => r.concentricDurationS),
  fixed("eccentric_duration_s", 3, (r) => r.eccentricDurationS),
  fixed("pause_duration_s", 3, (r) => r.pauseDurationS),
  { header: (u) => `sticking_point_height_${len(u)}`, value: (r, u) => mToLen(r.rep.stickingPointHeightM, u) },
  { header: (u) => `max_horizontal_deviation_${len(u)}`, value: (r, u) => cm(r.rep.maxHorizontalDeviationCm, u) },
  { header: (u) => `net_horizontal_drift_${len(u)}`, value: (r, u) => cm(r.rep.netHorizontalDriftCm, u) },
  { header: (u) => `bar_path_length_${len(u)}`, value: (r, u) => mToLen(r.rep.pathLengthM, u) },
  fixed("knee_angle_at_bottom_deg", 1, (r) => r.kneeAngleAtBottomDeg),
  fixed("hip_angle_at_bottom_deg", 1, (r) => r.hipAngleAtBottomDeg),
  fixed("torso_angle_at_start_deg", 1, (r) => r.torsoAngleAtStartDeg),
  fixed("torso_angle_at_bottom_deg", 1, (r) => r.torsoAngleAtBottomDeg),
  { header: (u) => `depth_margin_${len(u)}`, value: (r, u) => cm(r.rep.depthMarginCm, u) },
  { header: () => "depth_reached", value: (r) => (r.rep.depthReached === null ? null : r.rep.depthReached ? "yes" : "no") },
  { header: (u) => `bar_over_mid_foot_offset_${len(u)}`, value: (r, u) => cm(r.rep.barOverMidFootOffsetCm, u) },
  fixed("knee_projection_angle_deg", 1, (r) => r.kneeProjectionAngleDeg),
  { header: () => "flags", value: (r) => r.flagCodes.join(" ") },
];

export function repMeasuresHeader(units: DisplayUnits): string[] {
  return COLUMNS.map((c) => c.header(units));
}

/** The whole file; missing measures are empty fields. */
export function repMeasuresCsv(rows: readonly CsvRep[], units: DisplayUnits): string {
  return stringify(
    rows.map((row) => COLUMNS.map((c) => c.value(row, units))),
    { header: true, columns: repMeasuresHeader(units), record_delimiter: "windows" },
  );
}

/** A file name safe in a Content-Disposition header: letters, digits, dot, dash and underscore only. */
export function exportFileName(parts: readonly string[]): string {
  const stem = parts
    .map((p) => p.normalize("NFKD").replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, ""))
    .filter(Boolean)
    .join("_");
  return `${stem || "reps"}.csv`;
}
