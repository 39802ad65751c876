// Money as integer minor units: exact formatting, parsing what a coach types, and monthly totals.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { formatMoney, minorToDecimalString, minorUnitDigits, monthlyTotals, parseMoneyToMinor } from "@/lib/billing/money";
import { teamPricesSchema } from "@/lib/validation/billing";

describe("minor units", () => {
  it("knows each currency's decimals", () => {
    // ISO 4217 minor units: EUR, USD and GBP have 2, JPY has 0 (ISO 4217 table A.1).
    expect(minorUnitDigits("EUR")).toBe(2);
    expect(minorUnitDigits("GBP")).toBe(2);
    expect(minorUnitDigits("JPY")).toBe(0);
  });

  it("formats exactly, without binary rounding", () => {
    expect(formatMoney(4900, "EUR")).toBe("€49.00");
    expect(formatMoney(5, "GBP")).toBe("£0.05");
    expect(formatMoney(5000, "JPY")).toBe("JP¥5,000");
    // 0.1 + 0.2 style sums stay exact when kept in minor units.
    expect(formatMoney(10 + 20, "USD")).toBe("US$0.30");
    expect(formatMoney(99_999_999, "USD")).toBe("US$999,999.99");
    expect(minorToDecimalString(-1234, "EUR")).toBe("-12.34");
    expect(() => minorToDecimalString(1.5, "EUR")).toThrow(RangeError);
  });

  it("parses what a coach types into minor units, refusing more decimals than the currency has", () => {
    expect(parseMoneyToMinor("49", "EUR")).toBe(4900);
    expect(parseMoneyToMinor("49.5", "EUR")).toBe(4950);
    expect(parseMoneyToMinor(" 49,05 ", "EUR")).toBe(4905);
    expect(parseMoneyToMinor("49.555", "EUR")).toBeNull();
    expect(parseMoneyToMinor("5000", "JPY")).toBe(5000);
    expect(parseMoneyToMinor("50.5", "JPY")).toBeNull();
    for (const bad of ["", "-5", "1e3", "4 9", "€49", "abc"]) expect(parseMoneyToMinor(bad, "EUR")).toBeNull();
  });

  it("round-trips every amount through its decimal text", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 99_999_999 }), fc.constantFrom("EUR", "USD", "JPY", "SEK"), (amount, currency) => {
        expect(parseMoneyToMinor(minorToDecimalString(amount, currency), currency)).toBe(amount);
      }),
    );
  });
});

describe("the price form", () => {
  it("turns typed amounts into minor units and names each bad field", () => {
    expect(teamPricesSchema.parse({ currency: "EUR", membership: "49.00", singleReview: "" })).toEqual({
      membership: { amountMinor: 4900, currency: "EUR" },
      singleReview: null,
    });
    const bad = teamPricesSchema.safeParse({ currency: "EUR", membership: "0.50", singleReview: "12.345" });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues.map((i) => i.path.join(".")).sort()).toEqual(["membership", "singleReview"]);
    expect(teamPricesSchema.safeParse({ currency: "XXX", membership: "10" }).success).toBe(false);
  });
});

describe("monthly totals", () => {
  it("sums paid amounts per UTC month and currency, newest first, skipping unpaid ones", () => {
    const at = (iso: string) => new Date(iso);
    const totals = monthlyTotals([
      { amountMinor: 4900, currency: "EUR", status: "paid", paidAt: at("2026-03-01T00:30:00Z") },
      { amountMinor: 4900, currency: "EUR", status: "paid", paidAt: at("2026-03-31T23:59:59Z") },
      { amountMinor: 1500, currency: "EUR", status: "paid", paidAt: at("2026-02-28T23:59:59Z") },
      { amountMinor: 3000, currency: "USD", status: "paid", paidAt: at("2026-03-15T12:00:00Z") },
      { amountMinor: 4900, currency: "EUR", status: "failed", paidAt: null },
      { amountMinor: 4900, currency: "EUR", status: "open", paidAt: at("2026-03-10T00:00:00Z") },
    ]);
    expect(totals).toEqual([
      { month: "2026-03", currency: "EUR", amountMinor: 9800, count: 2 },
      { month: "2026-03", currency: "USD", amountMinor: 3000, count: 1 },
      { month: "2026-02", currency: "EUR", amountMinor: 1500, count: 1 },
    ]);
  });
});
