// `npm run models`: puts the pose model weights and the tfjs wasm binaries into public/models/,
// checking every weight file against the SHA-256 in lib/pose/model-manifest.ts. Idempotent.
import { execFile } from "node:child_process";
import { createHash } from "node:crypto";
import { createReadStream } from "node:fs";
import { copyFile, mkdir, mkdtemp, readFile, rename, rm, stat } from "node:fs/promises";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { promisify } from "node:util";
import { TFJS_WASM_FILES, TFJS_WASM_FOLDER } from "@/lib/pose/constants";
import { HUMAN_MODELS_PACKAGE, MODEL_FILES, type ModelFileEntry } from "@/lib/pose/model-manifest";

const run = promisify(execFile);
const repoRoot = path.resolve(import.meta.dirname, "..");

export interface EnsureModelsOptions {
  /** Destination, `public/models` by default. */
  modelsDir?: string;
  /** Where the npm tarball is kept between runs, `.data/cache/npm` by default. */
  cacheDir?: string;
  /** Progress lines (only printed when something has to be fetched); console by default. */
  log?: (line: string) => void;
}

export interface EnsureModelsReport {
  /** Destination paths (relative to modelsDir) written in this run. */
  written: string[];
  /** Whether the human-models tarball had to be fetched from the registry. */
  downloaded: boolean;
}

export class ModelInstallError extends Error {}

async function hashFile(file: string, algorithm: "sha256" | "sha512", encoding: "hex" | "base64") {
  const hash = createHash(algorithm);
  for await (const chunk of createReadStream(file)) hash.update(chunk as Buffer);
  return hash.digest(encoding);
}

async function sizeOf(file: string): Promise<number | null> {
  try {
    return (await stat(file)).size;
  } catch {
    return null;
  }
}

async function isIntact(file: string, entry: ModelFileEntry): Promise<boolean> {
  if ((await sizeOf(file)) !== entry.sizeBytes) return false;
  return (await hashFile(file, "sha256", "hex")) === entry.sha256;
}

/** Verifies a staged file, then moves it into place so readers never see half a file. */
async function install(staged: string, dest: string, entry: ModelFileEntry) {
  if (!(await isIntact(staged, entry))) {
    throw new ModelInstallError(
      `${entry.path}: checksum mismatch (expected sha256 ${entry.sha256}); refusing to install it`,
    );
  }
  await mkdir(path.dirname(dest), { recursive: true });
  await rename(staged, dest);
}

async function tarballIntact(tarball: string) {
  if ((await sizeOf(tarball)) !== HUMAN_MODELS_PACKAGE.sizeBytes) return false;
  return `sha512-${await hashFile(tarball, "sha512", "base64")}` === HUMAN_MODELS_PACKAGE.integrity;
}

/** Returns the cached tarball path, fetching it with `npm pack` (no install) when absent or corrupt. */
async function ensureTarball(cacheDir: string, log: (line: string) => void) {
  const tarball = path.join(cacheDir, HUMAN_MODELS_PACKAGE.tarballName);
  if (await tarballIntact(tarball)) return { tarball, downloaded: false };
  await mkdir(cacheDir, { recursive: true });
  log(`fetching ${HUMAN_MODELS_PACKAGE.spec} (${Math.round(HUMAN_MODELS_PACKAGE.sizeBytes / 1e6)} MB tarball)`);
  try {
    await run("npm", ["pack", HUMAN_MODELS_PACKAGE.spec, "--pack-destination", cacheDir, "--silent"], {
      cwd: cacheDir,
    });
  } catch (error) {
    throw new ModelInstallError(`npm pack ${HUMAN_MODELS_PACKAGE.spec} failed: ${(error as Error).message}`);
  }
  if (!(await tarballIntact(tarball))) {
    await rm(tarball, { force: true });
    throw new ModelInstallError(`${HUMAN_MODELS_PACKAGE.tarballName}: integrity check failed after download`);
  }
  return { tarball, downloaded: true };
}

