// One rule for every path a command writes, checked before any work starts: the right kind (file or
// folder), writable, never an input, never inside an input, never holding an input, never another output.
import { randomBytes } from "node:crypto";
import * as fs from "node:fs";
import * as path from "node:path";
import { PlumblineError } from "../util/errors.js";

export interface OutputPath {
  /** The option that names it, for messages ("--plan"). */
  flag: string;
  path: string;
  kind: "file" | "folder";
  /**
   * Folders only: what an existing folder must hold to be replaced or reused (a certificate folder
   * holds certificate.json). Without it an existing folder must be empty.
   */
  reuseIf?: (dir: string) => boolean;
}

/** The path with every existing part's symbolic links resolved (so two names of one file compare equal). */
export function realPath(p: string): string {
  const abs = path.resolve(p);
  let head = abs;
  const tail: string[] = [];
  for (;;) {
    try {
      return path.join(fs.realpathSync(head), ...tail.reverse());
    } catch {
      const parent = path.dirname(head);
      if (parent === head) return abs;
      tail.push(path.basename(head));
      head = parent;
    }
  }
}

function inside(child: string, parent: string): boolean {
  const rel = path.relative(parent, child);
  return rel !== "" && !rel.startsWith("..") && !path.isAbsolute(rel);
}

function statOf(p: string): fs.Stats | null {
  try {
    return fs.statSync(p);
  } catch {
    return null;
  }
}

function refuse(o: OutputPath, why: string): never {
  throw new PlumblineError("usage", `${o.flag} ${o.path}: ${why}`);
}

/** Creates and removes a probe in `dir`: the only test that also holds for root, read-only mounts and /proc. */
function probeWritable(o: OutputPath, dir: string): void {
  const probe = path.join(dir, `.plumbline-probe-${process.pid}-${randomBytes(4).toString("hex")}`);
  try {
    fs.writeFileSync(probe, "", { flag: "wx" });
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why = code === "EACCES" || code === "EPERM" ? "permission denied" : code === "EROFS" ? "read-only file system" : code === "ENOSPC" ? "no space left" : `cannot create files there (${code ?? (e as Error).message})`;
    refuse(o, `cannot write in ${dir}: ${why}`);
  }
  fs.rmSync(probe, { force: true });
}

/** The nearest existing folder at or above `p` (a file there is refused). */
function existingAncestor(o: OutputPath, p: string): string {
  let cur = path.dirname(p);
  for (;;) {
    const st = statOf(cur);
    if (st) {
      if (!st.isDirectory()) refuse(o, `${cur} is a file, not a folder`);
      return cur;
    }
    const up = path.dirname(cur);
    if (up === cur) refuse(o, "no existing folder above it");
    cur = up;
  }
}

function checkOne(o: OutputPath): void {
  const abs = path.resolve(o.path);
  const st = statOf(abs);
  if (o.kind === "file") {
    if (st?.isDirectory()) refuse(o, "is a folder; a file name is expected");
    if (st && !st.isFile()) refuse(o, "exists and is not a regular file (a device, pipe or socket would be replaced)");
    const dir = path.dirname(abs);
    const dst = statOf(dir);
    if (!dst) refuse(o, `the folder ${dir} does not exist`);
    if (!dst.isDirectory()) refuse(o, `${dir} is not a folder`);
    probeWritable(o, dir);
    return;
  }
  if (st && !st.isDirectory()) refuse(o, "is a file; a folder name is expected");
  if (st) {
    const entries = fs.readdirSync(abs);
    if (entries.length > 0 && !(o.reuseIf?.(abs) ?? false)) refuse(o, "exists and is not empty (and not one this command wrote): choose a new name or remove it first");
    probeWritable(o, abs);
  }
  // written under a sibling temporary name, then renamed: the folder above must take new entries
  probeWritable(o, st ? path.dirname(abs) : existingAncestor(o, abs));
}

/**
 * Checks every output before the command does any work. `inputs` are the files and folders the
 * command reads. Throws a usage error (exit 2) naming the option and the reason.
 */
export function checkOutputs(outputs: Array<OutputPath | null | undefined>, inputs: string[]): void {
  const outs = outputs.filter((o): o is OutputPath => !!o && o.path !== undefined);
  const ins = inputs.map((p) => ({ p, real: realPath(p) }));
  const reals = outs.map((o) => realPath(o.path));
  outs.forEach((o, i) => {
    if (o.path.trim() === "") refuse(o, "an empty name");
    const r = reals[i];
    for (const input of ins) {
      if (r === input.real) refuse(o, `is an input of this command (${input.p}); it would be overwritten`);
      if (inside(r, input.real)) refuse(o, `is inside the input ${input.p}`);
      if (o.kind === "folder" && inside(input.real, r)) refuse(o, `holds the input ${input.p}, which writing the folder would remove`);
    }
    for (let j = 0; j < i; j++) {
      const other = outs[j];
      if (reals[j] === r) refuse(o, `is also given as ${other.flag}: one would overwrite the other`);
      if (inside(r, reals[j]) || inside(reals[j], r)) refuse(o, `and ${other.flag} ${other.path} lie inside one another: writing one would remove the other`);
    }
  });
  for (const o of outs) checkOne(o);
}

/** A certificate folder may be replaced by a new certificate. */
export const isCertificateFolder = (dir: string): boolean => fs.existsSync(path.join(dir, "certificate.json"));
