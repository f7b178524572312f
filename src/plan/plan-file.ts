// Plan files: one `(action object …)` per line with `;` comments, read with positions for
// error messages (also the timestamped form `0: (drive t1 a b) [1]`) and written in our layout.
import { PlumblineError } from "../util/errors.js";
import { readSexprs } from "../pddl/index.js";

export interface PlanStep {
  /** Action (schema) name, lower case. */
  name: string;
  /** Object names, lower case. */
  args: string[];
  /** Position of the step's '('. */
  line: number;
  col: number;
  /** Positions of the name and of each argument (when read from a file). */
  namePos?: { line: number; col: number };
  argPos?: Array<{ line: number; col: number }>;
}

/**
 * The common timestamped line form `TIME: (action objects…) [DURATION]`: the time prefix and the
 * duration are blanked out (same columns, so positions stay right); the step order is the line order.
 */
const TIMESTAMPED = /^(\s*)(\d+(?:\.\d+)?\s*:\s*)(\([^;]*?\))(\s*\[[^\]\n;]*\])?/;

function blankTimestamps(text: string): string {
  return text
    .split("\n")
    .map((line) => {
      const m = TIMESTAMPED.exec(line);
      if (!m) return line;
      const lead = m[1] + " ".repeat(m[2].length) + m[3] + " ".repeat(m[4]?.length ?? 0);
      return lead + line.slice(m[0].length);
    })
    .join("\n");
}

/**
 * Reads a plan: one `(action object …)` per line, `;` comments (the header of our layout
 * and the cost lines of files older plumbline versions wrote included), or lines `0: (action object …) [1]`; `file` is used in error positions.
 */
export function parsePlan(text: string, file: string): PlanStep[] {
  const { nodes } = readSexprs(blankTimestamps(text), file);
  const steps: PlanStep[] = [];
  for (const n of nodes) {
    if (n.kind !== "list") throw new PlumblineError("parse", `expected a plan step '(action object …)', found '${n.text}'`, { file, line: n.line, col: n.col });
    const head = n.items[0];
    if (!head) throw new PlumblineError("parse", "expected an action name in '()'", { file, line: n.line, col: n.col });
    if (head.kind !== "atom" || head.tok !== "name") {
      const found = head.kind === "atom" ? `'${head.text}'` : "'('";
      throw new PlumblineError("parse", `expected an action name, found ${found}`, { file, line: head.line, col: head.col });
    }
    const args: string[] = [];
    const argPos: Array<{ line: number; col: number }> = [];
    for (const a of n.items.slice(1)) {
      if (a.kind !== "atom" || a.tok !== "name") {
        const found = a.kind === "atom" ? `'${a.text}'` : "'('";
        throw new PlumblineError("parse", `expected an object name, found ${found}`, { file, line: a.line, col: a.col });
      }
      args.push(a.text);
      argPos.push({ line: a.line, col: a.col });
    }
    steps.push({ name: head.text, args, line: n.line, col: n.col, namePos: { line: head.line, col: head.col }, argPos });
  }
  return steps;
}

/** "(name a b)" as written in plans and ground action names. */
export function stepText(s: { name: string; args: readonly string[] }): string {
  return `(${[s.name, ...s.args].join(" ")})`;
}

/** Writes plan steps only, one `(action object …)` per line in lower case (no header). */
export function formatPlan(steps: ReadonlyArray<{ name: string; args: readonly string[] } | string>): string {
  return steps.map((s) => (typeof s === "string" ? s.toLowerCase() : stepText({ name: s.name.toLowerCase(), args: s.args.map((a) => a.toLowerCase()) }))).join("\n") + "\n";
}

/** What the header of a plan file states (README "Plan files"). */
export interface PlanFileInfo {
  cost: number;
  /** `optimal` (proven) or `feasible` (a plan, optimality not proven). */
  status: "optimal" | "feasible";
  /** How optimality was proven (a proof word of README "Words plumbline uses"), null when it was not. */
  proof: string | null;
  /** "unit" when the model has no action costs (every action counts 1). */
  costModel?: "action-costs" | "unit";
  /** Further comment lines (where the plan comes from), written after the fixed lines. */
  notes?: readonly string[];
}

/** The header every plan file plumbline writes starts with; `; plumbline plan` is its first line. */
export const PLAN_FILE_MARK = "; plumbline plan";

/**
 * A plan file in plumbline's layout: a header of `; key: value` comment lines — cost, actions,
 * status, proof — then one `(action object …)` per line. The same from every command that writes
 * a plan (solve, search, the certificate's plan.txt, rejudge), so people and scripts read one form.
 */
export function planFileText(steps: ReadonlyArray<{ name: string; args: readonly string[] } | string>, info: PlanFileInfo): string {
  const head = [
    PLAN_FILE_MARK,
    `; cost: ${info.cost}${info.costModel === "unit" ? " (the model has no action costs: every action counts 1)" : ""}`,
    `; actions: ${steps.length}`,
    `; status: ${info.status}`,
    `; proof: ${info.proof ?? "none (optimality not proven)"}`,
    ...(info.notes ?? []).map((n) => `; ${n}`),
  ];
  return head.join("\n") + "\n" + (steps.length ? formatPlan(steps) : "");
}

/** What a plan file's comments state: the header of our layout, or the cost line of a file an older plumbline wrote. */
export interface PlanFileHeader {
  cost: number | null;
  actions: number | null;
  status: string | null;
  proof: string | null;
}

/** Reads the stated cost, actions, status and proof of a plan file (null where it states none). */
export function readPlanFileHeader(text: string): PlanFileHeader {
  const field = (key: string) => new RegExp(`^\\s*;\\s*${key}:\\s*(\\S+)`, "im").exec(text)?.[1] ?? null;
  const num = (v: string | null) => (v !== null && /^-?\d+(\.\d+)?$/.test(v) ? Number(v) : null);
  const older = /^\s*;\s*cost\s*=\s*(-?\d+(?:\.\d+)?)/im.exec(text);
  return { cost: num(field("cost")) ?? (older ? Number(older[1]) : null), actions: num(field("actions")), status: field("status"), proof: field("proof") };
}
