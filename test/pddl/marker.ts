// Test helper: a "«" in a test input marks where an error must be reported; it is removed
// and turned into the expected 1-based line and column.
import { expect } from "vitest";
import { PlumblineError } from "../../src/util/errors.js";

export interface Marked {
  text: string;
  line: number;
  col: number;
}

export function marked(src: string): Marked {
  const i = src.indexOf("«");
  if (i < 0) throw new Error("test input has no « marker");
  const before = src.slice(0, i);
  const lines = before.split("\n");
  return { text: src.slice(0, i) + src.slice(i + 1), line: lines.length, col: lines[lines.length - 1].length + 1 };
}

/** Runs `fn`, expecting a PlumblineError with this code, message and position. */
export function expectPlumblineError(fn: () => unknown, want: { code: string; message: RegExp; file: string; line: number; col: number }): PlumblineError {
  let caught: unknown;
  try {
    fn();
  } catch (e) {
    caught = e;
  }
  expect(caught, "expected a PlumblineError").toBeInstanceOf(PlumblineError);
  const e = caught as PlumblineError;
  expect(e.detail).toMatch(want.message);
  expect(e.code).toBe(want.code);
  expect(e.pos).toEqual({ file: want.file, line: want.line, col: want.col });
  expect(e.message.startsWith(`${want.file}:${want.line}:${want.col}: `)).toBe(true);
  return e;
}
