// What every command gets: output streams, the --json/--quiet switches, an abort signal
// (SIGINT), and helpers for printing results; lets tests run the CLI in-process.
import type { Command } from "commander";
import type { Logger } from "pino";
import { logger, makeLogger, setLogger } from "../util/log.js";

export interface CliIo {
  stdout: NodeJS.WritableStream;
  stderr: NodeJS.WritableStream;
}

export interface CommonOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
}

export class CliContext {
  exitCode = 0;
  json = false;
  quiet = false;
  readonly io: CliIo;
  readonly signal: AbortSignal;

  constructor(io: CliIo, signal: AbortSignal) {
    this.io = io;
    this.signal = signal;
  }

  /** Applies --json/--quiet/--verbose of the command being run (called by `commonAction`). */
  configure(opts: CommonOptions): void {
    this.json = !!opts.json;
    this.quiet = !!opts.quiet;
    const level = opts.quiet ? "warn" : opts.verbose ? "debug" : (process.env.PLUMBLINE_LOG ?? "info");
    setLogger(makeLogger(level, plainLines(this.io.stderr)));
  }

  /** A warning in plain words on stderr ("plumbline: warning: …"), shown also with --quiet and --json. */
  warn(text: string): void {
    this.io.stderr.write(`plumbline: warning: ${text}\n`);
  }

  get log(): Logger {
    return logger();
  }

  /** Human-readable result text on stdout (suppressed with --json). */
  out(text: string): void {
    if (this.json) return;
    this.io.stdout.write(text.endsWith("\n") ? text : text + "\n");
  }

  /** Progress and notes for a person watching, on stderr (suppressed with --quiet or --json). */
  note(text: string): void {
    if (this.quiet || this.json) return;
    this.io.stderr.write(text.endsWith("\n") ? text : text + "\n");
  }

  /** The single JSON result object on stdout (only with --json). */
  result(obj: unknown): void {
    if (!this.json) return;
    this.io.stdout.write(JSON.stringify(obj, null, 2) + "\n");
  }
}

const LEVELS: Record<number, string> = { 10: "trace", 20: "debug", 30: "note", 40: "warning", 50: "error", 60: "fatal" };

/** A log destination printing pino's JSON lines as "plumbline: LEVEL: message" (people read stderr, not JSON). */
function plainLines(out: NodeJS.WritableStream): { write(line: string): void } {
  return {
    write(line: string) {
      let text = line.trim();
      try {
        const o = JSON.parse(text) as { level?: number; msg?: string };
        text = `plumbline: ${LEVELS[o.level ?? 30] ?? "note"}: ${o.msg ?? ""}`;
      } catch {
        /* not JSON: print as is */
      }
      out.write(text + "\n");
    },
  };
}

/** Adds --json, --quiet and --verbose to a command. */
export function withCommonOptions(cmd: Command): Command {
  return cmd
    .option("--json", "print one JSON object on stdout (logs stay on stderr)")
    .option("-q, --quiet", "print only results and warnings")
    .option("--verbose", "log debugging detail on stderr");
}
