// A JSON reader that remembers where each value sits (line:col), so suite and task-list
// errors can name file:line:col — JSON.parse reports no position for many errors.
import { PlumblineError, type SourcePos } from "../util/errors.js";

export type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

export interface JsonSource {
  value: Json;
  file: string;
  /** Position of a value (object or array) or of a key's value inside an object. */
  posOf(container: object, key?: string | number): SourcePos;
  /** Position of a key itself (its opening quote). */
  keyPosOf(container: object, key: string): SourcePos;
}

export function parseJsonSource(text: string, file: string): JsonSource {
  let i = 0;
  const lineStarts = [0];
  for (let k = 0; k < text.length; k++) if (text.charCodeAt(k) === 10) lineStarts.push(k + 1);
  const posAt = (offset: number): SourcePos => {
    let lo = 0, hi = lineStarts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (lineStarts[mid] <= offset) lo = mid;
      else hi = mid - 1;
    }
    return { file, line: lo + 1, col: offset - lineStarts[lo] + 1 };
  };
  const containerPos = new WeakMap<object, number>();
  const memberPos = new WeakMap<object, Map<string, number>>();
  const keyPos = new WeakMap<object, Map<string, number>>();
  const fail = (expected: string): never => {
    const found = i >= text.length ? "end of file" : `'${text[i]}'`;
    throw new PlumblineError("parse", `invalid JSON: expected ${expected}, found ${found}`, posAt(Math.min(i, text.length)));
  };
  const ws = () => {
    while (i < text.length) {
      const c = text.charCodeAt(i);
      if (c === 32 || c === 9 || c === 10 || c === 13) i++;
      else break;
    }
  };
  const str = (): string => {
    if (text[i] !== '"') fail("a string");
    const start = i;
    i++;
    while (i < text.length && text[i] !== '"') {
      if (text.charCodeAt(i) < 0x20) fail("a closing '\"' (strings cannot span lines)");
      if (text[i] === "\\") {
        i++;
        if (text[i] === "u") {
          if (!/^[0-9a-fA-F]{4}$/.test(text.slice(i + 1, i + 5))) fail("four hex digits after \\u");
          i += 4;
        } else if (!'"\\/bfnrt'.includes(text[i] ?? "")) fail("an escape character");
      }
      i++;
    }
    if (i >= text.length) fail("a closing '\"'");
    i++;
    return JSON.parse(text.slice(start, i)) as string;
  };
  const value = (): Json => {
    ws();
    const c = text[i];
    if (c === "{") {
      const obj: { [k: string]: Json } = {};
      const members = new Map<string, number>();
      const keys = new Map<string, number>();
      containerPos.set(obj, i);
      memberPos.set(obj, members);
      keyPos.set(obj, keys);
      i++;
      ws();
      if (text[i] === "}") {
        i++;
        return obj;
      }
      for (;;) {
        ws();
        const keyAt = i;
        const k = str();
        if (members.has(k)) {
          i = keyAt;
          fail(`a key not used before in this object ("${k}" appears twice)`);
        }
        ws();
        if (text[i] !== ":") fail("':'");
        i++;
        ws();
        members.set(k, i);
        keys.set(k, keyAt);
        // defineProperty: a "__proto__" key must become an own property, as JSON.parse makes it
        Object.defineProperty(obj, k, { value: value(), enumerable: true, writable: true, configurable: true });
        ws();
        if (text[i] === ",") i++;
        else if (text[i] === "}") {
          i++;
          return obj;
        } else fail("',' or '}'");
      }
    }
    if (c === "[") {
      const arr: Json[] = [];
      const members = new Map<string, number>();
      containerPos.set(arr, i);
      memberPos.set(arr, members);
      i++;
      ws();
      if (text[i] === "]") {
        i++;
        return arr;
      }
      for (;;) {
        ws();
        members.set(String(arr.length), i);
        arr.push(value());
        ws();
        if (text[i] === ",") i++;
        else if (text[i] === "]") {
          i++;
          return arr;
        } else fail("',' or ']'");
      }
    }
    if (c === '"') return str();
    const m = /^-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/.exec(text.slice(i, i + 400));
    if (m && m[0] !== "-") {
      i += m[0].length;
      return Number(m[0]);
    }
    for (const [word, v] of [["true", true], ["false", false], ["null", null]] as const) {
      if (text.startsWith(word, i)) {
        i += word.length;
        return v;
      }
    }
    return fail("a JSON value");
  };
  const root = value();
  ws();
  if (i < text.length) fail("end of file");
  return {
    value: root,
    file,
    posOf(container: object, key?: string | number): SourcePos {
      const at = key === undefined ? undefined : memberPos.get(container)?.get(String(key));
      return posAt(at ?? containerPos.get(container) ?? 0);
    },
    keyPosOf(container: object, key: string): SourcePos {
      return posAt(keyPos.get(container)?.get(key) ?? containerPos.get(container) ?? 0);
    },
  };
}
