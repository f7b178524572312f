// `plumbline solve DOMAIN PROBLEM`: a cost-optimal plan with its proof, optionally a plan file
// and a certificate directory. Wiring only; the work is in src/optimize and src/certify.
import type { Command } from "commander";
import { dratChecker, stateSpaceChecker, writeCertificate } from "../../certify/index.js";
import { DEFAULT_ENCODING, disposeOutcome, optimizeFiles, planFile, resolveEncoding, type OptimizeOutcome } from "../../optimize/index.js";
import { PlumblineError } from "../../util/errors.js";
import { writeFileAtomic } from "../../util/files.js";
import { positiveNumber } from "../options.js";
import { checkOutputs, isCertificateFolder } from "../output-paths.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { invocationName } from "../help.js";

interface SolveCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  plan?: string;
  certificate?: string;
  timeLimit?: string;
  memoryLimit?: string;
  encoding?: string;
  sat?: string;
  suffix?: boolean;
  generalBoundsOnly?: boolean;
  threads?: string;
  secondSolver?: boolean;
}

const CAUTION = "(plans are only as good as the model: an optimal plan of an incomplete model can still be unsafe in the real world)";

const num = (x: number): number | string => (Number.isFinite(x) ? x : "Infinity");

function headline(o: OptimizeOutcome): string {
  switch (o.status) {
    case "optimal":
      return `status: optimal — cost ${o.cost} (${o.plan!.length} actions), proven by ${o.provedBy}`;
    case "unsolvable":
      return `status: unsolvable — no plan exists, proven by ${o.provedBy}`;
    case "feasible":
      return `status: feasible — cost ${o.cost}, not proven optimal (${o.stopReason}); the optimum lies in [${num(o.lowerBound)}, ${o.cost}]`;
    case "unknown":
      return `status: unknown — no plan found (${o.stopReason}); every plan costs at least ${num(o.lowerBound)}`;
  }
}

