// A directory tree as a suite: each folder holding domain.pddl contributes its other *.pddl
// files as problems; a folder of per-problem domains pairs problem-NN.pddl with domain-NN.pddl.
import { readdirSync, statSync } from "node:fs";
import { join, relative } from "node:path";

export interface FoundInstance {
  instance: string;
  domain: string;
  domainFile: string;
  problemFile: string;
}

const isDomainName = (stem: string) => stem === "domain" || /^domain[-_]/.test(stem) || /[-_]domain$/.test(stem);

/** Candidate domain stems for a problem stem under the per-problem pairing. */
function domainStemsFor(stem: string): string[] {
  const out = [`domain-${stem}`, `domain_${stem}`, `${stem}-domain`, `${stem}_domain`];
  const m = /^problem[-_]?(.*)$/.exec(stem);
  if (m && m[1]) out.push(`domain-${m[1]}`, `domain_${m[1]}`, `domain${m[1]}`);
  return out;
}

/** Walks `root` (sorted, skipping hidden folders and node_modules); `rootName` names its group. */
export function instancesInDirectory(root: string, rootName: string): { instances: FoundInstance[]; warnings: string[] } {
  const instances: FoundInstance[] = [];
  const warnings: string[] = [];
  const walk = (dir: string) => {
    const names = readdirSync(dir).sort();
    const pddl = names.filter((n) => n.toLowerCase().endsWith(".pddl") && statSync(join(dir, n)).isFile());
    const rel = relative(root, dir);
    const group = rel === "" ? rootName : rel.split(/[\\/]/).join("/");
    const stemOf = (n: string) => n.slice(0, -5);
    if (pddl.includes("domain.pddl")) {
      for (const p of pddl) {
        if (p === "domain.pddl") continue;
        instances.push({ instance: `${group}/${stemOf(p)}`, domain: group, domainFile: join(dir, "domain.pddl"), problemFile: join(dir, p) });
      }
    } else if (pddl.some((p) => isDomainName(stemOf(p)))) {
      const stems = new Set(pddl.map(stemOf));
      for (const p of pddl) {
        const stem = stemOf(p);
        if (isDomainName(stem)) continue;
        const d = domainStemsFor(stem).find((s) => stems.has(s));
        if (d === undefined) {
          warnings.push(`${join(dir, p)}: skipped, no matching domain file (looked for ${domainStemsFor(stem).map((s) => s + ".pddl").join(", ")})`);
          continue;
        }
        instances.push({ instance: `${group}/${stem}`, domain: group, domainFile: join(dir, d + ".pddl"), problemFile: join(dir, p) });
      }
    }
    for (const n of names) {
      if (n.startsWith(".") || n === "node_modules") continue;
      const p = join(dir, n);
      if (statSync(p).isDirectory()) walk(p);
    }
  };
  walk(root);
  return { instances, warnings };
}
