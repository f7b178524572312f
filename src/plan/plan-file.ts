// Plan files: one `(action object …)` per line with `;` comments, read with positions for
// error messages and written in the same form (lower case, optional trailing comment).
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

/** Reads a plan; `file` is used in error positions. */
export function parsePlan(text: string, file: string): PlanStep[] {
  const { nodes } = readSexprs(text, file);
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

/** Writes a plan, one step per line, with an optional trailing comment (e.g. "cost = 12 (optimal)"). */
export function formatPlan(steps: ReadonlyArray<{ name: string; args: readonly string[] }>, comment?: string): string {
  const lines = steps.map((s) => stepText({ name: s.name.toLowerCase(), args: s.args.map((a) => a.toLowerCase()) }));
  if (comment) for (const l of comment.split("\n")) lines.push(`; ${l}`);
  return lines.join("\n") + "\n";
}
