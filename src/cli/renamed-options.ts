// Options renamed in this release (README "Words plumbline uses"): the old spellings still work for
// one release — rewritten to the new ones before parsing, with a deprecation note on stderr.

export interface RenamedOption {
  /** The command the option belongs to. */
  command: string;
  /** The old spelling, e.g. "--upper-bound". */
  old: string;
  /** The new spelling (the same as `old` when only values were renamed). */
  now: string;
  /** Renamed values: old value → new value. */
  values?: Readonly<Record<string, string>>;
}

/** Every renamed option and value; removed in the release after next. */
export const RENAMED_OPTIONS: readonly RenamedOption[] = [
  { command: "check-proof", old: "--format", now: "--proof-format" },
  { command: "check-proof", old: "--mode", now: "--lemmas", values: { backward: "needed", forward: "all" } },
  { command: "check-proof", old: "--lrat", now: "--lrat-proof" },
  { command: "sat", old: "--proof-format", now: "--proof-format", values: { binary: "drat-binary", text: "drat-text" } },
  { command: "horizon", old: "--upper-bound", now: "--cost-below" },
  { command: "horizon", old: "--max-explicit-states", now: "--max-reachable-states" },
  { command: "measure", old: "--max-states", now: "--max-reachable-states" },
  { command: "measure", old: "--max-search", now: "--max-paths" },
  { command: "bench", old: "--out", now: "--output-dir" },
  { command: "bench", old: "--time-limit", now: "--time-limit-per-run" },
  { command: "bench", old: "--memory-limit", now: "--memory-limit-per-run" },
  { command: "audit", old: "--time-limit", now: "--time-limit-per-certificate" },
  { command: "report", old: "--out", now: "--output" },
];

/**
 * Rewrites old option spellings (and renamed values) of the command named in `argv` to the new
 * ones; `note` receives one deprecation note per renamed option used. Tokens after `--` are left alone.
 */
export function renameOldOptions(argv: readonly string[], note: (text: string) => void): string[] {
  const command = argv.find((a) => !a.startsWith("-"));
  const table = RENAMED_OPTIONS.filter((r) => r.command === command);
  if (table.length === 0) return [...argv];
  const out: string[] = [];
  const noted = new Set<string>();
  const say = (r: RenamedOption, oldValue: string | null, newValue: string | null) => {
    const key = `${r.old}=${oldValue ?? ""}`;
    if (noted.has(key)) return;
    noted.add(key);
    const was = oldValue !== null && newValue !== oldValue ? `${r.old} ${oldValue}` : r.old;
    const is = newValue !== null && newValue !== oldValue ? `${r.now} ${newValue}` : r.now;
    note(`${command} ${was} is the old spelling of ${is}: it still works in this release and will be removed in the next; use ${is}`);
  };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === "--") {
      out.push(...argv.slice(i));
      break;
    }
    const eq = a.indexOf("=");
    const flag = eq > 0 ? a.slice(0, eq) : a;
    const r = a.startsWith("--") ? table.find((x) => x.old === flag) : undefined;
    if (!r) {
      out.push(a);
      continue;
    }
    let value: string | null = eq > 0 ? a.slice(eq + 1) : null;
    const inline = value !== null;
    if (!inline && r.values && i + 1 < argv.length) value = argv[i + 1];
    const mapped = value !== null && r.values ? (r.values[value] ?? value) : value;
    if (r.now === r.old && mapped === value) {
      out.push(a);
      continue; // a value that was not renamed
    }
    say(r, r.values ? value : null, r.values ? mapped : null);
    if (inline) out.push(`${r.now}=${mapped}`);
    else if (r.values && i + 1 < argv.length) {
      out.push(r.now, mapped as string);
      i++;
    } else out.push(r.now);
  }
  return out;
}
