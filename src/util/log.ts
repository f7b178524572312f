// Logging: pino to stderr (stdout is for results); one shared logger whose level
// the CLI sets from --quiet / --verbose.
import { pino, type Logger } from "pino";

let current: Logger = pino({ level: process.env.PLUMBLINE_LOG ?? "info", base: undefined }, pino.destination(2));

export function logger(): Logger {
  return current;
}

/** Replaces the shared logger (the CLI does this once per run; tests may silence it). */
export function setLogger(l: Logger): void {
  current = l;
}

export function makeLogger(level: string, dest: { write(line: string): unknown } | number = 2): Logger {
  const destination = typeof dest === "number" ? pino.destination(dest) : dest;
  return pino({ level, base: undefined, timestamp: pino.stdTimeFunctions.isoTime }, destination as NodeJS.WritableStream);
}
