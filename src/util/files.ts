// Reading inputs with clear errors and writing outputs atomically (temp name, then rename),
// so an interrupted run never leaves a half-written file behind.
import { randomBytes } from "node:crypto";
import * as fs from "node:fs";
import * as path from "node:path";
import { PlumblineError } from "./errors.js";

/** Reads a UTF-8 text file; a missing or unreadable file is a PlumblineError naming it. */
export function readText(file: string): string {
  try {
    return fs.readFileSync(file, "utf8");
  } catch (e) {
    throw new PlumblineError("io", `cannot read ${file}: ${ioReason(e)}`);
  }
}

export function readBytes(file: string): Uint8Array {
  try {
    return fs.readFileSync(file);
  } catch (e) {
    throw new PlumblineError("io", `cannot read ${file}: ${ioReason(e)}`);
  }
}

function ioReason(e: unknown): string {
  const err = e as NodeJS.ErrnoException;
  if (err?.code === "ENOENT") return "no such file";
  if (err?.code === "EISDIR") return "it is a directory";
  if (err?.code === "EACCES") return "permission denied";
  return err?.message ?? String(e);
}

/** A sibling temporary name for `target` (same directory, so rename is atomic). */
export function tempNameFor(target: string): string {
  const dir = path.dirname(target);
  const base = path.basename(target);
  return path.join(dir, `.${base}.tmp-${process.pid}-${randomBytes(4).toString("hex")}`);
}

/** Writes `data` to `target` via a temporary file and a rename. */
export function writeFileAtomic(target: string, data: string | Uint8Array): void {
  const tmp = tempNameFor(target);
  try {
    fs.writeFileSync(tmp, data);
    fs.renameSync(tmp, target);
  } catch (e) {
    try {
      fs.rmSync(tmp, { force: true });
    } catch {
      /* nothing left to clean */
    }
    throw new PlumblineError("io", `cannot write ${target}: ${ioReason(e)}`);
  }
}

/**
 * Builds a directory under a temporary sibling name with `fill`, then renames it to `target`.
 * An existing `target` is replaced only after the new one is complete.
 */
export async function writeDirAtomic(target: string, fill: (tmpDir: string) => Promise<void> | void): Promise<void> {
  const tmp = tempNameFor(target);
  fs.mkdirSync(tmp, { recursive: true });
  try {
    await fill(tmp);
    if (fs.existsSync(target)) {
      const old = tempNameFor(target);
      fs.renameSync(target, old);
      fs.renameSync(tmp, target);
      fs.rmSync(old, { recursive: true, force: true });
    } else {
      fs.renameSync(tmp, target);
    }
  } catch (e) {
    fs.rmSync(tmp, { recursive: true, force: true });
    if (e instanceof PlumblineError) throw e;
    throw new PlumblineError("io", `cannot write ${target}: ${ioReason(e)}`);
  }
}
