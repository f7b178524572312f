// Finds certificate folders for a bulk audit: each path is a certificate folder itself or a
// folder searched recursively; what cannot be read is reported per path, never thrown.
import * as fs from "node:fs";
import * as path from "node:path";
import { FILES } from "./format.js";

export interface Discovered {
  /** Certificate folders (holding certificate.json), in the order found, each once. */
  dirs: string[];
  /** Paths that name no certificate: missing, unreadable, or with none below them. */
  problems: Array<{ path: string; reason: string }>;
}

/** Folders the search does not enter: hidden ones (temporary folders of atomic writes, .git) and node_modules. */
const skipped = (name: string): boolean => name.startsWith(".") || name === "node_modules";

const isCertificate = (dir: string): boolean => fs.existsSync(path.join(dir, FILES.certificate));

/**
 * The certificate folders under `paths`. A folder holding certificate.json is a certificate (the
 * search does not go below it); any other folder is searched recursively, in name order, without
 * following symbolic links to folders already seen. A path that yields no certificate is a problem.
 */
export function discoverCertificates(paths: readonly string[]): Discovered {
  const dirs: string[] = [];
  const problems: Discovered["problems"] = [];
  const seen = new Set<string>();
  let hits = 0;
  const add = (dir: string) => {
    hits++;
    const real = fs.realpathSync(dir);
    if (seen.has(real)) return;
    seen.add(real);
    dirs.push(dir);
  };
  const walk = (dir: string, visited: Set<string>): void => {
    if (isCertificate(dir)) return add(dir);
    let entries: fs.Dirent[];
    try {
      entries = fs.readdirSync(dir, { withFileTypes: true });
    } catch {
      return;
    }
    for (const e of entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))) {
      if (skipped(e.name)) continue;
      const p = path.join(dir, e.name);
      let isDir = e.isDirectory();
      if (e.isSymbolicLink()) {
        try {
          isDir = fs.statSync(p).isDirectory();
        } catch {
          isDir = false;
        }
      }
      if (!isDir) continue;
      const real = fs.realpathSync(p);
      if (visited.has(real)) continue; // a link back up the tree
      walk(p, new Set(visited).add(real));
    }
  };
  for (const p of paths) {
    let st: fs.Stats;
    try {
      st = fs.statSync(p);
    } catch {
      problems.push({ path: p, reason: "no such file or folder" });
      continue;
    }
    if (!st.isDirectory()) {
      problems.push({ path: p, reason: `not a folder (a certificate is a folder holding ${FILES.certificate})` });
      continue;
    }
    const before = hits;
    walk(p, new Set([fs.realpathSync(p)]));
    if (hits === before) problems.push({ path: p, reason: `no certificate (no ${FILES.certificate}) in this folder or below it` });
  }
  return { dirs, problems };
}
