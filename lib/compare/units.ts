// Display units for compare, trends and exports: mass in kg or lb, lengths metric or imperial.
// Stored values stay SI; these turn them into what a viewer reads and back for typed thresholds.
import { KG_PER_LB } from "@/lib/validation/common";
import { M_PER_IN } from "@/lib/client/units";
import type { MeasureKind } from "./differences";

export type MassUnit = "kg" | "lb";
export type LengthUnit = "metric" | "imperial";

export interface DisplayUnits {
  mass: MassUnit;
  length: LengthUnit;
}

export function massLabel(units: DisplayUnits): string {
  return units.mass;
}

export function displayMass(kg: number, units: DisplayUnits): number {
  return units.mass === "kg" ? kg : kg / KG_PER_LB;
}

/** Small lengths (drift, depth) read in cm or in; ranges of motion and bar height in cm or in too. */
export function smallLengthLabel(units: DisplayUnits): "cm" | "in" {
  return units.length === "metric" ? "cm" : "in";
}

export function displayCm(cm: number, units: DisplayUnits): number {
  return units.length === "metric" ? cm : cm / (M_PER_IN * 100);
}

/** Unit label and factor from the stored unit of a measure kind to what the viewer reads. */
export function kindDisplay(kind: MeasureKind, units: DisplayUnits): { unit: string; factor: number; digits: number } {
  const inch = M_PER_IN * 100;
  switch (kind) {
    case "velocity":
      return { unit: "m/s", factor: 1, digits: 2 };
    case "angle":
      return { unit: "°", factor: 1, digits: 0 };
    case "duration":
      return { unit: "s", factor: 1, digits: 2 };
    case "lengthCm":
      return units.length === "metric" ? { unit: "cm", factor: 1, digits: 1 } : { unit: "in", factor: 1 / inch, digits: 1 };
    case "lengthM":
      return units.length === "metric" ? { unit: "cm", factor: 100, digits: 1 } : { unit: "in", factor: 100 / inch, digits: 1 };
  }
}
