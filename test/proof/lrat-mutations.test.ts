// The LRAT checker rejects broken proofs: each mutation of a valid proof (hand-made with a RAT
// lemma, or written from a solver proof) must fail, naming the line; and hand-made RAT lemmas
// go through both paths (DRAT → LRAT and LRAT directly). Malformed text is a rejection with its line.
import { describe, expect, it } from "vitest";
import { checkDrat, checkLrat } from "../../src/proof/index.js";
import { pigeonhole } from "../sat/support/generators.js";
import { copyLines, parseLrat, printLrat, type LratLine } from "./support/lrat-text.js";
import { upConflict } from "./support/naive-checker.js";
import { solverProof } from "./support/lrat-text.js";

// source: worked by hand. F is unsatisfiable: x1 gives 3 (c1), 5 (c5), then 7 and ¬7 (c8, c9);
// ¬x1 gives ¬2 (c3, c4), 3 (c2), 5 (c6, c7), the same conflict. No clause of F is a unit.
const F = {
  numVars: 7,
  clauses: [
    [-1, 3], // 1
    [2, 3], // 2
    [1, -2, 4], // 3
    [1, -2, -4], // 4
    [-1, 5], // 5
    [2, 5, 6], // 6
    [2, 5, -6], // 7
    [-3, -5, 7], // 8
    [-3, -5, -7], // 9
  ],
};
// C = (1 2) is not RUP (¬1 ¬2 only give 3), but RAT on 1: its resolvents with the clauses that
// hold ¬1 are (2 3) = c2 and (2 5), which ¬2 ¬5 refute through c6, c7. With C, (1) is RUP
// (¬1 → 2 → 4, ¬4); without C it is not, so C is needed. Then (1) refutes F by propagation.
const RAT_LRAT = [
  "10 1 2 0 -1 2 -5 6 7 0", // RAT on 1: group for c1 (hint c2), group for c5 (hints c6, c7)
  "11 1 0 10 3 4 0",
  "12 0 11 1 5 8 9 0",
].join("\n") + "\n";

const rejectsAt = (cnf: { numVars: number; clauses: number[][] }, text: string, line: number, why: RegExp) => {
  const r = checkLrat(cnf, text);
  expect(r.valid).toBe(false);
  expect(r.line).toBe(line);
  expect(r.reason).toMatch(new RegExp(`^line ${line}: `));
  expect(r.reason).toMatch(why);
};

describe("hand-made RAT proofs", () => {
  it("the hand-made facts hold (checked with the naive propagation of the test oracle)", () => {
    const cs = F.clauses;
    expect(upConflict(cs, [])).toBe(false);
    expect(upConflict(cs, [-1, -2])).toBe(false); // C is not RUP
    expect(upConflict(cs, [-2, -3])).toBe(true); // resolvent with c1
    expect(upConflict(cs, [-2, -5])).toBe(true); // resolvent with c5
    expect(upConflict(cs, [-1])).toBe(false); // (1) is not RUP without C
    expect(upConflict([...cs, [1, 2]], [-1])).toBe(true); // … but is with C
    expect(upConflict([...cs, [1]], [])).toBe(true);
  });

  it("direct LRAT with a RAT lemma is accepted and counted", () => {
    const r = checkLrat(F, RAT_LRAT);
    expect(r.valid, r.reason).toBe(true);
    expect(r.stats.additions).toBe(3);
    expect(r.stats.ratAdditions).toBe(1);
  });

  it("DRAT → LRAT: the RAT lemma is checked as RAT, and the LRAT written carries its groups", () => {
    const d = checkDrat(F, Buffer.from("1 2 0\n1 0\n0\n"), { lrat: true });
    expect(d.valid, d.reason).toBe(true);
    expect(d.stats.ratLemmas).toBe(1);
    expect(d.stats.coreLemmas).toBe(2);
    const l = checkLrat(F, d.lrat as Uint8Array);
    expect(l.valid, l.reason).toBe(true);
    expect(l.stats.ratAdditions).toBe(1);
    const rat = parseLrat(d.lrat as Uint8Array).find((x) => x.kind === "add" && x.lits.join(" ") === "1 2");
    expect(rat && rat.kind === "add" && rat.hints.filter((h) => h < 0).sort((a, b) => a - b)).toEqual([-5, -1]);
  });

  it("RAT mutations are rejected: a group missing, a group's hints cut, a group for a clause without the negated pivot, the pivot moved", () => {
    const lines = RAT_LRAT.split("\n");
    const withFirst = (s: string) => [s, ...lines.slice(1)].join("\n");
    rejectsAt(F, withFirst("10 1 2 0 -1 2 0"), 1, /no RAT group for clause 5/);
    rejectsAt(F, withFirst("10 1 2 0 -5 6 7 0"), 1, /no RAT group for clause 1/);
    rejectsAt(F, withFirst("10 1 2 0 -1 2 -5 6 0"), 1, /RAT group for clause 5 end without a falsified clause/);
    rejectsAt(F, withFirst("10 1 2 0 -1 2 -5 6 7 -2 0"), 1, /RAT group for clause 2, which does not hold -1/);
    rejectsAt(F, withFirst("10 1 2 0 -1 5 -5 6 7 0"), 1, /hint 5 is satisfied|not unit|without a falsified/);
    // pivot 2: the clauses holding ¬2 are c3, c4; (1 2) resolved with them is satisfied by nothing
    rejectsAt(F, withFirst("10 2 1 0 -1 2 -5 6 7 0"), 1, /RAT group for clause 1, which does not hold -2/);
    rejectsAt(F, withFirst("10 2 1 0 0"), 1, /no RAT group for clause 3/);
  });
});

