// Rewrites encodings/golden/*.cnf from the fixtures. Run by hand ONLY when an encoding is
// changed on purpose (and then give it a new id): `npx tsx test/encode/regenerate-golden.ts`.
import { writeFileSync } from "node:fs";
import { relative } from "node:path";
import { STEP_ENCODINGS } from "../../src/encode/index.js";
import { encodeFixture, goldenFile, loadFixtures } from "./golden.js";

for (const fx of loadFixtures()) {
  for (const id of STEP_ENCODINGS) {
    const enc = encodeFixture(id, fx);
    writeFileSync(goldenFile(id, fx), enc.toDimacs());
    process.stdout.write(`${relative(process.cwd(), goldenFile(id, fx))}: ${enc.numVars} variables, ${enc.numClauses} clauses\n`);
  }
}
