// The list of commands the CLI offers; each command lives in its own file and
// registers itself on the program. Add a new command here.
import type { Command } from "commander";
import type { CliContext } from "../context.js";

export type RegisterCommand = (program: Command, ctx: CliContext) => void;

export const commands: RegisterCommand[] = [];
