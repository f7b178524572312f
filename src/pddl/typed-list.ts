// Parses PDDL typed lists (`a b - t  c - (either u v)  d`) of names or variables,
// the syntax shared by :types, :constants, :objects, parameters and quantifiers.
import { OBJECT_TYPE, type TypedName } from "./ast.js";
import { Cursor, errorAt, headOf, posOf } from "./cursor.js";
import { describe, type SNode } from "./sexpr.js";

/** Reads a type after '-': a name or `(either t1 t2 …)`. */
export function parseTypeSpec(c: Cursor): string[] {
  const n = c.peek();
  if (n && n.kind === "atom" && n.tok === "name") {
    c.next("a type");
    return [n.text];
  }
  if (n && n.kind === "list") {
    const h = headOf(n);
    if (h && h.text === "either") {
      c.next("a type");
      const inner = new Cursor(c.file, n, 1);
      const types: string[] = [];
      while (!inner.atEnd()) types.push(inner.name("a type name in (either …)").text);
      if (types.length === 0) throw inner.fail("a type name in (either …)");
      return [...new Set(types)];
    }
  }
  throw c.fail("a type name or (either …) after '-'", n);
}

/**
 * Parses the rest of `c` as a typed list; `kind` says whether the entries are plain
 * names or ?variables. Untyped entries get type `object`.
 */
export function parseTypedList(c: Cursor, kind: "name" | "var", what: string): TypedName[] {
  const out: TypedName[] = [];
  let pending: TypedName[] = [];
  while (!c.atEnd()) {
    const n = c.peek() as SNode;
    if (n.kind === "atom" && n.tok === "symbol" && n.text === "-") {
      if (pending.length === 0) throw errorAt(c.file, n, `expected ${what} before '-', found '-'`);
      c.next("'-'");
      const at = c.peek();
      const types = parseTypeSpec(c);
      const typePos = posOf(c.file, at as SNode);
      for (const p of pending) {
        p.types = types;
        p.typePos = typePos;
      }
      out.push(...pending);
      pending = [];
      continue;
    }
    if (n.kind === "atom" && n.tok === kind) {
      c.next(what);
      pending.push({ name: n.text, types: [OBJECT_TYPE], pos: posOf(c.file, n) });
      continue;
    }
    throw errorAt(c.file, n, `expected ${what} or '-', found ${describe(n)}`);
  }
  out.push(...pending);
  return out;
}
