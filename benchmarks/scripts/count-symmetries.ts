// `npm run bench:symmetries -- DIR`: how many pairs of interchangeable objects each instance has —
// object transpositions that map the ground task onto itself (init, goals, every action and its cost).
// Usage: npm run bench:symmetries -- DIR [--seconds S]
//   DIR          a folder of PDDL instances, as `plumbline bench` reads it (domain.pddl per folder, or
//                domain-NN.pddl / problem-NN.pddl pairs)
//   --seconds S  time per instance for trying pairs (default 20); a row says when it ran out
// Prints instance, ground actions, objects, symmetric pairs and the sizes of the classes they form.
// It measures what symmetry breaking (issue 12, lever 4) could use; nothing in the tool needs it.
import { readFileSync } from "node:fs";
import { resolve } from "node:path";
import { instancesInDirectory } from "../../src/bench/suite-dir.js";
import { ground, type Task } from "../../src/ground/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";

const args = process.argv.slice(2);
const dir = args.find((a) => !a.startsWith("--"));
const si = args.indexOf("--seconds");
const seconds = si >= 0 ? Number(args[si + 1]) : 20;
if (!dir || !(seconds > 0)) {
  console.error("usage: npm run bench:symmetries -- DIR [--seconds S]");
  process.exit(2);
}

const sameSorted = (a: readonly number[], b: readonly number[]) => a.length === b.length && a.every((x, i) => x === b[i]);
const swapWords = (s: string, o1: string, o2: string) => s.replace(/[^\s()]+/g, (w) => (w === o1 ? o2 : w === o2 ? o1 : w));

/** Is swapping objects o1 and o2 (in fact and action names) an automorphism of the task? */
function isSymmetry(task: Task, factId: Map<string, number>, actionId: Map<string, number>, o1: string, o2: string): boolean {
  const fmap = task.facts.map((f) => factId.get(swapWords(f, o1, o2)) ?? -1);
  if (fmap.includes(-1)) return false;
  const img = (xs: readonly number[]) => xs.map((x) => fmap[x]).sort((x, y) => x - y);
  if (!sameSorted(img(task.init), task.init) || !sameSorted(img(task.goal), task.goal) || !sameSorted(img(task.goalNeg), task.goalNeg)) return false;
  for (const a of task.actions) {
    const b = task.actions[actionId.get(swapWords(a.name, o1, o2)) ?? -1];
    if (!b || b.cost !== a.cost || !sameSorted(img(a.pre), b.pre) || !sameSorted(img(a.preNeg), b.preNeg) || !sameSorted(img(a.add), b.add) || !sameSorted(img(a.del), b.del)) return false;
    if (a.cond.length !== b.cond.length) return false;
    const key = (c: Task["actions"][number]["cond"][number], m: (xs: readonly number[]) => number[]) => JSON.stringify([m(c.cond), m(c.condNeg), m(c.add), m(c.del)]);
    const mine = a.cond.map((c) => key(c, img)).sort();
    const theirs = b.cond.map((c) => key(c, (xs) => [...xs])).sort();
    if (mine.some((k, i) => k !== theirs[i])) return false;
  }
  return true;
}

const { instances } = instancesInDirectory(resolve(dir), dir);
console.log(["instance", "actions", "objects", "pairs", "classes", "note"].join("\t"));
let withAny = 0;
for (const inst of instances) {
  const model = modelFromTexts(readFileSync(inst.domainFile, "utf8"), inst.domainFile, readFileSync(inst.problemFile, "utf8"), inst.problemFile);
  const task = ground(model);
  const objects = [...new Set(task.actions.flatMap((a) => a.args))].sort();
  const factId = new Map(task.facts.map((f, i) => [f, i]));
  const actionId = new Map(task.actions.map((a, i) => [a.name, i]));
  const deadline = Date.now() + seconds * 1000;
  const classes: string[][] = [];
  let pairs = 0;
  let note = "";
  for (let i = 0; i < objects.length && !note; i++) {
    for (let j = i + 1; j < objects.length; j++) {
      if (Date.now() > deadline) {
        note = `stopped after ${seconds} s`;
        break;
      }
      if (!isSymmetry(task, factId, actionId, objects[i], objects[j])) continue;
      pairs++;
      const c = classes.find((k) => k.includes(objects[i]) || k.includes(objects[j]));
      if (c === undefined) classes.push([objects[i], objects[j]]);
      else for (const o of [objects[i], objects[j]]) if (!c.includes(o)) c.push(o);
    }
  }
  if (pairs > 0) withAny++;
  console.log([inst.instance, task.actions.length, objects.length, pairs, classes.map((c) => c.length).join("+") || "-", note].join("\t"));
}
console.log(`# ${withAny} of ${instances.length} instances have a pair of interchangeable objects`);
