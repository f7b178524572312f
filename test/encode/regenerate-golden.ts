// Rewrites encodings/golden/*.cnf from the fixtures. Run by hand ONLY when an encoding is
// changed on purpose (and then give it a new id): `npx tsx test/encode/regenerate-golden.ts`.
import { writeFileSync } from "node:fs";
import { relative } from "node:path";
import { encodeFixture, GOLDEN_FORMULAS, goldenFile, loadFixtures, SUFFIX_FORMULAS, EAGER_FORMULAS, PRUNE_FORMULAS, PRUNE_SUFFIX_FORMULAS } from "./golden.js";

for (const fx of loadFixtures()) {
  for (const f of [...GOLDEN_FORMULAS, ...EAGER_FORMULAS, ...SUFFIX_FORMULAS, ...PRUNE_FORMULAS, ...PRUNE_SUFFIX_FORMULAS]) {
    const enc = encodeFixture(f, fx);
    writeFileSync(goldenFile(f, fx), enc.toDimacs());
    process.stdout.write(`${relative(process.cwd(), goldenFile(f, fx))}: ${enc.numVars} variables, ${enc.numClauses} clauses\n`);
  }
}