async function installFromNodeModules(entries: ModelFileEntry[], modelsDir: string, stagingDir: string) {
  for (const entry of entries) {
    const staged = path.join(stagingDir, path.basename(entry.path));
    const source = path.join(repoRoot, "node_modules", entry.source.path);
    await copyFile(source, staged).catch((error: NodeJS.ErrnoException) => {
      if (error.code !== "ENOENT") throw error;
      throw new ModelInstallError(`node_modules/${entry.source.path} is missing: install the dev dependencies (npm ci)`);
    });
    await install(staged, path.join(modelsDir, entry.path), entry);
  }
}

async function installFromTarball(entries: ModelFileEntry[], tarball: string, modelsDir: string, stagingDir: string) {
  // One pass of Debian's tar over the 144 MB archive extracts every member we need.
  await run("tar", ["-xzf", tarball, "-C", stagingDir, ...entries.map((e) => e.source.path)]);
  for (const entry of entries) {
    await install(path.join(stagingDir, entry.source.path), path.join(modelsDir, entry.path), entry);
  }
}

/** The browser's tfjs wasm backend loads these from `/models/tfjs-wasm/`; copy when they differ. */
async function copyWasmBinaries(modelsDir: string): Promise<string[]> {
  const written: string[] = [];
  const sourceDir = path.join(repoRoot, "node_modules/@tensorflow/tfjs-backend-wasm/dist");
  for (const file of TFJS_WASM_FILES) {
    const source = path.join(sourceDir, file);
    const dest = path.join(modelsDir, TFJS_WASM_FOLDER, file);
    const [a, b] = await Promise.all([readFile(source), readFile(dest).catch(() => null)]);
    if (b && a.equals(b)) continue;
    await mkdir(path.dirname(dest), { recursive: true });
    await copyFile(source, `${dest}.tmp-${process.pid}`);
    await rename(`${dest}.tmp-${process.pid}`, dest);
    written.push(`${TFJS_WASM_FOLDER}/${file}`);
  }
  return written;
}

export async function ensureModels(options: EnsureModelsOptions = {}): Promise<EnsureModelsReport> {
  const modelsDir = options.modelsDir ?? path.join(repoRoot, "public/models");
  const cacheDir = options.cacheDir ?? path.join(repoRoot, ".data/cache/npm");
  const log = options.log ?? ((line: string) => console.log(`models: ${line}`));

  const missing: ModelFileEntry[] = [];
  for (const entry of MODEL_FILES) {
    if (!(await isIntact(path.join(modelsDir, entry.path), entry))) missing.push(entry);
  }
  let downloaded = false;
  if (missing.length > 0) {
    await mkdir(modelsDir, { recursive: true });
    const stagingDir = await mkdtemp(path.join(modelsDir, ".staging-"));
    try {
      await installFromNodeModules(missing.filter((e) => e.source.kind === "node-module"), modelsDir, stagingDir);
      const fromTarball = missing.filter((e) => e.source.kind === "human-models-tarball");
      if (fromTarball.length > 0) {
        const fetched = await ensureTarball(cacheDir, log);
        downloaded = fetched.downloaded;
        await installFromTarball(fromTarball, fetched.tarball, modelsDir, stagingDir);
      }
    } finally {
      await rm(stagingDir, { recursive: true, force: true });
    }
  }
  const written = [...missing.map((e) => e.path), ...(await copyWasmBinaries(modelsDir))];
  return { written, downloaded };
}

async function main() {
  const started = performance.now();
  try {
    const report = await ensureModels();
    const seconds = ((performance.now() - started) / 1000).toFixed(1);
    const summary = report.written.length === 0 ? "already in place" : `wrote ${report.written.join(", ")}`;
    console.log(`models: ${summary} (${seconds} s)`);
  } catch (error) {
    console.error(`models: ${(error as Error).message}`);
    process.exitCode = 1;
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) {
  await main();
}
