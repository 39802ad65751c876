// Billing vocabulary shared by the schema, the validation and the pages.
export const PRICE_KINDS = ["membership", "single_review"] as const;
export type PriceKind = (typeof PRICE_KINDS)[number];

/**
 * active: paying; past_due: the last renewal failed; lapsing: cancelled, runs to the period end; lapsed: ended;
 * comped: the coach waived payment; none: never paid.
 */
export const BILLING_STATUSES = ["active", "past_due", "lapsing", "lapsed", "comped", "none"] as const;
export type BillingStatus = (typeof BILLING_STATUSES)[number];

export const PAYMENT_STATUSES = ["paid", "open", "failed", "void"] as const;
export type PaymentStatus = (typeof PAYMENT_STATUSES)[number];

/** Currencies a coach may price in (ISO 4217). */
export const CURRENCIES = ["EUR", "USD", "GBP", "AUD", "CAD", "NZD", "SEK", "NOK", "DKK", "CHF", "JPY"] as const;
export type Currency = (typeof CURRENCIES)[number];
