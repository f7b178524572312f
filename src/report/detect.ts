// What kind of folder `plumbline report DIR` was given: a bench run (results.jsonl), a
// certificate (certificate.json), or an exported job array not merged yet (tasks.jsonl).
import { existsSync, statSync } from "node:fs";
import { join } from "node:path";
import { PlumblineError } from "../util/errors.js";

export type ReportDirKind = "bench" | "certificate" | "export";

export function detectReportDir(dir: string): ReportDirKind {
  if (!existsSync(dir) || !statSync(dir).isDirectory()) throw new PlumblineError("io", `cannot read ${dir}: not a folder`);
  if (existsSync(join(dir, "certificate.json"))) return "certificate";
  if (existsSync(join(dir, "results.jsonl"))) return "bench";
  if (existsSync(join(dir, "tasks.jsonl"))) return "export";
  throw new PlumblineError("semantic", `${dir}: neither a bench results folder (results.jsonl) nor a certificate (certificate.json)`);
}
