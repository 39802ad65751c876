// Installs the Debian packages the product and its tests need when they are missing:
// the PostgreSQL server, Chromium for browser tests and ffmpeg for video conversion.
import { existsSync, readdirSync } from "node:fs";
import { log, run } from "./run";

interface DebianPackage {
  name: string;
  isPresent: () => boolean;
}

const POSTGRES_ROOT = "/usr/lib/postgresql";

export function postgresBinDir(): string | null {
  if (!existsSync(POSTGRES_ROOT)) return null;
  const versions = readdirSync(POSTGRES_ROOT)
    .filter((v) => existsSync(`${POSTGRES_ROOT}/${v}/bin/initdb`))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length > 0 ? `${POSTGRES_ROOT}/${versions[0]}/bin` : null;
}

const PACKAGES: Record<string, DebianPackage> = {
  postgresql: { name: "postgresql", isPresent: () => postgresBinDir() !== null },
  chromium: { name: "chromium", isPresent: () => existsSync("/usr/bin/chromium") },
  ffmpeg: { name: "ffmpeg", isPresent: () => existsSync("/usr/bin/ffmpeg") && existsSync("/usr/bin/ffprobe") },
};

export type SystemPackage = keyof typeof PACKAGES;

export function ensureSystemPackages(wanted: SystemPackage[]): void {
  const missing = wanted.map((key) => PACKAGES[key]).filter((pkg) => !pkg.isPresent());
  if (missing.length === 0) return;
  const names = missing.map((pkg) => pkg.name);
  log(`installing Debian packages: ${names.join(", ")}`);
  const sudo = process.getuid?.() === 0 ? [] : ["sudo"];
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  const apt = (args: string[]) =>
    sudo.length > 0 ? run("sudo", ["apt-get", ...args], { env }) : run("apt-get", args, { env });
  apt(["update", "-qq"]);
  apt(["install", "-y", "-qq", ...names]);
  const stillMissing = missing.filter((pkg) => !pkg.isPresent()).map((pkg) => pkg.name);
  if (stillMissing.length > 0) throw new Error(`Debian packages still missing after install: ${stillMissing.join(", ")}`);
}
