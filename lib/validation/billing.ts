// Request schemas for prices, checkout, the customer portal and comping. Amounts arrive as the decimal text a
// coach typed ("49.00") and leave as integer minor units, never through floating point.
import { z } from "zod";
import { CURRENCIES, PRICE_KINDS } from "@/lib/billing/constants";
import { minorToDecimalString, minorUnitDigits, parseMoneyToMinor } from "@/lib/billing/money";
import { uuidSchema } from "./common";

export interface PriceInput {
  amountMinor: number;
  currency: string;
}

/** The provider's largest single charge is 8 digits of minor units (Stripe docs, "minimum and maximum charge amounts"). */
export const MAX_AMOUNT_MINOR = 99_999_999;

const amountText = z
  .string()
  .trim()
  .max(16, { error: "Enter an amount such as 49.00." })
  .nullish()
  .transform((v) => (v ? v : null));

export const teamPricesSchema = z
  .object({
    currency: z.enum(CURRENCIES, { error: "Choose a currency from the list." }),
    membership: amountText,
    singleReview: amountText,
  })
  .transform((input, ctx) => {
    const parse = (field: "membership" | "singleReview"): PriceInput | null => {
      const text = input[field];
      if (text === null) return null;
      const amountMinor = parseMoneyToMinor(text, input.currency);
      const digits = minorUnitDigits(input.currency);
      // At least one whole unit of the currency: smaller charges cost more in fees than they bring (common practice).
      const minimum = 10 ** digits;
      if (amountMinor === null) {
        ctx.addIssue({ code: "custom", path: [field], message: digits === 0 ? "Enter a whole amount such as 5000." : `Enter an amount such as 49.00 (at most ${digits} decimals).` });
        return null;
      }
      if (amountMinor < minimum || amountMinor > MAX_AMOUNT_MINOR) {
        ctx.addIssue({
          code: "custom",
          path: [field],
          message: `Enter between ${minorToDecimalString(minimum, input.currency)} and ${minorToDecimalString(MAX_AMOUNT_MINOR, input.currency)}.`,
        });
        return null;
      }
      return { amountMinor, currency: input.currency };
    };
    const membership = parse("membership");
    const singleReview = parse("singleReview");
    return { membership, singleReview };
  });
export type TeamPricesInput = z.output<typeof teamPricesSchema>;

export const checkoutSchema = z.object({
  teamId: uuidSchema,
  kind: z.enum(PRICE_KINDS, { error: "Choose membership or single_review." }).default("membership"),
});

export const portalSchema = z.object({ teamId: uuidSchema });

export const compSchema = z.object({ comped: z.boolean({ error: "Say true or false." }) });

export const invoiceQuerySchema = z.object({ teamId: uuidSchema.optional() });
