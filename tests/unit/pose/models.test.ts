// `npm run models` (ensureModels) into a scratch folder: installs, verifies, repairs, and is idempotent.
import { createHash } from "node:crypto";
import { mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ensureModels } from "@/scripts/models";
import { TFJS_WASM_FILES } from "@/lib/pose/constants";
import { MODEL_FILES } from "@/lib/pose/model-manifest";

const quiet = { log: () => {} };
let modelsDir: string;

beforeAll(async () => {
  modelsDir = await mkdtemp(path.join(os.tmpdir(), "plumbline-models-"));
});

afterAll(async () => {
  await rm(modelsDir, { recursive: true, force: true });
});

async function sha256(file: string) {
  return createHash("sha256").update(await readFile(file)).digest("hex");
}

describe("ensureModels", () => {
  it("installs every manifest file with its checksum, plus the tfjs wasm binaries", async () => {
    const report = await ensureModels({ ...quiet, modelsDir });
    expect(report.written).toHaveLength(MODEL_FILES.length + TFJS_WASM_FILES.length);
    for (const entry of MODEL_FILES) {
      expect(await sha256(path.join(modelsDir, entry.path))).toBe(entry.sha256);
    }
    const wasm = await readFile(path.join(modelsDir, "tfjs-wasm/tfjs-backend-wasm-simd.wasm"));
    expect(wasm.subarray(0, 4)).toEqual(Buffer.from([0x00, 0x61, 0x73, 0x6d])); // "\0asm", the WebAssembly magic number (WebAssembly spec, binary format)
  }, 120_000);

  it("keeps the weight file names the graph JSON refers to", async () => {
    const json = JSON.parse(await readFile(path.join(modelsDir, "blazepose-full/blazepose-full.json"), "utf8")) as {
      weightsManifest: { paths: string[] }[];
    };
    const names = json.weightsManifest.flatMap((group) => group.paths);
    expect(names).toEqual(["blazepose-full.bin"]);
  });

  it("writes nothing when everything is already in place", async () => {
    const report = await ensureModels({ ...quiet, modelsDir });
    expect(report).toEqual({ written: [], downloaded: false });
  });

  it("replaces a damaged file and only that one", async () => {
    const damaged = path.join(modelsDir, "blazepose-full/blazepose-full.bin");
    const bytes = await readFile(damaged);
    bytes[1000] ^= 0xff;
    await writeFile(damaged, bytes);
    const report = await ensureModels({ ...quiet, modelsDir });
    expect(report.written).toEqual(["blazepose-full/blazepose-full.bin"]);
    expect(await sha256(damaged)).toBe(MODEL_FILES.find((e) => e.path === "blazepose-full/blazepose-full.bin")?.sha256);
  }, 120_000);
});