export function registerSolve(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("solve")
      .description(
        "find a cost-optimal plan and prove it: SAT queries 'is there a cheaper plan?' until one is unsatisfiable (DRAT proof) — first " +
          "with a few real steps and a relaxed suffix (a proof at any plan length), then at a proven completeness threshold — or a " +
          "landmark lower bound equal to the plan's cost. Status optimal, feasible (a plan, not proven optimal), " +
          "unsolvable (proven) or unknown (no plan found before a limit).",
      )
      .argument("<domain>", "PDDL domain file")
      .argument("<problem>", "PDDL problem file")
      .option("--plan <file>", "write the best plan found to this file (also when a limit stops the run)")
      .option("--certificate <dir>", "write a certificate directory (re-checkable with 'plumbline audit') when optimality or unsolvability is proven")
      .option("--time-limit <seconds>", "stop after this many seconds with the best plan so far (status feasible or unknown, exit 3); with --certificate the search keeps 5 % of it (at most 3 s) for writing the certificate")
      .option("--memory-limit <MB>", "stop when resident memory passes this many MB, and build no formula estimated to need more")
      .option(
        "--encoding <id>",
        `encoding of the SAT formulas: a step encoding — forall-1 (parallel steps, default ${DEFAULT_ENCODING}), seq-1 (one action per step) or forall-2 — ` +
          "with the cost encoding chosen by size and the parts reach-1 and empty-steps-last-1; or a full formula id such as " +
          "forall-1+cost-unary-1+reach-1+empty-steps-last-1 (step+cost+parts, as certificates record it)",
      )
      .option("--no-suffix", "prove only at completeness thresholds (no relaxed-suffix formulas at short horizons)")
      .option("--general-bounds-only", "completeness thresholds from the general bounds only, without exploring the state space (for measurements; the certificate records it)")
      .option(
        "--threads <n>",
        "cores to keep busy: 2 runs A* with landmark-cut on a core of its own beside the SAT queries (its optimal plan becomes the incumbent), " +
          "and once A* has ended a second solver races every proving query that takes over 2 s (first answer wins, with its own proof); " +
          "1 makes A* and the SAT queries take turns on one core, A* getting five sixths while it runs, and starts no second solver " +
          "(default: the machine's cores, at most 2; give 1 when several runs share the machine, one core each)",
      )
      .option("--no-second-solver", "never race a proving query with a second solver, even when a core is free (for measurements)")
      .option("--sat <solver>", "builtin (default), or external:CMD — a DIMACS solver run once per query ('{cnf}' and '{proof}' stand for the files); its DRAT proof is checked, and without one the final query is re-run with the built-in solver", "builtin"),
  ).action(async (domain: string, problem: string, opts: SolveCliOptions) => {
    ctx.configure(opts);
    const timeLimit = positiveNumber("--time-limit", opts.timeLimit);
    const memoryLimitMb = positiveNumber("--memory-limit", opts.memoryLimit);
    const threads = positiveNumber("--threads", opts.threads, true);
    resolveEncoding(opts.encoding); // a usage error before any work
    checkOutputs(
      [opts.plan !== undefined ? { flag: "--plan", path: opts.plan, kind: "file" } : null, opts.certificate !== undefined ? { flag: "--certificate", path: opts.certificate, kind: "folder", reuseIf: isCertificateFolder } : null],
      [domain, problem],
    );
    const sat = opts.sat ?? "builtin";
    if (sat !== "builtin" && !(sat.startsWith("external:") && sat.length > "external:".length)) throw new PlumblineError("usage", `--sat expects builtin or external:CMD, found '${sat}'`);
    // writing a certificate takes time too (a recorded search of 400,000 states about 3 s): with a
    // time limit and --certificate the search stops that much earlier, so the whole command keeps the limit
    const reserve = timeLimit !== undefined && opts.certificate !== undefined ? Math.min(3, timeLimit * 0.05) : 0;
    const out = await optimizeFiles(domain, problem, {
      encoding: opts.encoding,
      suffix: opts.suffix !== false,
      horizonLimits: opts.generalBoundsOnly ? { maxOptimalStates: 0, maxExplicitStates: 1 } : undefined,
      sat,
      threads,
      portfolio: opts.secondSolver !== false,
      timeLimit: timeLimit !== undefined ? timeLimit - reserve : undefined,
      memoryLimitMb,
      signal: ctx.signal,
      onProgress: (line) => ctx.note(line),
      // each better plan replaces the file at once (atomically): a later crash or kill loses nothing
      onPlan: opts.plan !== undefined ? (p) => writeFileAtomic(opts.plan as string, p.text) : undefined,
      proofChecker: dratChecker,
      stateSpaceCheck: stateSpaceChecker,
    });
    try {
      // the plan file's header states the status and, for a proven optimum, how it was proven
      const planText = out.plan ? planFile(out.plan, out.status === "optimal" ? out.how : null) : null;
      if (opts.plan && planText !== null) writeFileAtomic(opts.plan, planText);
      let certificate: string | null = null;
      if (opts.certificate) {
        if (out.certificate) {
          await writeCertificate(opts.certificate, out.certificate);
          certificate = opts.certificate;
        } else ctx.note(`no certificate written: ${out.status === "unsolvable" ? "this unsolvability proof cannot be certified" : "optimality was not proven"}`);
      }
      ctx.exitCode = out.status === "optimal" || out.status === "unsolvable" ? 0 : 3;
      ctx.result({
        status: out.status,
        cost: out.cost,
        lowerBound: num(out.lowerBound),
        gap: out.cost !== null && Number.isFinite(out.lowerBound) ? out.cost - out.lowerBound : null,
        length: out.plan?.length ?? null,
        plan: out.plan?.names ?? null,
        how: out.how,
        provedBy: out.provedBy,
        stopReason: out.stopReason,
        horizon: out.horizon,
        horizonMethod: out.horizonWinner,
        thresholdAvoided: out.thresholdAvoided,
        encoding: out.encoding,
        proof: out.proof ? { kind: "drat", file: certificate ? `${certificate}/proof.drat.gz` : null, bytes: out.proof.bytes, format: `drat-${out.proof.format}`, engine: out.proof.engine, checkedSeconds: out.proofCheckSeconds } : out.how === "lower-bound" ? { kind: "landmarks", file: certificate ? `${certificate}/landmarks.json` : null, bytes: null } : null,
        certificate,
        planFile: opts.plan && out.plan ? opts.plan : null,
        seconds: out.seconds,
        timeToFirstPlan: out.timeToFirstPlan,
        timeToProof: out.timeToProof,
        timeline: out.timeline.map((e) => ({ ...e, lower: num(e.lower) })),
        satCalls: out.satCalls,
        conflicts: out.conflicts,
        variables: out.variables,
        clauses: out.clauses,
        peakMemoryBytes: out.peakRssBytes,
        notes: out.notes,
      });
      const lines = [headline(out)];
      if (planText !== null) lines.push("", planText.trimEnd());
      if (out.how === "suffix-unsat") lines.push("", `proved at horizon ${out.horizon} with a relaxed suffix${out.thresholdAvoided !== null ? ` (a completeness threshold would have needed ${out.thresholdAvoided})` : ""}`);
      else if (out.horizon !== null && out.how !== "lower-bound" && out.how !== "state-space") lines.push("", `horizon: ${out.horizon} steps${out.horizonWinner ? ` (by the ${out.horizonWinner} method)` : ""}${out.status === "feasible" || out.status === "unknown" ? " — what a proof would need" : ""}`);
      if (out.proofCheckSeconds !== null) lines.push(`the solver's proof was checked by plumbline's independent proof checker in ${out.proofCheckSeconds.toFixed(1)} s`);
      for (const n of out.notes) lines.push(`note: ${n}`);
      if (certificate) lines.push(`certificate written to ${certificate} (check it with: ${invocationName()} audit ${certificate})`);
      lines.push("", CAUTION);
      ctx.out(lines.join("\n"));
    } finally {
      disposeOutcome(out);
    }
  });
}
