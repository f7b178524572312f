// Brute-force lifted semantics for tests: every action instance over typed objects checked
// directly on the PDDL syntax tree, to compare the grounder's Task against.
import { cartesian, type Model } from "../../src/pddl/index.js";
import { applyEffect, holds, successorState, type EffectResult } from "../../src/plan/index.js";

export interface LiftedMove {
  name: string;
  next: Set<string>;
  cost: number;
}

/** All applicable action instances in `s`, found by trying every typed argument tuple. */
export function liftedMoves(model: Model, s: ReadonlySet<string>): LiftedMove[] {
  const sym = model.symbols;
  const out: LiftedMove[] = [];
  for (const a of model.domain.actions) {
    const doms = a.params.map((p) => sym.membersOf(p.types).map((o) => sym.objects[o]));
    for (const args of cartesian(doms)) {
      const b = new Map(a.params.map((p, i) => [p.name, args[i]]));
      if (!a.pre || holds(model, a.pre, b, s)) {
        const eff: EffectResult = { adds: new Set(), dels: new Set(), cost: 0 };
        applyEffect(model, a.effect, b, s, eff, a.name);
        out.push({ name: `(${[a.name, ...args].join(" ")})`, next: successorState(s, eff), cost: model.domain.hasActionCosts ? eff.cost : 1 });
      }
    }
  }
  return out;
}
