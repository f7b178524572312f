// The workshop mechanics written directly (no PDDL): the oracle the committed instances'
// optimal costs come from, cross-checked in tests against Dijkstra on the grounded PDDL.
import type { ExplicitModel, Successor } from "../lib/explicit.js";
import type { WorkshopInstance } from "./generate.js";

/** Per machine the fitted tool (-1 bare); per job a bit mask of done operations; per job signed (0/1). */
interface State {
  fitted: number[];
  done: number[];
  signed: number[];
}

export function workshopModel(w: WorkshopInstance): ExplicitModel<State> {
  const needMask = w.jobs.map((j) => j.needs.reduce((m, o) => m | (1 << o), 0));
  const M = (i: number) => w.machines[i].name;
  const T = (i: number) => w.tools[i].name;
  return {
    init: { fitted: w.machines.map((m) => (m.initial === null ? -1 : m.initial)), done: w.jobs.map(() => 0), signed: w.jobs.map(() => 0) },
    key: (s) => `${s.fitted.join(",")}|${s.done.join(",")}|${s.signed.join("")}`,
    isGoal: (s) => s.signed.every((x) => x === 1) && (!w.bareAtEnd || s.fitted.every((t) => t === -1)),
    successors(s) {
      const succ: Successor<State>[] = [];
      const inRack = (t: number) => !s.fitted.includes(t);
      const withFitted = (m: number, t: number): State => {
        const fitted = [...s.fitted];
        fitted[m] = t;
        return { ...s, fitted };
      };
      w.machines.forEach((mc, m) => {
        const cur = s.fitted[m];
        if (cur === -1) {
          for (const t of mc.accepts) if (inRack(t)) succ.push({ action: `(fit ${M(m)} ${T(t)})`, cost: mc.fit, next: withFitted(m, t) });
          return;
        }
        for (const t of mc.accepts)
          if (inRack(t)) succ.push({ action: `(swap ${M(m)} ${T(cur)} ${T(t)})`, cost: mc.swap, next: withFitted(m, t) });
        succ.push({ action: `(strip ${M(m)})`, cost: 0, next: withFitted(m, -1) });
        w.jobs.forEach((job, j) => {
          for (const o of w.tools[cur].ops) {
            if (!(needMask[j] & (1 << o)) || s.done[j] & (1 << o)) continue;
            const done = [...s.done];
            done[j] |= 1 << o;
            succ.push({ action: `(run ${job.name} ${w.operations[o]} ${M(m)} ${T(cur)})`, cost: mc.run, next: { ...s, done } });
          }
        });
      });
      w.jobs.forEach((job, j) => {
        if (s.signed[j] === 0 && (s.done[j] & needMask[j]) === needMask[j]) {
          const signed = [...s.signed];
          signed[j] = 1;
          succ.push({ action: `(sign-off ${job.name})`, cost: 0, next: { ...s, signed } });
        }
      });
      return succ;
    },
  };
}
