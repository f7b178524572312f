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

export const commands: RegisterCommand[] = [registerGround, registerReplay, registerSearch, registerCompare, registerHorizon, registerMeasure, registerSat, registerCheckProof, registerBench, registerReport, registerSolve, registerAudit, registerRejudge, registerEncode];
