// Display units for forms and read-outs. Everything is stored in SI; these convert only for showing and typing.
import { KG_PER_LB, type UnitPreference } from "@/lib/validation/common";

/** Metres per inch, exact by definition (International Yard and Pound Agreement, 1959). */
export const M_PER_IN = 0.0254;

export function massFromKg(kg: number, unit: UnitPreference): number {
  return unit === "kg" ? kg : kg / KG_PER_LB;
}

export function massToKg(value: number, unit: UnitPreference): number {
  return unit === "kg" ? value : value * KG_PER_LB;
}

/** Height is typed in centimetres by kg users and in inches by lb users. */
export function heightUnit(unit: UnitPreference): "cm" | "in" {
  return unit === "kg" ? "cm" : "in";
}

export function heightFromM(m: number, unit: UnitPreference): number {
  return unit === "kg" ? m * 100 : m / M_PER_IN;
}

export function heightToM(value: number, unit: UnitPreference): number {
  return unit === "kg" ? value / 100 : value * M_PER_IN;
}

/** Parses what a person types into a number field: blank is null, a decimal comma is accepted, junk is NaN. */
export function parseDecimal(text: string): number | null {
  const trimmed = text.trim();
  if (trimmed === "") return null;
  if (!/^[+-]?(\d+([.,]\d*)?|[.,]\d+)$/.test(trimmed)) return Number.NaN;
  return Number(trimmed.replace(",", "."));
}

/** A number for an input's value: at most `digits` decimals, no trailing zeros. */
export function formatForInput(value: number | null | undefined, digits: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "";
  return String(Number(value.toFixed(digits)));
}
