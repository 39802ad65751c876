// The payment fake reads request bodies the way the provider's API does: form-encoded with bracketed keys,
// as the official SDK sends them (`line_items[0][price]=…`, `metadata[teamId]=…`).
import { describe, expect, it } from "vitest";
import { parseForm } from "@/dev/fakes/stripe-fake";

describe("parseForm", () => {
  it("nests bracketed keys into objects and arrays", () => {
    const body = new URLSearchParams([
      ["mode", "subscription"],
      ["line_items[0][price]", "price_123"],
      ["line_items[0][quantity]", "1"],
      ["metadata[athleteId]", "a1"],
      ["metadata[teamId]", "t1"],
      ["subscription_data[metadata][teamId]", "t1"],
      ["expand[]", "subscription"],
    ]).toString();
    expect(parseForm(body)).toEqual({
      mode: "subscription",
      line_items: [{ price: "price_123", quantity: "1" }],
      metadata: { athleteId: "a1", teamId: "t1" },
      subscription_data: { metadata: { teamId: "t1" } },
      expand: ["subscription"],
    });
  });

  it("keeps plain values and an empty body", () => {
    expect(parseForm("")).toEqual({});
    expect(parseForm("unit_amount=4900&currency=eur")).toEqual({ unit_amount: "4900", currency: "eur" });
  });
});
