// Groups sets by load for "bar speed at a given load over time": loads within one plate step of each other
// (2.5 kg or 5 lb, common practice for loading increments) count as the same load.
import { displayMass, type DisplayUnits } from "@/lib/compare/units";

export interface LoadGroup<P> {
  /** Display value of the group's load, in the viewer's mass unit. */
  load: number;
  points: P[];
}

export function loadStep(units: DisplayUnits): number {
  return units.mass === "kg" ? 2.5 : 5;
}

/** The `maxGroups` loads with the most sets, lightest first; each group's points keep their order. */
export function groupByLoad<P extends { loadKg: number }>(points: readonly P[], units: DisplayUnits, maxGroups: number): LoadGroup<P>[] {
  const step = loadStep(units);
  const groups = new Map<number, P[]>();
  for (const p of points) {
    const load = Math.round(displayMass(p.loadKg, units) / step) * step;
    groups.set(load, [...(groups.get(load) ?? []), p]);
  }
  return [...groups.entries()]
    .sort((a, b) => b[1].length - a[1].length || b[0] - a[0])
    .slice(0, maxGroups)
    .sort((a, b) => a[0] - b[0])
    .map(([load, grouped]) => ({ load, points: grouped }));
}

/** A step of the speed ramp (1..8) per group: heavier loads darker, spread over the ramp's upper part. */
export function rampStep(index: number, count: number): number {
  if (count <= 1) return 6;
  return Math.round(3 + (5 * index) / (count - 1));
}
