// What `plumbline --help` shows: the commands in groups, the main job first, each with a one-line
// summary; and the exit-code paragraph every command's own --help ends with (codes 2 and 4 included).
import type { Command } from "commander";

/** The commands by group, in the order the top-level help lists them, with their one-line summaries. */
export const COMMAND_GROUPS: ReadonlyArray<{ heading: string; commands: ReadonlyArray<[name: string, summary: string]> }> = [
  {
    heading: "The main job:",
    commands: [
      ["solve", "find a cost-optimal plan and prove it optimal; --certificate DIR writes a certificate"],
      ["audit", "re-check certificates from scratch, trusting nothing but their PDDL files"],
      ["compare", "judge another planner's plan: invalid, optimal, suboptimal or unknown"],
      ["rejudge", "is a certificate's plan still valid, and still optimal, in a changed model?"],
    ],
  },
  {
    heading: "Plans and models:",
    commands: [
      ["replay", "replay a plan on the model: is it valid, what does it cost, where does it fail"],
      ["search", "find a plan by explicit-state search (A*, or greedy best-first)"],
      ["ground", "ground a model and print its size (facts, actions, zero-cost actions)"],
    ],
  },
  {
    heading: "Bounds, formulas and proofs:",
    commands: [
      ["horizon", "completeness thresholds by every method, with the numbers behind each"],
      ["measure", "exact diameters, optimal cost and plan length of a small task"],
      ["encode", "write the planning formula (DIMACS CNF) for a number of steps"],
      ["sat", "run the built-in SAT solver on a DIMACS file (DRAT proof on request)"],
      ["check-proof", "check a DRAT or LRAT proof that a DIMACS formula is unsatisfiable"],
    ],
  },
  {
    heading: "Benchmarks and reports:",
    commands: [
      ["bench", "run a benchmark suite: tables, charts and an HTML report"],
      ["report", "write the HTML report of a bench folder or of a certificate"],
    ],
  },
];

/**
 * Each command's exit codes 0, 1 and 3 (1 only where the command gives negative verdicts; 3 defaults
 * to "interrupted, or a limit was reached"); 2 and 4 mean the same for every command.
 */
export const COMMAND_EXIT_CODES: Readonly<Record<string, { 0: string; 1?: string; 3?: string }>> = {
  solve: { 0: "status optimal or unsolvable (proven)", 3: "a limit was reached: status feasible or unknown (the best plan is still written)" },
  audit: {
    0: "every certificate valid",
    1: "a certificate rejected",
    3: "a certificate unfinished (a limit stopped its audit); precedence: 1, then 2 (a certificate unreadable, or no certificate under a PATH), then 3",
  },
  compare: { 0: "verdict optimal", 1: "verdict invalid or suboptimal", 3: "verdict unknown (a limit was reached before the optimum was proven)" },
  rejudge: { 0: "unchanged (and the certificate audits valid) or still-optimal", 1: "plan-invalid, cost-changed, cheaper-plan, or unchanged but the audit rejects", 3: "undecided (a limit stopped the proof)" },
  replay: { 0: "the plan is valid", 1: "the plan is invalid" },
  search: { 0: "a plan found (status optimal or feasible), or no plan exists (status unsolvable, proven)", 3: "a limit was reached (status unknown)" },
  ground: { 0: "grounded" },
  horizon: { 0: "thresholds computed", 3: "a limit was reached" },
  measure: { 0: "measured", 3: "more reachable states than --max-reachable-states, or a limit was reached" },
  encode: { 0: "formula written" },
  sat: { 0: "an answer (SATISFIABLE or UNSATISFIABLE)", 3: "a limit was reached (UNKNOWN)" },
  "check-proof": { 0: "proof valid", 1: "proof rejected", 3: "a limit was reached before the check ended" },
  bench: { 0: "done", 1: "configurations contradict each other, or an audit rejected a certificate (a bug: see the report)", 3: "interrupted (re-run the same command to finish)" },
  report: { 0: "report written", 1: "configurations contradict each other, or the audit rejected the certificate" },
};

/** The meaning of exit codes 2 and 4, the same for every command. */
export const EXIT_BAD_INPUT = "bad input or usage (the message names file:line:col where it can)";
export const EXIT_INTERNAL_TEXT = "an internal error (a bug in plumbline; please report it)";

/** The exit codes of the whole tool, for the top-level help (README "Commands" says the same). */
export const EXIT_CODES_TEXT =
  `Exit codes: 0 success or a positive verdict, 1 a negative verdict (plan invalid, audit rejected, proof rejected), 2 ${EXIT_BAD_INPUT}, ` +
  `3 a limit was reached before an answer (the best result so far is still written), 4 ${EXIT_INTERNAL_TEXT}.`;

/** Gives the top-level help its groups, order and summaries; a command missing from COMMAND_GROUPS is a bug. */
export function groupCommands(program: Command): void {
  const byName = new Map(program.commands.map((c) => [c.name(), c]));
  const ordered: Command[] = [];
  for (const g of COMMAND_GROUPS) {
    for (const [name, summary] of g.commands) {
      const c = byName.get(name);
      if (!c) throw new Error(`help: no command '${name}'`);
      const codes = COMMAND_EXIT_CODES[name];
      if (!codes) throw new Error(`help: no exit codes for '${name}'`);
      exitCodes(c.summary(summary).helpGroup(g.heading), codes);
      ordered.push(c);
      byName.delete(name);
    }
  }
  if (byName.size) throw new Error(`help: command(s) without a group: ${[...byName.keys()].join(", ")}`);
  // commander lists commands in the order of program.commands
  (program.commands as Command[]).splice(0, program.commands.length, ...ordered);
}

/**
 * Ends a command's --help with its exit codes: the given meanings of 0, 1 and 3, and 2 and 4,
 * which mean the same everywhere.
 */
export function exitCodes(cmd: Command, codes: { 0: string; 1?: string; 3?: string }): Command {
  const parts = [`0 ${codes[0]}`];
  if (codes[1]) parts.push(`1 ${codes[1]}`);
  parts.push(`2 ${EXIT_BAD_INPUT}`);
  parts.push(`3 ${codes[3] ?? "interrupted, or a limit was reached before a result"}`);
  parts.push(`4 ${EXIT_INTERNAL_TEXT}`);
  return cmd.addHelpText("after", "\n" + wrapText(`Exit codes: ${parts.join("; ")}.`));
}

/** Wraps text at spaces to lines of at most `width` characters (help text commander does not wrap itself). */
export function wrapText(text: string, width = 80): string {
  return text
    .split("\n")
    .map((para) => {
      const lines: string[] = [];
      let line = "";
      for (const word of para.split(" ")) {
        if (line && line.length + 1 + word.length > width) {
          lines.push(line);
          line = word;
        } else line = line ? `${line} ${word}` : word;
      }
      lines.push(line);
      return lines.join("\n");
    })
    .join("\n");
}

/**
 * How a person starts plumbline, for the commands it suggests ("check it with: … audit DIR"):
 * "npx plumbline" when run through npx (npm sets npm_command=exec), else "plumbline".
 * PLUMBLINE_INVOKED_AS overrides it (the demo sets it).
 */
export function invocationName(): string {
  return process.env.PLUMBLINE_INVOKED_AS || (process.env.npm_command === "exec" ? "npx plumbline" : "plumbline");
}
