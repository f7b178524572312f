// The one error type users can cause (bad input, bad usage, missing files):
// the CLI prints its message and exits 2 (or the code it carries), never a stack trace.

/** Where in an input file something went wrong (1-based line and column). */
export interface SourcePos {
  file: string;
  line: number;
  col: number;
}

export type ErrorCode =
  | "parse" // malformed input text (PDDL, plan, DIMACS, proof, JSON)
  | "unsupported" // a recognised feature plumbline does not handle
  | "semantic" // well-formed but meaningless (unknown object, wrong arity, bad cost)
  | "io" // a file cannot be read or written
  | "usage" // bad command-line use
  | "limit" // a resource limit was reached
  | "external"; // an external program failed or is missing

export class PlumblineError extends Error {
  readonly code: ErrorCode;
  readonly pos: SourcePos | undefined;
  /** Process exit code the CLI uses for this error (DESIGN: 2 = bad input or usage). */
  readonly exitCode: number;

  constructor(code: ErrorCode, message: string, pos?: SourcePos, exitCode = 2) {
    super(pos ? `${pos.file}:${pos.line}:${pos.col}: ${message}` : message);
    this.name = "PlumblineError";
    this.code = code;
    this.pos = pos;
    this.exitCode = exitCode;
  }

  /** The message without the position prefix. */
  get detail(): string {
    if (!this.pos) return this.message;
    const prefix = `${this.pos.file}:${this.pos.line}:${this.pos.col}: `;
    return this.message.startsWith(prefix) ? this.message.slice(prefix.length) : this.message;
  }
}

export function isPlumblineError(e: unknown): e is PlumblineError {
  return e instanceof PlumblineError;
}
