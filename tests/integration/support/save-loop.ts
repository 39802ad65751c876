// A child process for the durability test: saves analyses of the given sets round-robin, as fast as it
// can, and prints `ack <setId> <index>` only after each save's transaction has committed. The test kills
// it with SIGKILL at a moment of its choosing. Run: node --conditions=react-server --import tsx <this file> <userId> <setId>…
import { saveAnalysis } from "@/db/queries/analyses";
import { analyseTrack } from "@/lib/analysis/analyse";
import { parseTrack } from "@/lib/analysis/track";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";

const [userId, ...setIds] = process.argv.slice(2);
const viewer = { userId, name: "", email: "", role: "admin" as const, emailVerified: true };
// Results of different sizes, so a torn save would show as a rep count that does not match its measures.
const results = [3, 5, 8].map((reps, seed) => {
  const { track } = generateSyntheticSet({ lift: "squat", seed: seed + 1, reps, view: "side" });
  return { calibration: track.calibration, result: analyseTrack(parseTrack(track), { includeFrames: true, loadKg: 140 }) };
});

for (let index = 0; ; index++) {
  const setId = setIds[index % setIds.length];
  const { calibration, result } = results[index % results.length];
  await saveAnalysis(viewer, setId, { model: `loop@${index}`, settings: {}, calibration, result, trackStorageKey: null });
  process.stdout.write(`ack ${setId} ${index}\n`);
}
