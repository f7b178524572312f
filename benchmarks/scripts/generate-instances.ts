// Writes scenario instances for `plumbline bench` generator entries: reads a JSON list of
// {scenario, size, seed, params, domainOut, problemOut, where} on stdin, writes each file atomically.
// The bench runner starts this with tsx because the generators are TypeScript outside src/.
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { writeFileAtomic } from "../../src/util/files.js";
import { generateProblem, scenarioByName, type SizeName } from "../domains/index.js";

interface Job {
  scenario: string;
  size: SizeName;
  seed: number;
  params: Record<string, number>;
  domainOut: string;
  problemOut: string;
  where: string;
}

const jobs = JSON.parse(readFileSync(0, "utf8")) as Job[];
for (const j of jobs) {
  try {
    const sc = scenarioByName(j.scenario);
    writeFileAtomic(j.problemOut, generateProblem(sc, j.size, j.seed, j.params));
    if (!existsSync(j.domainOut)) writeFileAtomic(j.domainOut, readFileSync(join(sc.dir, "domain.pddl")));
  } catch (e) {
    process.stderr.write(`${j.where}: ${(e as Error).message}\n`);
    process.exit(2);
  }
}
