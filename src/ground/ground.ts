// The grounding pipeline: normalise the lifted actions, explore relaxed reachability,
// instantiate ground actions, compile the goal, fold constants, optionally prune by relevance.
import { loadModel, type Model } from "../pddl/index.js";
import { dropSubsumed, instantiate, FactLookup } from "./instantiate.js";
import { normalizeAction } from "./normalize.js";
import { reach } from "./reach.js";
import { compileGoal } from "./goal.js";
import { draftToTask, foldConstants } from "./fold.js";
import { pruneIrrelevant } from "./relevance.js";
import { buildWorld } from "./world.js";
import type { Draft } from "./draft.js";
import type { CostModel, Task } from "./task.js";

export interface GroundOptions {
  /** Goal-relevance (backward) pruning; default false. */
  relevance?: boolean;
}

/** "action-costs" when some action has an (increase (total-cost) …) effect, else "unit". */
export function costModelOf(model: Model): CostModel {
  return model.domain.hasActionCosts ? "action-costs" : "unit";
}

/**
 * A note for people when the model does not say plainly what is minimised: no action costs (every
 * action counts 1, so the cheapest plan is the shortest), or action costs without
 * `(:metric minimize (total-cost))` in the problem (total-cost is minimised anyway). Null otherwise.
 */
export function costModelNote(model: Model): string | null {
  if (!model.domain.hasActionCosts) return "the domain has no action costs: every action counts 1, so plumbline minimises the number of actions (plan length)";
  if (model.problem.metric === null) return "the problem has no (:metric minimize (total-cost)): plumbline minimises total-cost, the sum of the action costs, anyway";
  return null;
}

export function ground(model: Model, opts: GroundOptions = {}): Task {
  const w = buildWorld(model);
  const lifted = model.domain.actions.map((a, i) => normalizeAction(w, a, i));
  const r = reach(w, lifted);
  const costModel = costModelOf(model);
  const names = new FactLookup(w, r);
  const draft: Draft = {
    domainName: model.domain.name,
    problemName: model.problem.name,
    facts: r.factPred.map((_, f) => names.name(f)),
    factKeys: r.factPred.map((p, f) => [p, ...r.factArgs[f]]),
    init: [],
    goal: [],
    goalNeg: [],
    actions: dropSubsumed(instantiate(w, lifted, r, costModel)),
  };
  for (const f of w.init) {
    if (w.isStatic[f.pred]) continue;
    draft.init.push(r.gid[f.pred][r.sets[f.pred].find(f.args)]);
  }
  compileGoal(w, r, draft);
  foldConstants(draft);
  // folding can make one disjunct's conditions a subset of another's
  draft.actions = dropSubsumed(draft.actions);
  const task = draftToTask(draft, costModel);
  return opts.relevance ? pruneIrrelevant(task) : task;
}

export function groundFiles(domainPath: string, problemPath: string, opts: GroundOptions = {}): { model: Model; task: Task; seconds: number } {
  const t0 = performance.now();
  const model = loadModel(domainPath, problemPath);
  const task = ground(model, opts);
  return { model, task, seconds: (performance.now() - t0) / 1000 };
}
