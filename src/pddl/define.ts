// Reads the `(define (domain|problem NAME) …sections)` frame shared by both file kinds
// and hands back each `(:section …)` with its keyword, refusing anything else by position.
import { PlumblineError } from "../util/errors.js";
import { Cursor, errorAt, posOf } from "./cursor.js";
import { describe, readSexprs, type SAtom, type SList } from "./sexpr.js";
import type { SourcePos } from "../util/errors.js";

export interface Section {
  key: SAtom;
  list: SList;
  /** Cursor positioned after the keyword. */
  body: Cursor;
}

export interface DefineFrame {
  name: string;
  pos: SourcePos;
  sections: Section[];
}

export function readDefine(text: string, file: string, kind: "domain" | "problem"): DefineFrame {
  const { nodes, end } = readSexprs(text, file);
  const first = nodes[0];
  const expected = `'(define (${kind} NAME) …)'`;
  if (!first) throw errorAt(file, end, `expected ${expected}, found end of file`);
  if (first.kind !== "list" || first.items[0]?.kind !== "atom" || first.items[0].text !== "define") {
    throw errorAt(file, first, `expected ${expected}, found ${describe(first)}`);
  }
  if (nodes.length > 1) throw errorAt(file, nodes[1], `expected end of file after the (define …) block, found ${describe(nodes[1])}`);
  const c = new Cursor(file, first, 1);
  const head = c.list(`'(${kind} NAME)'`);
  const hc = new Cursor(file, head);
  const kw = hc.peek();
  if (!kw || kw.kind !== "atom" || kw.text !== kind) {
    throw errorAt(file, kw ?? { line: head.endLine, col: head.endCol }, `expected '${kind}', found ${describe(kw)}`);
  }
  hc.next(kind);
  const name = hc.name(`the ${kind} name`).text;
  hc.end(`(${kind} NAME)`);
  const sections: Section[] = [];
  while (!c.atEnd()) {
    const l = c.list(`a section '(:keyword …)'`);
    const sc = new Cursor(file, l);
    const key = sc.keyword(`a section keyword such as ':${kind === "domain" ? "action" : "init"}'`);
    sections.push({ key, list: l, body: sc });
  }
  return { name, pos: posOf(file, first), sections };
}

/**
 * Checks every section keyword: refused ones by name (unsupported), unknown ones, and
 * repeats of sections other than those in `repeatable`.
 */
export function checkSections(frame: DefineFrame, kind: "domain" | "problem", allowed: readonly string[], refused: Readonly<Record<string, string>>, repeatable: readonly string[] = []): void {
  const first = new Map<string, SourcePos>();
  for (const s of frame.sections) {
    const key = s.key.text;
    const pos = posOf(s.body.file, s.key);
    if (refused[key]) throw new PlumblineError("unsupported", refused[key], pos);
    if (!allowed.includes(key)) throw errorAt(s.body.file, s.key, `expected a ${kind} section (${allowed.join(", ")}), found '${key}'`);
    const old = first.get(key);
    if (old && !repeatable.includes(key)) throw errorAt(s.body.file, s.key, `section '${key}' appears twice (first at ${old.line}:${old.col})`);
    if (!old) first.set(key, pos);
  }
}
