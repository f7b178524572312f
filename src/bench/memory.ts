// Resident memory of a child process and everything it started, read from /proc (Linux);
// elsewhere the runner relies on the child's heap limit and its own report.
import { readFileSync } from "node:fs";

function statusField(pid: number, field: string): number | null {
  try {
    const text = readFileSync(`/proc/${pid}/status`, "utf8");
    const m = new RegExp(`^${field}:\\s+(\\d+)\\s+kB`, "m").exec(text);
    return m ? Number(m[1]) * 1024 : null;
  } catch {
    return null;
  }
}

function childrenOf(pid: number): number[] {
  try {
    return readFileSync(`/proc/${pid}/task/${pid}/children`, "utf8")
      .trim()
      .split(/\s+/)
      .filter(Boolean)
      .map(Number);
  } catch {
    return [];
  }
}

export interface TreeMemory {
  /** Sum of current resident sizes over the process tree, in bytes. */
  rss: number;
  /** The root process's own peak resident size (VmHWM), in bytes. */
  rootPeak: number;
}

/** Current memory of `pid` and its descendants; null when /proc cannot tell (not Linux, or gone). */
export function treeMemory(pid: number): TreeMemory | null {
  const rootRss = statusField(pid, "VmRSS");
  if (rootRss === null) return null;
  let rss = rootRss;
  const stack = childrenOf(pid);
  const seen = new Set<number>([pid]);
  while (stack.length) {
    const p = stack.pop() as number;
    if (seen.has(p)) continue;
    seen.add(p);
    rss += statusField(p, "VmRSS") ?? 0;
    stack.push(...childrenOf(p));
  }
  return { rss, rootPeak: statusField(pid, "VmHWM") ?? rootRss };
}
