// A cursor over the items of one parsed list, with "expected …, found …" errors that
// point at the offending item (or at the closing ')' when an item is missing).
import { PlumblineError, type ErrorCode, type SourcePos } from "../util/errors.js";
import { describe, type SAtom, type SList, type SNode } from "./sexpr.js";

export function posOf(file: string, n: { line: number; col: number }): SourcePos {
  return { file, line: n.line, col: n.col };
}

export function errorAt(file: string, n: { line: number; col: number }, message: string, code: ErrorCode = "parse"): PlumblineError {
  return new PlumblineError(code, message, posOf(file, n));
}

export class Cursor {
  private i: number;

  constructor(
    readonly file: string,
    readonly node: SList,
    start = 0,
  ) {
    this.i = start;
  }

  peek(): SNode | undefined {
    return this.node.items[this.i];
  }

  atEnd(): boolean {
    return this.i >= this.node.items.length;
  }

  fail(what: string, n: SNode | undefined = this.peek()): PlumblineError {
    const at = n ?? { line: this.node.endLine, col: this.node.endCol };
    return errorAt(this.file, at, `expected ${what}, found ${describe(n)}`);
  }

  next(what: string): SNode {
    const n = this.peek();
    if (!n) throw this.fail(what);
    this.i++;
    return n;
  }

  /** A plain name (not a variable, keyword or number). */
  name(what: string): SAtom {
    const n = this.peek();
    if (!n || n.kind !== "atom" || n.tok !== "name") throw this.fail(what, n);
    this.i++;
    return n;
  }

  keyword(what: string): SAtom {
    const n = this.peek();
    if (!n || n.kind !== "atom" || n.tok !== "keyword") throw this.fail(what, n);
    this.i++;
    return n;
  }

  list(what: string): SList {
    const n = this.peek();
    if (!n || n.kind !== "list") throw this.fail(what, n);
    this.i++;
    return n;
  }

  /** Requires that nothing follows. */
  end(context: string): void {
    const n = this.peek();
    if (n) throw errorAt(this.file, n, `expected ')' to end ${context}, found ${describe(n)}`);
  }
}

/** The head name of a list, e.g. "and" in (and …), or null. */
export function headOf(l: SList): SAtom | null {
  const h = l.items[0];
  return h && h.kind === "atom" ? h : null;
}
