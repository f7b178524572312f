// Numeric view of a checked model for grounding: predicate and object ids, which predicates
// are static (no action changes them), and the initial facts as id tuples.
import { PlumblineError } from "../util/errors.js";
import type { Effect, Model } from "../pddl/index.js";

/** Argument positions are bit masks in the join indexes. */
export const MAX_ARITY = 30;

export interface InitFact {
  pred: number;
  args: number[];
}

export interface World {
  model: Model;
  predNames: string[];
  predIndex: Map<string, number>;
  predArity: number[];
  /** True for predicates no action effect mentions: their truth is fixed by :init. */
  isStatic: boolean[];
  nObjects: number;
  init: InitFact[];
  /** Keys "pred:a,b" of initial facts of static predicates. */
  staticTrue: Set<string>;
}

export function factKey(pred: number, args: readonly number[]): string {
  return `${pred}:${args.join(",")}`;
}

function effectPreds(e: Effect, out: Set<string>): void {
  switch (e.kind) {
    case "add":
    case "del":
      out.add(e.atom.pred);
      return;
    case "and":
      for (const x of e.effects) effectPreds(x, out);
      return;
    case "forall":
    case "when":
      effectPreds(e.body, out);
      return;
    case "cost":
      return;
  }
}

export function buildWorld(model: Model): World {
  const sym = model.symbols;
  const predNames = [...sym.predicateNames];
  const predIndex = new Map(predNames.map((p, i) => [p, i]));
  const predArity = predNames.map((p) => {
    const d = sym.predicates.get(p)!;
    if (d.params.length > MAX_ARITY) throw new PlumblineError("unsupported", `predicate '${p}' has ${d.params.length} arguments; at most ${MAX_ARITY} are supported`, d.pos);
    return d.params.length;
  });
  const changed = new Set<string>();
  for (const a of model.domain.actions) effectPreds(a.effect, changed);
  const isStatic = predNames.map((p) => !changed.has(p));
  const init: InitFact[] = [];
  const seen = new Set<string>();
  const staticTrue = new Set<string>();
  for (const a of model.problem.init) {
    const pred = predIndex.get(a.pred)!;
    const args = a.args.map((x) => sym.objectIndex.get(x)!);
    const k = factKey(pred, args);
    if (seen.has(k)) continue;
    seen.add(k);
    init.push({ pred, args });
    if (isStatic[pred]) staticTrue.add(k);
  }
  return { model, predNames, predIndex, predArity, isStatic, nObjects: sym.objects.length, init, staticTrue };
}
