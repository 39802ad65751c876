// Files an analysed squat set for the first demo athlete (real engine result of a synthetic track, saved
// through saveAnalysis) and prints `{ setId, repIds }`. Run with the react-server condition and DATABASE_URL
// pointing at the browser tests' database.
import { closeDb } from "@/db";
import { DEMO_ATHLETES, DEMO_TEAM_ID } from "@/dev/demo/seed";
import { createAnalysedSet, viewerFor } from "@/tests/fixtures/analysed-set";

const athlete = viewerFor(DEMO_ATHLETES[0]);
const made = await createAnalysedSet(athlete, { teamId: DEMO_TEAM_ID, loadKg: 160, seed: 21, reps: 4 });
await closeDb();
process.stdout.write(JSON.stringify({ setId: made.setId, repIds: made.repIds }));
