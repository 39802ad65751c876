// Samples the resident memory of a process and its descendants from /proc (Linux), for the
// benchmarks that run the analysis in a child process (the command line, Chromium).
import { readdirSync, readFileSync } from "node:fs";

export interface ProcessPeak {
  pid: number;
  name: string;
  /** Kernel's high-water mark of resident memory (VmHWM), MB. */
  peakRssMb: number;
}

export interface MemoryReport {
  /** Highest sum of resident memory over the tree at one sample (shared pages counted once per process), MB. */
  peakTotalMb: number;
  processes: ProcessPeak[];
}

export interface MemorySampler {
  stop(): MemoryReport;
}

function readStatus(pid: number): Record<string, string> | null {
  try {
    const text = readFileSync(`/proc/${pid}/status`, "utf8");
    return Object.fromEntries(text.split("\n").map((line) => [line.slice(0, line.indexOf(":")), line.slice(line.indexOf(":") + 1).trim()]));
  } catch {
    return null;
  }
}

const kbToMb = (field: string | undefined) => (field ? Number.parseInt(field, 10) / 1024 : 0);

function descendants(rootPid: number): number[] {
  const parentOf = new Map<number, number>();
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      // Field 4 of /proc/<pid>/stat is the parent pid; the command name (field 2) may hold spaces.
      const stat = readFileSync(`/proc/${entry}/stat`, "utf8");
      parentOf.set(Number(entry), Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[1]));
    } catch {
      // The process ended between listing and reading.
    }
  }
  const tree = new Set([rootPid]);
  let grew = true;
  while (grew) {
    grew = false;
    for (const [pid, parent] of parentOf) {
      if (!tree.has(pid) && tree.has(parent)) {
        tree.add(pid);
        grew = true;
      }
    }
  }
  return [...tree];
}

/** Starts sampling every `everyMs`; `includeRoot` false leaves the root (e.g. the benchmark itself) out. */
export function sampleProcessTree(rootPid: number, options: { everyMs?: number; includeRoot?: boolean } = {}): MemorySampler {
  const peaks = new Map<number, ProcessPeak>();
  let peakTotalMb = 0;
  const sample = () => {
    let totalMb = 0;
    for (const pid of descendants(rootPid)) {
      if (pid === rootPid && options.includeRoot === false) continue;
      const status = readStatus(pid);
      if (!status) continue;
      totalMb += kbToMb(status.VmRSS);
      // A process that has just exited (a zombie) reports no memory: keep what was seen before.
      const seenMb = peaks.get(pid)?.peakRssMb ?? 0;
      peaks.set(pid, { pid, name: status.Name ?? "?", peakRssMb: Math.max(seenMb, kbToMb(status.VmHWM)) });
    }
    peakTotalMb = Math.max(peakTotalMb, totalMb);
  };
  sample();
  const timer = setInterval(sample, options.everyMs ?? 100);
  return {
    stop() {
      clearInterval(timer);
      return { peakTotalMb, processes: [...peaks.values()].sort((a, b) => b.peakRssMb - a.peakRssMb) };
    },
  };
}
