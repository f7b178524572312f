// `plumbline encode DOMAIN PROBLEM --steps T`: the planning CNF the optimizer would solve, as
// DIMACS on stdout or in a file. Wiring only; the work is in src/optimize/formula.ts and src/encode.
import * as fs from "node:fs";
import type { Command } from "commander";
import { COST_SETTING_KEY } from "../../certify/index.js";
import { PARTS } from "../../encode/index.js";
import { groundFiles } from "../../ground/index.js";
import { costSetting, DEFAULT_ENCODING, estimateFormula, formulaId, OPTIMIZE_GROUNDING, planningPipeline, resolveEncoding, writeCanonicalDimacs } from "../../optimize/index.js";
import { PlumblineError } from "../../util/errors.js";
import { tempNameFor } from "../../util/files.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { checkOutputs } from "../output-paths.js";
import { deadlineFrom } from "../options.js";

interface EncodeCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  steps?: string;
  costBelow?: string;
  encoding?: string;
  output?: string;
  plain?: boolean;
  timeLimit?: string;
  suffix?: boolean;
}

/** Largest --steps accepted before grounding (the formula's size is checked after). */
const MAX_STEPS = 100_000;
/** Largest --cost-below accepted (the unary cost counter keeps one entry per cost value). */
const MAX_COST_BELOW = 10_000_000;
/** Largest formula written, as the optimizer builds (clauses, estimated before building). */
const MAX_CLAUSES = 30_000_000;

function wholeNumber(name: string, v: string | undefined, min: number, max: number): number | undefined {
  if (v === undefined) return undefined;
  const x = Number(v);
  if (!Number.isSafeInteger(x) || x < min) throw new PlumblineError("usage", `${name} expects a whole number ≥ ${min}, found '${v}'`);
  if (x > max) throw new PlumblineError("usage", `${name} ${v} is above the limit of ${max.toLocaleString("en")}`);
  return x;
}

export function registerEncode(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("encode")
      .description(
        "write the planning CNF (DIMACS) the optimizer builds: the task after goal-relevance pruning and analysis, unrolled to T steps, " +
          "with its cost encoding; with --cost-below C, unit clauses ask for a plan of cost ≤ C − 1. Satisfiable exactly when such a plan " +
          "of at most T steps exists. Comment lines name the parameters and where the fact and action variables are.",
      )
      .argument("<domain>", "PDDL domain file")
      .argument("<problem>", "PDDL problem file")
      .requiredOption("--steps <T>", "horizon: number of steps (every plan of at most T actions fits)")
      .option("--cost-below <C>", "add unit clauses for 'plan cost ≤ C − 1' (without it: any plan within T steps)")
      .option(
        "--encoding <id>",
        `step encoding seq-1, forall-1 or forall-2 (default ${DEFAULT_ENCODING}; the cost encoding is then chosen by size and the parts reach-1 and ` +
          "empty-steps-last-1 are included, as solve does), or a full formula id such as forall-1+cost-unary-1+reach-1+empty-steps-last-1 " +
          "(as a certificate records it; forall-1+cost-adder-1+empty-steps-last-1 is what solve built before cost-unary-1 and reach-1 existed)",
      )
      .option("--plain", "leave out the optional parts (reach-1 pruning, empty-steps-last-1 ordering): step encoding and cost encoding only")
      .option(
        "--suffix",
        "add the part relaxed-suffix-1: T real steps, then a delete-relaxed plan finishes (its cost counted); with --cost-below C the\n" +
          "formula is unsatisfiable only when no plan of cost ≤ C − 1 exists at all, at any length (the formula solve proves with)",
      )
      .option("-o, --output <file>", "write the CNF to this file (default: stdout)")
      .option("--time-limit <seconds>", "stop after this many seconds (exit 3; no file is written)"),
  ).action((domain: string, problem: string, opts: EncodeCliOptions) => {
    ctx.configure(opts);
    const steps = wholeNumber("--steps", opts.steps, 0, MAX_STEPS)!;
    const below = wholeNumber("--cost-below", opts.costBelow, 1, MAX_COST_BELOW);
    deadlineFrom(opts.timeLimit);
    checkOutputs([opts.output !== undefined ? { flag: "--output", path: opts.output, kind: "file" } : null], [domain, problem]);
    const { task } = groundFiles(domain, problem, OPTIMIZE_GROUNDING);
    const pipe = planningPipeline(task);
    const prepared = pipe.prepared;
    const choice = resolveEncoding(opts.encoding);
    if (opts.plain) choice.parts = [];
    if (opts.suffix && !choice.parts.includes("relaxed-suffix-1")) choice.parts = PARTS.filter((p) => p === "relaxed-suffix-1" || choice.parts.includes(p));
    const spec = pipe.spec(choice, steps, below ?? Infinity);
    const est = estimateFormula(prepared.task, spec);
    if (est.clauses > MAX_CLAUSES) {
      throw new PlumblineError("usage", `--steps ${steps}: the formula would have about ${Math.round(est.clauses).toLocaleString("en")} clauses, above the limit of ${MAX_CLAUSES.toLocaleString("en")} (choose fewer steps)`);
    }
    const f = pipe.formula(spec);
    const units = f.boundUnits(below === undefined ? Infinity : below - 1);
    const setting = costSetting(spec);
    const comments = [
      `plumbline ${formulaId(spec)} steps=${steps} ${COST_SETTING_KEY[setting.name]}=${setting.value} mutexGroups=${spec.mutexGroups.length}${below === undefined ? "" : ` query: cost <= ${below - 1}`}`,
      `task after pruning: ${prepared.task.facts.length} facts, ${prepared.task.actions.length} actions; fact f at time t = 1 + t*${prepared.task.facts.length} + f, action a in step s = ${1 + (steps + 1) * prepared.task.facts.length} + (s-1)*${prepared.task.actions.length} + a`,
    ];
    const header = comments.map((c) => `c ${c}\n`).join("");
    if (opts.output) {
      const tmp = tempNameFor(opts.output);
      const fd = fs.openSync(tmp, "w");
      try {
        fs.writeSync(fd, header);
        writeCanonicalDimacs(f, units, (s) => fs.writeSync(fd, s));
        fs.closeSync(fd);
        fs.renameSync(tmp, opts.output);
      } catch (e) {
        try {
          fs.closeSync(fd);
        } catch {
          /* already closed */
        }
        fs.rmSync(tmp, { force: true });
        throw new PlumblineError("io", `cannot write ${opts.output}: ${(e as Error).message}`);
      }
    } else if (!ctx.json) {
      ctx.io.stdout.write(header);
      writeCanonicalDimacs(f, units, (s) => ctx.io.stdout.write(s));
    }
    ctx.note(`${f.numVars} variables, ${f.numClauses + units.length} clauses${opts.output ? ` written to ${opts.output}` : ""}`);
    ctx.result({ encoding: formulaId(spec), steps, costBelow: below ?? null, variables: f.numVars, clauses: f.numClauses + units.length, output: opts.output ?? null, stats: f.encoding.stats });
  });
}
