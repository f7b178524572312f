// The type hierarchy of a domain: which types exist, and each type's ancestors, so that
// "object o is a t" and "the objects of type t" can be answered for grounding and replay.
import { PlumblineError, type SourcePos } from "../util/errors.js";
import { OBJECT_TYPE, type TypeDecl } from "./ast.js";

export class TypeTable {
  private readonly parents = new Map<string, string[]>();
  private readonly ancestorCache = new Map<string, ReadonlySet<string>>();

  constructor(decls: readonly TypeDecl[]) {
    this.parents.set(OBJECT_TYPE, []);
    const declaredAt = new Map<string, SourcePos>();
    for (const d of decls) {
      if (d.name === OBJECT_TYPE) continue; // `object` is the root; ignore re-declarations
      const ps = this.parents.get(d.name) ?? [];
      for (const p of d.parents) if (!ps.includes(p)) ps.push(p);
      this.parents.set(d.name, ps);
      if (!declaredAt.has(d.name)) declaredAt.set(d.name, d.pos);
    }
    // A parent used but never declared is taken as a direct subtype of `object`.
    for (const ps of [...this.parents.values()]) for (const p of ps) if (!this.parents.has(p)) this.parents.set(p, [OBJECT_TYPE]);
    for (const [t, ps] of this.parents) if (t !== OBJECT_TYPE && ps.length === 0) ps.push(OBJECT_TYPE);
    // cycle check (depth-first, colours)
    const state = new Map<string, 1 | 2>();
    const visit = (t: string, path: string[]): void => {
      const s = state.get(t);
      if (s === 2) return;
      if (s === 1) {
        const cyc = [...path.slice(path.indexOf(t)), t].join(" - ");
        throw new PlumblineError("semantic", `type hierarchy has a cycle: ${cyc}`, declaredAt.get(t));
      }
      state.set(t, 1);
      for (const p of this.parents.get(t) ?? []) visit(p, [...path, t]);
      state.set(t, 2);
    };
    for (const t of this.parents.keys()) visit(t, []);
  }

  has(t: string): boolean {
    return this.parents.has(t);
  }

  /** The type itself, all its super-types, and `object`. */
  ancestors(t: string): ReadonlySet<string> {
    let a = this.ancestorCache.get(t);
    if (!a) {
      const s = new Set<string>([t, OBJECT_TYPE]);
      const stack = [t];
      while (stack.length) {
        for (const p of this.parents.get(stack.pop() as string) ?? []) {
          if (!s.has(p)) {
            s.add(p);
            stack.push(p);
          }
        }
      }
      a = s;
      this.ancestorCache.set(t, a);
    }
    return a;
  }

  /** Throws unless every type of `spec` is declared. */
  check(spec: readonly string[], pos: SourcePos): void {
    for (const t of spec) if (!this.has(t)) throw new PlumblineError("semantic", `unknown type '${t}'`, pos);
  }
}

/** Readable form of a type spec: `t` or `(either t u)`. */
export function typeSpecText(spec: readonly string[]): string {
  return spec.length === 1 ? spec[0] : `(either ${spec.join(" ")})`;
}
