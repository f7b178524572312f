// Writes a small ground STRIPS Task (no conditional effects) as PDDL text with action costs,
// so random tasks can go through the whole pipeline, including lifted plan replay.
import type { Task } from "../../../src/ground/task.js";

const atom = (i: number) => `(f${i})`;

/** Domain and problem text whose grounding has the same states, transitions and costs. */
export function taskToPddl(task: Task): { domain: string; problem: string } {
  const preds = task.facts.map((_, i) => atom(i)).join(" ");
  const actions = task.actions.map((a, i) => {
    if (a.cond.length > 0) throw new Error("taskToPddl: conditional effects are not supported");
    const pre = [...a.pre.map(atom), ...a.preNeg.map((f) => `(not ${atom(f)})`)];
    const eff = [...a.add.map(atom), ...a.del.filter((f) => !a.add.includes(f)).map((f) => `(not ${atom(f)})`)];
    if (a.cost > 0) eff.push(`(increase (total-cost) ${a.cost})`);
    return `  (:action act${i}\n    :parameters ()\n    :precondition (and ${pre.join(" ")})\n    :effect (and ${eff.join(" ")}))`;
  });
  const domain = [
    "(define (domain random-task)",
    "  (:requirements :strips :negative-preconditions :action-costs)",
    `  (:predicates ${preds})`,
    "  (:functions (total-cost) - number)",
    ...actions,
    ")",
    "",
  ].join("\n");
  const goal = [...task.goal.map(atom), ...task.goalNeg.map((f) => `(not ${atom(f)})`)];
  const problem = [
    "(define (problem random-task-1)",
    "  (:domain random-task)",
    `  (:init (= (total-cost) 0) ${task.init.map(atom).join(" ")})`,
    `  (:goal (and ${goal.join(" ")}))`,
    "  (:metric minimize (total-cost)))",
    "",
  ].join("\n");
  return { domain, problem };
}
