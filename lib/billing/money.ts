// Money as integer minor units (cents) with an ISO 4217 code: formatting for display and parsing what a
// coach types, both without floating point.

/** Digits after the decimal point for the currency (2 for EUR, 0 for JPY), as the platform's ICU data gives them. */
export function minorUnitDigits(currency: string): number {
  return new Intl.NumberFormat("en", { style: "currency", currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

/** The amount as an exact decimal string ("4900" EUR -> "49.00"). */
export function minorToDecimalString(amountMinor: number, currency: string): string {
  if (!Number.isSafeInteger(amountMinor)) throw new RangeError("amountMinor must be a whole number");
  const digits = minorUnitDigits(currency);
  const sign = amountMinor < 0 ? "-" : "";
  const text = Math.abs(amountMinor).toString().padStart(digits + 1, "0");
  return digits === 0 ? `${sign}${text}` : `${sign}${text.slice(0, -digits)}.${text.slice(-digits)}`;
}

/** "€49.00" for (4900, "EUR"); Intl formats the exact decimal string, so no binary rounding is involved. */
export function formatMoney(amountMinor: number, currency: string, locale = "en-GB"): string {
  const format = new Intl.NumberFormat(locale, { style: "currency", currency }).format as (value: string) => string;
  return format(minorToDecimalString(amountMinor, currency));
}

/** "49", "49.5", "49.00" -> minor units; null when it is not a plain positive amount in that currency's precision. */
export function parseMoneyToMinor(input: string, currency: string): number | null {
  const digits = minorUnitDigits(currency);
  const match = /^(\d{1,9})(?:[.,](\d+))?$/.exec(input.trim());
  if (!match) return null;
  const fraction = match[2] ?? "";
  if (fraction.length > digits) return null;
  const minor = Number(match[1]) * 10 ** digits + Number(fraction.padEnd(digits, "0") || "0");
  return Number.isSafeInteger(minor) ? minor : null;
}

export interface PaidAmount {
  amountMinor: number;
  currency: string;
  paidAt: Date | null;
  status: string;
}

export interface MonthTotal {
  /** "2026-03" (UTC). */
  month: string;
  currency: string;
  amountMinor: number;
  count: number;
}

/** Paid amounts summed per calendar month (UTC) and currency, newest month first. */
export function monthlyTotals(rows: PaidAmount[]): MonthTotal[] {
  const totals = new Map<string, MonthTotal>();
  for (const row of rows) {
    if (row.status !== "paid" || !row.paidAt) continue;
    const month = row.paidAt.toISOString().slice(0, 7);
    const key = `${month} ${row.currency}`;
    const total = totals.get(key) ?? { month, currency: row.currency, amountMinor: 0, count: 0 };
    total.amountMinor += row.amountMinor;
    total.count += 1;
    totals.set(key, total);
  }
  return [...totals.values()].sort((a, b) => b.month.localeCompare(a.month) || a.currency.localeCompare(b.currency));
}
