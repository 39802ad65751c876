// Request schemas for teams and their members.
import { z } from "zod";

export const createTeamSchema = z.object({
  name: z
    .string({ error: "A team name is required." })
    .trim()
    .min(2, { error: "Use at least 2 characters." })
    .max(80, { error: "Use at most 80 characters." })
    // Zero-width and direction marks are kept as typed, but a name made only of them would be invisible.
    .regex(/[\p{L}\p{N}]/u, { error: "Use at least one letter or digit." }),
});
export type CreateTeamInput = z.infer<typeof createTeamSchema>;
