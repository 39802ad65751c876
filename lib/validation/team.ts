// Request schemas for teams and their members.
import { z } from "zod";

export const createTeamSchema = z.object({
  name: z
    .string({ error: "A team name is required." })
    .trim()
    .min(2, { error: "Use at least 2 characters." })
    .max(80, { error: "Use at most 80 characters." }),
});
export type CreateTeamInput = z.infer<typeof createTeamSchema>;
