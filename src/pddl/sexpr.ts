// Builds the nested-list tree of a PDDL file from its tokens (iteratively, so deep nesting
// cannot overflow the stack) and reports unbalanced parentheses with both positions.
import { PlumblineError } from "../util/errors.js";
import { tokenize, type Token } from "./lexer.js";

export interface SAtom {
  kind: "atom";
  tok: Exclude<Token["kind"], "(" | ")" | "eof">;
  text: string;
  line: number;
  col: number;
}

export interface SList {
  kind: "list";
  items: SNode[];
  line: number;
  col: number;
  /** Position of the closing ')'. */
  endLine: number;
  endCol: number;
}

export type SNode = SAtom | SList;

/** Deepest list nesting accepted; real PDDL stays far below this. */
export const MAX_DEPTH = 500;

/** Reads every top-level node of `text`; `end` is the end-of-file position. */
export function readSexprs(text: string, file: string): { nodes: SNode[]; end: { line: number; col: number } } {
  const toks = tokenize(text, file);
  const top: SNode[] = [];
  const last = toks[toks.length - 1];
  const stack: SList[] = [];
  for (const t of toks) {
    if (t.kind === "(") {
      if (stack.length >= MAX_DEPTH) {
        throw new PlumblineError("parse", `lists nested more than ${MAX_DEPTH} deep`, { file, line: t.line, col: t.col });
      }
      stack.push({ kind: "list", items: [], line: t.line, col: t.col, endLine: t.line, endCol: t.col });
    } else if (t.kind === ")") {
      const l = stack.pop();
      if (!l) throw new PlumblineError("parse", "unexpected ')' with no matching '('", { file, line: t.line, col: t.col });
      l.endLine = t.line;
      l.endCol = t.col;
      (stack.length ? stack[stack.length - 1].items : top).push(l);
    } else if (t.kind === "eof") {
      if (stack.length) {
        const open = stack[stack.length - 1];
        throw new PlumblineError("parse", `expected ')' to close the '(' opened at ${open.line}:${open.col}, found end of file`, {
          file,
          line: t.line,
          col: t.col,
        });
      }
    } else {
      const a: SAtom = { kind: "atom", tok: t.kind, text: t.text, line: t.line, col: t.col };
      (stack.length ? stack[stack.length - 1].items : top).push(a);
    }
  }
  return { nodes: top, end: { line: last.line, col: last.col } };
}

/** Short description of a node for "expected …, found …" messages. */
export function describe(n: SNode | undefined): string {
  if (!n) return "')'";
  if (n.kind === "atom") return `'${n.text}'`;
  if (n.items.length === 0) return "'()'";
  const h = n.items[0];
  return h.kind === "atom" ? `'(${h.text} …)'` : "'((…) …)'";
}
