// The suffix route: "no plan of cost ≤ C − 1" asked with h real steps and a relaxed suffix, for
// growing h, so optimality can be proven far below a completeness threshold (relaxed-suffix-1).
import { readSuffixModel, type SuffixModel } from "../encode/index.js";
import type { HorizonReport } from "../horizon/index.js";
import { byLandmarks, finish, proven } from "./outcome.js";
import { InternalError } from "./plan-check.js";
import type { Run } from "./run.js";
import type { SatSession } from "./sat-session.js";
import type { OptimizeOutcome } from "./types.js";

/** Conflicts a query for a real plan within h steps may spend (after a relaxed model). */
const PLAN_CONFLICTS = 20_000;
/** Conflicts a query below the incumbent may spend while tightening the lower bound at h. */
const DESCENT_CONFLICTS = 10_000;

/** The horizons tried: 1, 2, …, 10, then about 20 % more each time. */
export function nextSuffixHorizon(h: number): number {
  return h < 10 ? h + 1 : Math.ceil(h * 1.2);
}

type HorizonResult = { kind: "done"; outcome: OptimizeOutcome } | { kind: "grow" } | { kind: "stop" };

/**
 * Grows h; at each h asks F_h(C − 1) (C the incumbent's cost) on one incremental solver with a
 * DRAT proof. Unsatisfiable: optimal (claim suffix-unsat). A model whose states reach the goal is
 * a cheaper plan; one that repeats a state before the goal gets that pair forbidden and is asked
 * again; otherwise h grows (after a short search for a real plan within h steps and a short
 * descent that raises the proven lower bound). Once h reaches the completeness threshold for C,
 * the threshold route takes over.
 */
export async function suffixRoute(run: Run, thresholdRoute: (run: Run, known?: HorizonReport) => Promise<OptimizeOutcome>): Promise<OptimizeOutcome> {
  const pairs: [number, number][] = [];
  let rep: HorizonReport | null = null;
  let h = 1;
  for (;;) {
    run.pollHelper();
    const lb = byLandmarks(run);
    if (lb) return lb;
    const stop = run.budget.stop() ?? (run.certifiedWindowOver() ? "certified" : null);
    if (stop) return finish(run, "feasible", null, stop, rep ? { horizon: rep } : {});
    const C = run.best!.cost;
    if (rep === null || rep.upperCost !== C) rep = run.horizonFor(C);
    if (Number.isFinite(rep.horizon) && h >= rep.horizon) {
      run.progress.say(`horizon ${h} reached the completeness threshold ${rep.horizonText} (${rep.winner}): proving there`);
      return thresholdRoute(run, rep);
    }
    const spec = run.spec(h, C, { pairs });
    const fit = run.fits(spec);
    if (!fit.ok) {
      run.notes.push(`the relaxed-suffix formula no longer fits: ${fit.why}`);
      await run.awaitHelper();
      return finish(run, "feasible", null, run.budget.stop() ?? "horizon-too-large", { horizon: rep });
    }
    const s = run.open(spec, true);
    run.progress.state.phase = `relaxed suffix after ${h} steps`;
    const r = await atHorizon(run, s, h, pairs, rep);
    run.close();
    if (r.kind === "done") return r.outcome;
    if (r.kind === "stop") return finish(run, "feasible", null, run.budget.stop() ?? (run.certifiedWindowOver() ? "certified" : "time"), { horizon: rep });
    h = nextSuffixHorizon(h);
  }
}

/** Reads a model, turning an encoder inconsistency into an internal error. */
function read(run: Run, s: SatSession, value: (v: number) => boolean): SuffixModel {
  try {
    return readSuffixModel(run.prepared.task, s.formula.encoding, value);
  } catch (e) {
    throw new InternalError(`decoding a model of the relaxed-suffix formula failed: ${(e as Error).message}`);
  }
}

async function atHorizon(run: Run, s: SatSession, h: number, pairs: [number, number][], rep: HorizonReport): Promise<HorizonResult> {
  const task = run.prepared.task;
  const enc = s.formula.encoding;
  const goalUnits = [...task.goal.map((g) => enc.factVar(h, g)), ...task.goalNeg.map((g) => -enc.factVar(h, g))];
  let target = Infinity; // the bound asked below the incumbent while tightening the lower bound
  let planSearched = false;
  for (;;) {
    if (run.pollHelper()) {
      target = Infinity;
      planSearched = false;
    }
    const C = run.best!.cost;
    const bound = Math.min(target, C - 1);
    if (bound < run.lower) return { kind: "grow" };
    const proving = bound === C - 1;
    const q = await run.ask(s, bound, proving ? undefined : DESCENT_CONFLICTS);
    if (q.interrupted) {
      if (run.certifiedWindowOver()) return { kind: "stop" };
      continue; // the helper's result arrived: ask again with it
    }
    if (q.status === "unknown") return proving || run.budget.stop() ? { kind: "stop" } : { kind: "grow" };
    if (q.status === "unsat") {
      if (!proving) {
        run.raiseLower(bound + 1, `no plan of cost ≤ ${bound}: relaxed suffix after ${h} steps`);
        return { kind: "grow" };
      }
      const proof = run.finishProof(s) ?? (await run.reproveBuiltin(s.formula, bound));
      if (proof === "sat") throw new InternalError("the built-in solver found a model the external solver called impossible");
      if (proof === null) return { kind: "stop" };
      return { kind: "done", outcome: proven(run, rep, s.formula, bound, proof, "suffix-unsat") };
    }
    const m = read(run, s, q.value!);
    if (m.kind === "plan") {
      run.improve(m.plan, `SAT at horizon ${h} (relaxed-suffix formula)`);
      target = Infinity;
      planSearched = false;
      continue;
    }
    if (m.repeats.length > 0) {
      for (const [t, u] of m.repeats) {
        if (pairs.some(([a, b]) => a === t && b === u)) throw new InternalError(`a model repeats the states at ${t} and ${u}, which the formula forbids`);
        s.extend(s.formula.addStatePair(t, u));
        pairs.push([t, u]);
      }
      continue;
    }
    if (m.cost > bound) throw new InternalError(`a model of "cost ≤ ${bound}" costs ${m.cost}`);
    // the helper's exhaustive search showed no cheaper plan exists: only the refutation is left
    if (run.incumbentOptimal) return { kind: "grow" };
    if (proving && !planSearched) {
      planSearched = true;
      const qp = await run.ask(s, bound, PLAN_CONFLICTS, goalUnits);
      if (qp.status === "sat") {
        const mp = read(run, s, qp.value!);
        if (mp.kind !== "plan") throw new InternalError("a model with the goal at the last step is not a plan");
        run.improve(mp.plan, `SAT at horizon ${h} (relaxed-suffix formula)`);
        target = Infinity;
        planSearched = false;
        continue;
      }
      if (run.budget.stop()) return { kind: "stop" };
    }
    target = m.cost - 1;
  }
}
