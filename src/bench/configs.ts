// The named configurations a bench can run: which plumbline command with which options, and
// whether its certificate is audited. Add a configuration here (and to the README table).

export interface Limits {
  /** Seconds per run. */
  timeLimit: number;
  /** MB per run. */
  memoryLimit: number;
  /** Cores per run (the machine's cores ÷ runs at the same time), when the bench knows it. */
  threads?: number;
}

export interface RunFiles {
  domainFile: string;
  problemFile: string;
  /** The run's own folder (exists, empty on the first attempt). */
  runDir: string;
  /** Where a certificate goes when the configuration writes one. */
  certificateDir: string;
  planFile: string;
}

export interface Configuration {
  name: string;
  summary: string;
  /** Arguments after the plumbline CLI (or the whole command when `external`). */
  argv(files: RunFiles, limits: Limits): string[];
  /** When true, argv()[0] is a program of its own instead of a plumbline sub-command. */
  external?: boolean;
  /** Audit the certificate the run wrote (when it wrote one). */
  audits: boolean;
}

const satConfig = (name: string, encoding: string): Configuration => ({
  name,
  summary: `SAT optimizer, ${encoding} encoding, certificate audited`,
  audits: true,
  argv: (f, l) => [
    "solve",
    f.domainFile,
    f.problemFile,
    "--json",
    "--encoding",
    encoding,
    "--certificate",
    f.certificateDir,
    "--plan",
    f.planFile,
    "--time-limit",
    String(l.timeLimit),
    "--memory-limit",
    String(l.memoryLimit),
    ...(l.threads !== undefined ? ["--threads", String(l.threads)] : []),
  ],
});

const astarConfig = (name: string, heuristic: string, label: string): Configuration => ({
  name,
  summary: `A* with ${label}`,
  audits: false,
  argv: (f, l) => ["search", f.domainFile, f.problemFile, "--json", "--heuristic", heuristic, "--plan", f.planFile, "--time-limit", String(l.timeLimit)],
});

export const CONFIGURATIONS: readonly Configuration[] = [
  satConfig("sat-forall", "forall-1"),
  satConfig("sat-seq", "seq-1"),
  astarConfig("astar-landmark-cut", "landmark-cut", "landmark-cut"),
  astarConfig("astar-blind", "blind", "the blind heuristic (Dijkstra)"),
];

/** Configurations a suite gets when neither it nor the command line names any. */
export const DEFAULT_CONFIGURATIONS = ["sat-forall", "astar-landmark-cut"];

export type ConfigRegistry = ReadonlyMap<string, Configuration>;

export function configRegistry(extra: readonly Configuration[] = []): ConfigRegistry {
  return new Map([...CONFIGURATIONS, ...extra].map((c) => [c.name, c]));
}