describe("mutations of LRAT proofs are rejected, naming the line", () => {
  it("hand-made proof: hint removed, hint changed, literal flipped, truncation, deleted clause used, ids not increasing", () => {
    const L = RAT_LRAT.split("\n");
    const join = (a: string[]) => a.join("\n");
    // a hint removed (the falsified clause at the end of the chain)
    rejectsAt(F, join([L[0], "11 1 0 10 3 0", L[2]]), 2, /hints end without a falsified clause|RAT group/);
    // a hint changed to another clause: c1 holds ¬1, which is true under ¬(1)… so c1 is satisfied
    rejectsAt(F, join([L[0], "11 1 0 10 3 1 0", L[2]]), 2, /hint 1 is satisfied, not unit/);
    // a literal flipped: (¬1) is neither RUP (10 = (1 2) is satisfied) nor RAT
    rejectsAt(F, join([L[0], "11 -1 0 10 3 4 0", L[2]]), 2, /hint 10 is satisfied/);
    // truncated: the empty clause removed
    rejectsAt(F, join([L[0], L[1], ""]), 2, /ends without deriving the empty clause/);
    // a clause deleted and then used
    rejectsAt(F, join([L[0], "10 d 3 0", L[1], L[2]]), 3, /hint 3 names no clause/);
    // a deletion of a clause that is not there
    rejectsAt(F, join([L[0], "10 d 42 0", L[1], L[2]]), 2, /deletion of clause 42, which is not present/);
    // ids: reused, decreasing, or not above the formula
    rejectsAt(F, join([L[0], "10 1 0 10 3 4 0", L[2]]), 2, /clause number 10 is not above the previous one \(10\)/);
    rejectsAt(F, join([L[0], L[1], "11 0 11 1 5 8 9 0"]), 3, /clause number 11 is not above the previous one \(11\)/);
    rejectsAt(F, join(["9 1 2 0 -1 2 -5 6 7 0", L[1], L[2]]), 1, /clause number 9 is not above the previous one \(9\)/);
    // a hint naming a clause that does not exist (yet)
    rejectsAt(F, join([L[0], "11 1 0 12 3 4 0", L[2]]), 2, /hint 12 names no clause/);
  });

  // mutations applied to every lemma line of a solver proof's LRAT, each of which must fail
  const php = pigeonhole(4); // PHP(5,4), source: Haken 1985
  const cnf = { numVars: php.numVars, clauses: php.clauses.map((c) => Array.from(c)) };
  const d = checkDrat(cnf, solverProof(php.clauses) as Uint8Array, { lrat: true });
  const good = parseLrat(d.lrat as Uint8Array);
  const lineOf = (i: number) => i + 1; // printLrat writes one line per entry
  const lemmaLines = good.map((l, i) => (l.kind === "add" ? i : -1)).filter((i) => i >= 0);

  it("the unmutated solver proof is accepted (and has lemmas to mutate)", () => {
    expect(d.valid, d.reason).toBe(true);
    expect(checkLrat(cnf, printLrat(good)).valid).toBe(true);
    expect(lemmaLines.length).toBeGreaterThan(20);
  });

  /** f mutates line i of a copy; returns the reason expected and the (0-based) index of the failing line. */
  const mutateEach = (name: string, f: (lines: LratLine[], i: number) => [RegExp, number] | null) => {
    it(`solver proof: ${name}, on every lemma line`, () => {
      let tried = 0;
      for (const i of lemmaLines) {
        const m = copyLines(good);
        const expected = f(m, i);
        if (expected === null) continue;
        tried++;
        rejectsAt(cnf, printLrat(m), lineOf(expected[1]), expected[0]);
      }
      expect(tried).toBeGreaterThan(10);
    });
  };

  mutateEach("the last hint removed", (m, i) => {
    const l = m[i] as Extract<LratLine, { kind: "add" }>;
    l.hints.pop();
    // a RUP chain that ends early: the empty clause fails outright, any other lemma then lacks RAT groups
    return [/hints end without a falsified clause|not RUP, and no RAT group for clause/, i];
  });
  mutateEach("a hint changed to a clause satisfied under the negated lemma", (m, i) => {
    const l = m[i] as Extract<LratLine, { kind: "add" }>;
    if (l.lits.length === 0) return null;
    // a formula clause, not deleted before line i, holding the negation of the lemma's first
    // literal (so it is true under the negated lemma)
    const deleted = new Set(m.slice(0, i).flatMap((x) => (x.kind === "del" ? x.ids : [])));
    const j = cnf.clauses.findIndex((c, k) => !deleted.has(k + 1) && c.includes(-l.lits[0]));
    if (j < 0) return null;
    l.hints[0] = j + 1;
    return [new RegExp(`hint ${j + 1} is satisfied, not unit`), i];
  });
  mutateEach("a lemma literal flipped that its first hint needs", (m, i) => {
    const l = m[i] as Extract<LratLine, { kind: "add" }>;
    // the first hint is unit or falsified under the negated lemma alone, so the lemma's
    // literals in it are false there; flipping one of them makes that hint satisfied
    const first = l.hints[0];
    const c = first <= cnf.clauses.length ? cnf.clauses[first - 1] : (m.find((x) => x.kind === "add" && x.id === first) as Extract<LratLine, { kind: "add" }>).lits;
    const k = l.lits.findIndex((x) => c.includes(x));
    if (k < 0) return null;
    l.lits[k] = -l.lits[k];
    return [new RegExp(`hint ${first} is satisfied, not unit`), i];
  });
  mutateEach("a hint's clause deleted just before the line", (m, i) => {
    const l = m[i] as Extract<LratLine, { kind: "add" }>;
    const h = l.hints[l.hints.length - 1];
    m.splice(i, 0, { kind: "del", id: l.id - 1, ids: [h] });
    return [new RegExp(`hint ${h} names no clause`), i + 1];
  });
  mutateEach("the id reused from the line before", (m, i) => {
    const prev = m.slice(0, i).reverse().find((x) => x.kind === "add");
    if (!prev) return null;
    (m[i] as Extract<LratLine, { kind: "add" }>).id = prev.id;
    return [new RegExp(`clause number ${prev.id} is not above the previous one`), i];
  });

  it("solver proof: the empty clause removed (truncated) is rejected", () => {
    const m = copyLines(good).slice(0, -1);
    const r = checkLrat(cnf, printLrat(m));
    expect(r.valid).toBe(false);
    expect(r.reason).toMatch(/ends without deriving the empty clause/);
  });
});

