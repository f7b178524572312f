// Proof files: streamed through a small buffer to a temporary name, renamed on close, removed on
// abort; binary and text encodings decode to the same steps and check against the formula.
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { checkDrat } from "../../src/proof/index.js";
import { FileProofWriter, MemoryProofWriter, Solver } from "../../src/sat/index.js";
import { decodeProof } from "../proof/support/naive-checker.js";
import { pigeonhole } from "./support/generators.js";

const dir = mkdtempSync(join(tmpdir(), "plumbline-proof-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("proof writers", () => {
  it("binary and text proofs of the same run hold the same steps; files match memory", () => {
    const cnf = pigeonhole(5);
    const steps: Record<string, unknown> = {};
    for (const format of ["binary", "text"] as const) {
      const path = join(dir, `php5.${format}`);
      const file = new FileProofWriter(path, format, 4096); // small buffer: many flushes
      const mem = new MemoryProofWriter(format);
      const tee = {
        add: (l: ArrayLike<number>, a: number, b: number) => (file.add(l, a, b), mem.add(l, a, b)),
        delete: (l: ArrayLike<number>, a: number, b: number) => (file.delete(l, a, b), mem.delete(l, a, b)),
        flush: () => file.flush(),
      };
      const s = new Solver({ proof: tee });
      for (const c of cnf.clauses) s.addClause(c);
      expect(s.solve()).toBe("unsat"); // source: Haken 1985
      expect(readdirSync(dir).some((f) => f === `php5.${format}`)).toBe(false); // not there before close
      file.close();
      const bytes = new Uint8Array(readFileSync(path));
      expect(Buffer.compare(bytes, mem.bytes())).toBe(0);
      expect(file.size).toBe(bytes.length);
      expect(checkDrat(cnf, bytes).valid).toBe(true);
      steps[format] = decodeProof(bytes);
    }
    expect(steps.binary).toEqual(steps.text);
  });

  it("abort leaves no file behind", () => {
    const w = new FileProofWriter(join(dir, "gone.drat"));
    w.add([2, 5], 0, 2);
    w.abort();
    expect(readdirSync(dir).filter((f) => f.includes("gone"))).toEqual([]);
  });

  it("encodes large variable numbers in binary (several 7-bit groups) and text", () => {
    const mem = new MemoryProofWriter("binary");
    mem.add([2 * 100000 + 1], 0, 1); // −100000
    expect(decodeProof(mem.bytes())).toEqual([{ del: false, lits: [-100000] }]);
    const txt = new MemoryProofWriter("text");
    txt.delete([2 * 1234567, 3], 0, 2);
    expect(Buffer.from(txt.bytes()).toString()).toBe("d 1234567 -1 0\n");
  });
});
