// Builds the commander program from one file per command and runs it in-process,
// mapping errors to the exit codes of the CLI contract (no stack traces for users).
import { Command, CommanderError, Help } from "commander";
import { isPlumblineError } from "../util/errors.js";
import { isLimitReached, withLimits } from "../util/limits.js";
import { CliContext, type CliIo } from "./context.js";
import { commands } from "./commands/index.js";
import { EXIT_CODES_TEXT, groupCommands, invocationName, wrapText } from "./help.js";
import { renameOldOptions } from "./renamed-options.js";
import { VERSION } from "../util/version.js";

/** Exit code for a bug in plumbline itself (never for bad input). */
export const EXIT_INTERNAL = 4;

/** The top-level help with its two options after the commands, so that the main job comes first. */
function optionsLast(cmd: Command, helper: Help): string {
  const text = Help.prototype.formatHelp.call(helper, cmd, helper);
  if (cmd.parent) return text;
  const m = /\nOptions:\n(?: {2}.*\n)+\n/.exec(text);
  if (!m) return text;
  const rest = text.slice(0, m.index + 1) + text.slice(m.index + m[0].length);
  return `${rest.trimEnd()}\n${m[0].trimEnd()}\n`;
}

export function buildProgram(ctx: CliContext): Command {
  const program = new Command();
  program
    .name("plumbline")
    .description(
      "Cost-optimal plans for PDDL models with action costs, proven optimal, with certificates anyone can re-check. " +
        "Plans are only as good as the model: a proven-optimal plan of a wrong model is still wrong.",
    )
    .version(VERSION)
    .configureHelp({ subcommandTerm: (c) => c.name(), formatHelp: optionsLast, minWidthToWrap: 24 })
    .showHelpAfterError("(run with --help for usage)")
    .exitOverride()
    .configureOutput({
      writeOut: (s) => ctx.io.stdout.write(s),
      writeErr: (s) => ctx.io.stderr.write(s),
    });
  for (const register of commands) register(program, ctx);
  groupCommands(program);
  program.commandsGroup("Other:").helpCommand("help [command]", "show the help of a command");
  program.addHelpText("after", "\n" + wrapText(`Run '${invocationName()} COMMAND --help' for a command's options. ${EXIT_CODES_TEXT}`));
  return program;
}

/**
 * Runs the CLI on `argv` (without "node" and the script path) and returns the exit code.
 * 0 success or positive verdict, 1 negative verdict, 2 bad input or usage, 3 limit reached.
 */
export async function runCli(argv: string[], io: CliIo = { stdout: process.stdout, stderr: process.stderr }, signal?: AbortSignal): Promise<number> {
  const ctx = new CliContext(io, signal ?? new AbortController().signal);
  const program = buildProgram(ctx);
  // options renamed in this release still work, with a note (src/cli/renamed-options.ts)
  const args = renameOldOptions(argv, (text) => ctx.io.stderr.write(`plumbline: deprecated: ${text}\n`));
  try {
    // one set of limits for the whole command: the abort signal now, a deadline when the command parses one
    await withLimits({ signal: ctx.signal }, () => program.parseAsync(args, { from: "user" }));
    return ctx.exitCode;
  } catch (e) {
    if (e instanceof CommanderError) {
      // help and version exit with 0; usage errors with 2
      if (e.code === "commander.helpDisplayed" || e.code === "commander.version" || e.code === "commander.help") return 0;
      return 2;
    }
    if (isLimitReached(e)) {
      // a limit stopped a phase before the command had any result to report
      if (ctx.json) ctx.io.stdout.write(JSON.stringify({ status: "unknown", stopReason: e.reason, error: e.message, code: e.code }, null, 2) + "\n");
      ctx.io.stderr.write(`plumbline: stopped: ${e.message}; no result yet\n`);
      return e.exitCode;
    }
    if (isPlumblineError(e)) {
      if (ctx.json) ctx.io.stdout.write(JSON.stringify({ error: e.message, code: e.code, pos: e.pos ?? null }, null, 2) + "\n");
      ctx.io.stderr.write(`plumbline: error: ${e.message}\n`);
      return e.exitCode;
    }
    const err = e as Error;
    ctx.io.stderr.write(`plumbline: internal error: ${err?.message ?? String(e)}\n`);
    if (process.env.PLUMBLINE_DEBUG) ctx.io.stderr.write(`${err?.stack ?? ""}\n`);
    else ctx.io.stderr.write("(this is a bug in plumbline; set PLUMBLINE_DEBUG=1 for a stack trace)\n");
    return EXIT_INTERNAL;
  }
}
