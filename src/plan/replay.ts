// Plan validation on the LIFTED model: each step's schema is instantiated with its objects
// and evaluated on a state of ground atoms, so a grounding bug cannot hide a bad plan.
import { PlumblineError } from "../util/errors.js";
import { typeSpecText, type ActionDecl, type Model } from "../pddl/index.js";
import { applyEffect, initialState, successorState, whyFails, type EffectResult } from "./evaluate.js";
import { stepText, type PlanStep } from "./plan-file.js";

export interface ReplayError {
  /** 1-based step number; length + 1 when the goal fails. */
  step: number;
  /** The failing step as written "(move a b)", or null for the goal. */
  action: string | null;
  /** "name": the step names no action of the model (unknown action or object, wrong arity or type). */
  kind: "precondition" | "goal" | "name";
  /** The failing literal (or smallest failing part), e.g. "(not (busy crane2))". */
  literal: string;
  message: string;
}

export interface ReplayTraceStep {
  step: number;
  action: string;
  cost: number;
}

export interface ReplayResult {
  valid: boolean;
  /** Cost of the steps replayed (all of them when valid), per DESIGN "Cost semantics". */
  cost: number;
  length: number;
  error: ReplayError | null;
  trace?: ReplayTraceStep[];
}

/** Checks names, arities, objects and types of every step before anything is replayed. */
export function resolveSteps(model: Model, steps: readonly PlanStep[], planFile: string): ActionDecl[] {
  const sym = model.symbols;
  return steps.map((st) => {
    const at = (p?: { line: number; col: number }) => ({ file: planFile, line: (p ?? st).line, col: (p ?? st).col });
    const a = sym.actions.get(st.name);
    if (!a) throw new PlumblineError("semantic", `unknown action '${st.name}' in plan step ${stepText(st)}`, at(st.namePos));
    if (a.params.length !== st.args.length) {
      throw new PlumblineError("semantic", `action '${a.name}' takes ${a.params.length} argument${a.params.length === 1 ? "" : "s"}, found ${st.args.length} in ${stepText(st)}`, at());
    }
    st.args.forEach((x, i) => {
      const id = sym.objectIndex.get(x);
      if (id === undefined) throw new PlumblineError("semantic", `unknown object '${x}' in plan step ${stepText(st)}`, at(st.argPos?.[i]));
      const p = a.params[i];
      if (!sym.isA(id, p.types)) {
        throw new PlumblineError("semantic", `object '${x}' is not of type ${typeSpecText(p.types)} (parameter ${p.name} of '${a.name}') in ${stepText(st)}`, at(st.argPos?.[i]));
      }
    });
    return a;
  });
}

export interface ReplayOptions {
  /** Record each step's cost in `trace`. */
  trace?: boolean;
}

/**
 * Replays `steps` from the initial state. A step that names no action of the model makes the plan
 * invalid (a verdict, like a failing precondition): the plan file itself was readable.
 */
export function replayPlan(model: Model, steps: readonly PlanStep[], planFile = "plan", opts: ReplayOptions = {}): ReplayResult {
  const decls: ActionDecl[] = [];
  for (let i = 0; i < steps.length; i++) {
    try {
      decls.push(resolveSteps(model, [steps[i]], planFile)[0]);
    } catch (e) {
      if (!(e instanceof PlumblineError)) throw e;
      const r: ReplayResult = { valid: false, cost: 0, length: steps.length, error: { step: i + 1, action: stepText(steps[i]), kind: "name", literal: stepText(steps[i]), message: e.message } };
      if (opts.trace) r.trace = [];
      return r;
    }
  }
  const unit = !model.domain.hasActionCosts;
  let s: ReadonlySet<string> = initialState(model);
  let cost = 0;
  const trace: ReplayTraceStep[] = [];
  const result = (valid: boolean, error: ReplayError | null): ReplayResult => {
    const r: ReplayResult = { valid, cost, length: steps.length, error };
    if (opts.trace) r.trace = trace;
    return r;
  };
  for (let i = 0; i < steps.length; i++) {
    const a = decls[i];
    const st = steps[i];
    const text = stepText(st);
    const b = new Map(a.params.map((p, j) => [p.name, st.args[j]]));
    const failed = a.pre ? whyFails(model, a.pre, b, s) : null;
    if (failed) {
      return result(false, {
        step: i + 1,
        action: text,
        kind: "precondition",
        literal: failed,
        message: `action ${i + 1} ${text}: precondition ${failed} does not hold`,
      });
    }
    const eff: EffectResult = { adds: new Set(), dels: new Set(), cost: 0 };
    applyEffect(model, a.effect, b, s, eff, `action ${i + 1} ${text}`);
    const c = unit ? 1 : eff.cost;
    cost += c;
    if (opts.trace) trace.push({ step: i + 1, action: text, cost: c });
    s = successorState(s, eff);
  }
  const g = whyFails(model, model.problem.goal, new Map(), s);
  if (g) {
    return result(false, {
      step: steps.length + 1,
      action: null,
      kind: "goal",
      literal: g,
      message: `after all ${steps.length} actions, goal ${g} does not hold`,
    });
  }
  return result(true, null);
}
