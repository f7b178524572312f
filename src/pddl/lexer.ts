// Splits PDDL text into tokens with 1-based line/column positions; names are folded to
// lower case here (PDDL is case-insensitive) and `;` comments are skipped.
import { PlumblineError } from "../util/errors.js";

export type TokenKind = "(" | ")" | "name" | "var" | "keyword" | "number" | "symbol" | "eof";

export interface Token {
  kind: TokenKind;
  /** Lower-cased text ("?x", ":action", "12", "-"); "" for eof. */
  text: string;
  line: number;
  col: number;
}

/** Operators PDDL allows as bare tokens (only "-" and "=" are meaningful to plumbline). */
const SYMBOLS = new Set(["-", "=", "<", ">", "<=", ">=", "+", "*", "/"]);
const NAME = /^[a-z_][a-z0-9_\-@.]*$|^[0-9][a-z0-9_\-@.]*[a-z_\-@][a-z0-9_\-@.]*$/;
const NUMBER = /^-?(?:[0-9]+(?:\.[0-9]*)?|\.[0-9]+)$/;

function isDelimiter(c: number): boolean {
  // whitespace, ( ) ;
  return c === 32 || c === 9 || c === 10 || c === 13 || c === 12 || c === 11 || c === 40 || c === 41 || c === 59;
}

/** Tokenizes `text`; `file` is only used in error positions. */
export function tokenize(text: string, file: string): Token[] {
  const out: Token[] = [];
  let line = 1;
  let lineStart = 0;
  let i = 0;
  const n = text.length;
  while (i < n) {
    const c = text.charCodeAt(i);
    if (c === 10) {
      i++;
      line++;
      lineStart = i;
      continue;
    }
    if (c === 32 || c === 9 || c === 13 || c === 12 || c === 11 || c === 0xfeff) {
      i++;
      continue;
    }
    if (c === 59) {
      // comment to end of line
      while (i < n && text.charCodeAt(i) !== 10) i++;
      continue;
    }
    const col = i - lineStart + 1;
    if (c === 40 || c === 41) {
      out.push({ kind: c === 40 ? "(" : ")", text: c === 40 ? "(" : ")", line, col });
      i++;
      continue;
    }
    let j = i;
    while (j < n && !isDelimiter(text.charCodeAt(j))) j++;
    const raw = text.slice(i, j);
    const word = raw.toLowerCase();
    i = j;
    out.push({ kind: classify(word, raw, file, line, col), text: word, line, col });
  }
  out.push({ kind: "eof", text: "", line, col: i - lineStart + 1 });
  return out;
}

function classify(word: string, raw: string, file: string, line: number, col: number): TokenKind {
  if (SYMBOLS.has(word)) return "symbol";
  if (NUMBER.test(word)) return "number";
  if (word.startsWith("?")) {
    if (NAME.test(word.slice(1))) return "var";
    throw new PlumblineError("parse", `expected a variable name after '?', found '${raw}'`, { file, line, col });
  }
  if (word.startsWith(":")) {
    if (NAME.test(word.slice(1))) return "keyword";
    throw new PlumblineError("parse", `expected a keyword name after ':', found '${raw}'`, { file, line, col });
  }
  if (NAME.test(word)) return "name";
  const bad = [...raw].find((ch) => !/[A-Za-z0-9_\-@.]/.test(ch)) ?? raw[0];
  throw new PlumblineError("parse", `unexpected character '${bad}' in '${raw}'`, { file, line, col });
}