describe("malformed LRAT text is a rejection naming the line", () => {
  const L = RAT_LRAT.split("\n");
  it("bad tokens, missing zeros, junk after the line", () => {
    rejectsAt(F, [L[0], "11 1 x 0 10 3 4 0", L[2]].join("\n"), 2, /expected a literal, found 'x'/);
    rejectsAt(F, [L[0], "11 1 0 10 3 4", L[2]].join("\n"), 2, /expected a hint, found the end of the line/);
    rejectsAt(F, [L[0], "11 1 0 10 3 4 0 7", L[2]].join("\n"), 2, /unexpected '7' after the closing 0/);
    rejectsAt(F, [L[0], "eleven 1 0 10 3 4 0", L[2]].join("\n"), 2, /expected a clause number, found 'eleven'/);
    rejectsAt(F, [L[0], "11 d 3 x 0", L[2]].join("\n"), 2, /expected a clause number, found 'x'/);
    rejectsAt(F, "", 0, /ends without deriving the empty clause/);
  });

  it("comments and blank lines are skipped; line numbers count them", () => {
    const r = checkLrat(F, `c a comment\n\n${RAT_LRAT}`);
    expect(r.valid, r.reason).toBe(true);
    rejectsAt(F, `c a comment\n\n${L[0]}\n11 1 0 10 3 0\n${L[2]}`, 4, /not RUP, and no RAT group for clause/);
  });

  it("absurd numbers are rejected without exhausting memory", () => {
    rejectsAt(F, [L[0], "999999999999 1 0 10 3 4 0", L[2]].join("\n"), 2, /clause number/);
    rejectsAt(F, [L[0], "11 999999999999 0 10 3 4 0", L[2]].join("\n"), 2, /variable/);
    rejectsAt(F, [L[0], "11 1 0 999999999999 3 4 0", L[2]].join("\n"), 2, /hint 999999999999 names no clause/);
  });
});
