// Per-user display preferences (every user, coaches included): mass in kg or lb, lengths metric or
// imperial. Only the display changes; measures stay stored in SI units.
import { relations } from "drizzle-orm";
import { pgEnum, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { user } from "./schema";
import { LENGTH_UNITS, MASS_UNITS } from "../lib/validation/preferences";

export const massUnitEnum = pgEnum("mass_unit", MASS_UNITS);
export const lengthUnitEnum = pgEnum("length_unit", LENGTH_UNITS);

export const userPreferences = pgTable("user_preferences", {
  userId: text("user_id")
    .primaryKey()
    .references(() => user.id, { onDelete: "cascade" }),
  massUnit: massUnitEnum("mass_unit").notNull(),
  lengthUnit: lengthUnitEnum("length_unit").notNull(),
  updatedAt: timestamp("updated_at", { withTimezone: true })
    .defaultNow()
    .$onUpdate(() => new Date())
    .notNull(),
});

export const userPreferenceRelations = relations(userPreferences, ({ one }) => ({
  user: one(user, { fields: [userPreferences.userId], references: [user.id] }),
}));

export type UserPreferences = typeof userPreferences.$inferSelect;
export type NewUserPreferences = typeof userPreferences.$inferInsert;
