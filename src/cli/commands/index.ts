// The list of commands the CLI offers; each command lives in its own file and
// registers itself on the program. Add a new command here.
import type { Command } from "commander";
import type { CliContext } from "../context.js";
import { registerGround } from "./ground.js";
import { registerReplay } from "./replay.js";
import { registerSearch } from "./search.js";
import { registerCompare } from "./compare.js";
import { registerHorizon } from "./horizon.js";
import { registerMeasure } from "./measure.js";
import { registerSat } from "./sat.js";
import { registerCheckProof } from "./check-proof.js";
import { registerBench } from "./bench.js";
import { registerReport } from "./report.js";
import { registerSolve } from "./solve.js";
import { registerAudit } from "./audit.js";
import { registerEncode } from "./encode.js";
import { registerRejudge } from "./rejudge.js";

export type RegisterCommand = (program: Command, ctx: CliContext) => void;

/** Registration order; the top-level help groups and orders them itself (src/cli/help.ts). */
export const commands: RegisterCommand[] = [registerSolve, registerAudit, registerCompare, registerRejudge, registerReplay, registerSearch, registerGround, registerHorizon, registerMeasure, registerEncode, registerSat, registerCheckProof, registerBench, registerReport];
