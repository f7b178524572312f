// `plumbline sat CNF`: runs the built-in CDCL solver (or an external one) on a DIMACS file,
// optionally writing a DRAT proof. Wiring only; the work is in src/sat.
import { Option, type Command } from "commander";
import { FileProofWriter, Solver, readDimacsFile, solveExternal, type ProofFormat, type SolveStatus } from "../../sat/index.js";
import { PlumblineError } from "../../util/errors.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { deadlineFrom } from "../options.js";
import { checkOutputs } from "../output-paths.js";

interface SatCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  proof?: string;
  proofFormat?: "drat-binary" | "drat-text";
  timeLimit?: string;
  conflicts?: string;
  sat?: string;
  model?: boolean;
}

const WORD: Record<SolveStatus, string> = { sat: "SATISFIABLE", unsat: "UNSATISFIABLE", unknown: "UNKNOWN" };

function vLines(model: Int8Array): string {
  const out: string[] = [];
  let line = "v";
  for (let v = 1; v < model.length; v++) {
    const tok = ` ${model[v] === 1 ? v : -v}`;
    if (line.length + tok.length > 78) {
      out.push(line);
      line = "v";
    }
    line += tok;
  }
  out.push(`${line} 0`);
  return out.join("\n");
}

function modelList(model: Int8Array): number[] {
  const out: number[] = [];
  for (let v = 1; v < model.length; v++) out.push(model[v] === 1 ? v : -v);
  return out;
}

export function registerSat(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("sat")
      .description(
        "solve a DIMACS CNF file with the built-in CDCL SAT solver (or an external one), optionally writing a DRAT proof of unsatisfiability. " +
          "Prints 's SATISFIABLE' with 'v' lines, 's UNSATISFIABLE' or 's UNKNOWN'.",
      )
      .argument("<cnf>", "DIMACS CNF file")
      .option("--proof <file>", "write a DRAT proof to this file when the answer is UNSATISFIABLE (no file otherwise)")
      .addOption(new Option("--proof-format <format>", "drat-binary (default, compact) or drat-text").choices(["drat-binary", "drat-text"]).default("drat-binary"))
      .option("--time-limit <seconds>", "give up after this many seconds (status unknown, exit 3)")
      .option("--conflicts <n>", "give up after this many conflicts (status unknown, exit 3)")
      .option("--sat <solver>", "builtin (default), or external:CMD to run a DIMACS solver on PATH; '{cnf}' and '{proof}' in CMD stand for the file paths", "builtin")
      .option("--model", "with --json: include the model (a list of literals) in the JSON"),
  ).action(async (cnfPath: string, opts: SatCliOptions) => {
    ctx.configure(opts);
    const deadline = deadlineFrom(opts.timeLimit);
    let conflicts: number | undefined;
    if (opts.conflicts !== undefined) {
      conflicts = Number(opts.conflicts);
      if (!Number.isInteger(conflicts) || conflicts <= 0) throw new PlumblineError("usage", `--conflicts expects a positive integer, found '${opts.conflicts}'`);
    }
    const engine = opts.sat ?? "builtin";
    if (engine !== "builtin" && !engine.startsWith("external:")) throw new PlumblineError("usage", `--sat expects builtin or external:CMD, found '${engine}'`);
    const format: ProofFormat = opts.proofFormat === "drat-text" ? "text" : "binary";
    checkOutputs([opts.proof !== undefined ? { flag: "--proof", path: opts.proof, kind: "file" } : null], [cnfPath]);
    const t0 = performance.now();
    const cnf = readDimacsFile(cnfPath);
    for (const w of cnf.warnings) ctx.warn(w);
    const parseSeconds = (performance.now() - t0) / 1000;
    ctx.note(`read ${cnf.numVars} variables, ${cnf.numClauses} clauses in ${parseSeconds.toFixed(2)} s`);

    let status: SolveStatus;
    let model: Int8Array | undefined;
    let stats: Record<string, unknown>;
    const formatWord = format === "text" ? "drat-text" : "drat-binary";
    let proofInfo: { file: string; format: typeof formatWord; bytes: number } | null = null;
    if (engine === "builtin") {
      const writer = opts.proof ? new FileProofWriter(opts.proof, format) : null;
      try {
        const solver = new Solver({ proof: writer });
        solver.addCnf(cnf);
        status = await solver.solveAsync([], { deadline, conflicts, signal: ctx.signal });
        if (status === "sat") model = solver.model();
        stats = { ...solver.stats() };
        if (writer) {
          if (status === "unsat") {
            writer.close();
            proofInfo = { file: opts.proof as string, format: formatWord, bytes: writer.size };
          } else {
            writer.abort();
            ctx.note(`no proof written: the answer is ${WORD[status]}`);
          }
        }
      } catch (e) {
        writer?.abort();
        throw e;
      }
    } else {
      if (format !== "binary" && opts.proof) ctx.note("the proof format is the external solver's own choice");
      const r = await solveExternal(engine.slice("external:".length), cnf, {
        proofPath: opts.proof,
        signal: ctx.signal,
        timeoutMs: deadline === undefined ? undefined : Math.max(1, deadline - Date.now()),
      });
      status = r.status;
      model = r.model;
      stats = { command: r.command.join(" "), exitCode: r.exitCode, seconds: r.seconds };
      if (r.proofPath) proofInfo = { file: r.proofPath, format: formatWord, bytes: 0 };
    }
    const seconds = (performance.now() - t0) / 1000;
    ctx.exitCode = status === "unknown" ? 3 : 0;
    ctx.out(`s ${WORD[status]}`);
    if (model) ctx.out(vLines(model));
    ctx.note(`${WORD[status].toLowerCase()} in ${seconds.toFixed(2)} s${proofInfo ? `; proof written to ${proofInfo.file}` : ""}`);
    ctx.result({
      status,
      engine,
      numVars: cnf.numVars,
      numClauses: cnf.numClauses,
      seconds,
      stats,
      proof: proofInfo,
      ...(opts.model && model ? { model: modelList(model) } : {}),
    });
  });
}
