// Prints atoms and formulas back as readable PDDL text, substituting bound variables,
// for messages such as "precondition (not (busy crane2)) does not hold".
import type { Formula, Term, TypedName } from "./ast.js";
import { typeSpecText } from "./types.js";

/** "(pred a b)"; a nullary atom prints as "(pred)". */
export function atomText(pred: string, args: readonly string[]): string {
  return args.length ? `(${pred} ${args.join(" ")})` : `(${pred})`;
}

export function termText(t: Term, binding?: ReadonlyMap<string, string>): string {
  return t.kind === "var" ? (binding?.get(t.name) ?? t.name) : t.name;
}

function varsText(vs: readonly TypedName[]): string {
  return vs.map((v) => `${v.name} - ${typeSpecText(v.types)}`).join(" ");
}

export function formulaText(f: Formula, binding?: ReadonlyMap<string, string>): string {
  switch (f.kind) {
    case "atom":
      return atomText(f.pred, f.args.map((a) => termText(a, binding)));
    case "eq":
      return `(= ${termText(f.left, binding)} ${termText(f.right, binding)})`;
    case "not":
      return `(not ${formulaText(f.arg, binding)})`;
    case "and":
    case "or":
      return f.args.length ? `(${f.kind} ${f.args.map((a) => formulaText(a, binding)).join(" ")})` : `(${f.kind})`;
    case "imply":
      return `(imply ${formulaText(f.left, binding)} ${formulaText(f.right, binding)})`;
    case "exists":
    case "forall": {
      // quantified variables shadow outer bindings
      let inner = binding;
      if (binding) {
        const m = new Map(binding);
        for (const v of f.vars) m.delete(v.name);
        inner = m;
      }
      return `(${f.kind} (${varsText(f.vars)}) ${formulaText(f.body, inner)})`;
    }
  }
}
