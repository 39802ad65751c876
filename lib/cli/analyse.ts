// Command line for the analysis engine: `npm run analyse -- <track.json> [--frames] [--load-kg <kg>]`
// reads a track file (format v1), runs the analysis and prints the result as one JSON document.
import { readFile, realpath } from "node:fs/promises";
import { pathToFileURL } from "node:url";
import { parseArgs } from "node:util";
import { AnalysisOptionsError, analyseParsedTrack } from "@/lib/analysis/analyse";
import { parseTrack, TrackInputError } from "@/lib/analysis/track";
import {
  parseVideoModeArgs,
  runVideoCommand,
  VIDEO_MODE_ARG_OPTIONS,
  VIDEO_MODE_USAGE,
  VideoModeInputError,
  type VideoModeArgs,
} from "./video-mode";

export const USAGE = [
  "usage: npm run analyse -- <track.json> [options]",
  "",
  "  --frames          include the smoothed bar position per sample (image pixels)",
  "  --load-kg <kg>    load on the bar, for the 1RM estimates",
  "  --compact         print the JSON on one line",
  "  -h, --help        show this help",
  VIDEO_MODE_USAGE,
].join("\n");

export type CliCommand =
  | { mode: "help" }
  | { mode: "track"; trackPath: string; includeFrames: boolean; loadKg?: number; compact: boolean }
  | { mode: "video"; video: VideoModeArgs; compact: boolean };

/** Wrong command-line usage (exit code 2). */
export class CliUsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "CliUsageError";
  }
}

const OPTIONS = {
  frames: { type: "boolean", default: false },
  "load-kg": { type: "string" },
  compact: { type: "boolean", default: false },
  help: { type: "boolean", short: "h", default: false },
  ...VIDEO_MODE_ARG_OPTIONS,
} as const;

/** Parses the arguments after the script name; new modes (e.g. a video input) add options here. */
export function parseCliArgs(argv: string[]): CliCommand {
  let parsed;
  try {
    parsed = parseArgs({ args: argv, options: OPTIONS, allowPositionals: true, strict: true });
  } catch (error) {
    throw new CliUsageError((error as Error).message);
  }
  const { values, positionals } = parsed;
  if (values.help) return { mode: "help" };
  if (values.video !== undefined) {
    if (positionals.length > 0) throw new CliUsageError("give either a track file or --video, not both");
    return { mode: "video", video: parseVideoModeArgs(values), compact: values.compact };
  }
  if (positionals.length !== 1) {
    throw new CliUsageError(positionals.length === 0 ? "missing the track file to analyse" : `expected one track file, got ${positionals.length}`);
  }
  const loadText = values["load-kg"];
  const loadKg = loadText === undefined ? undefined : Number(loadText);
  if (loadKg !== undefined && !(loadKg > 0 && Number.isFinite(loadKg))) {
    throw new CliUsageError(`--load-kg: expected a load in kilograms above 0, got "${loadText}"`);
  }
  return { mode: "track", trackPath: positionals[0], includeFrames: values.frames, loadKg, compact: values.compact };
}

/** A file that cannot be read (exit code 1). */
export class CliFileError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "CliFileError";
  }
}

export interface CliIo {
  out: (text: string) => void;
  err: (text: string) => void;
}

const processIo: CliIo = {
  out: (text) => process.stdout.write(text),
  err: (text) => process.stderr.write(text),
};

async function readTrackFile(path: string): Promise<string> {
  try {
    return await readFile(path, "utf8");
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const reason = code === "ENOENT" ? "no such file" : code === "EISDIR" ? "it is a directory" : (error as Error).message;
    throw new CliFileError(`cannot read track file "${path}": ${reason}`);
  }
}

/** Runs the command; returns the process exit code (0 ok, 1 bad input file, 2 wrong usage). */
export async function runCli(argv: string[], io: CliIo = processIo): Promise<number> {
  try {
    const command = parseCliArgs(argv);
    if (command.mode === "help") {
      io.out(`${USAGE}\n`);
      return 0;
    }
    if (command.mode === "video") return await runVideoCommand(command.video, io, command.compact);
    const track = parseTrack(await readTrackFile(command.trackPath));
    const result = analyseParsedTrack(track, { includeFrames: command.includeFrames, loadKg: command.loadKg });
    io.out(`${JSON.stringify(result, null, command.compact ? undefined : 2)}\n`);
    return 0;
  } catch (error) {
    if (error instanceof CliUsageError || error instanceof AnalysisOptionsError || error instanceof VideoModeInputError) {
      io.err(`analyse: ${error.message}\n\n${USAGE}\n`);
      return 2;
    }
    if (error instanceof CliFileError) {
      io.err(`analyse: ${error.message}\n`);
      return 1;
    }
    if (error instanceof TrackInputError) {
      io.err(`analyse: invalid track file: ${error.message}\n`);
      return 1;
    }
    throw error;
  }
}

async function isMainModule(): Promise<boolean> {
  const script = process.argv[1];
  if (!script) return false;
  try {
    return import.meta.url === pathToFileURL(await realpath(script)).href;
  } catch {
    return false;
  }
}

if (await isMainModule()) process.exitCode = await runCli(process.argv.slice(2));
