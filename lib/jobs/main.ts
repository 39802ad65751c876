// Entry point of the job runner process: `node --conditions=react-server --import tsx lib/jobs/main.ts`
// (the react-server condition lets it load the server-only query modules). Reads DATABASE_URL and S3_*.
import { databaseUrl } from "@/scripts/database-url";
import { startJobRunner } from "./runner";

const runner = await startJobRunner(databaseUrl());
console.log("[jobs] runner started");

const stop = async () => {
  await runner.stop();
  process.exit(0);
};
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
