// Parses action effects: literals, and, forall, when, and `(increase (total-cost) …)`;
// other numeric effects are refused by name, bad cost amounts are errors at their position.
import { PlumblineError } from "../util/errors.js";
import { TOTAL_COST, type CostAmount, type Effect, type Term } from "./ast.js";
import { Cursor, errorAt, posOf } from "./cursor.js";
import { parseAtom, parseFormula, parseTerm } from "./formula.js";
import { describe, type SNode } from "./sexpr.js";
import { parseTypedList } from "./typed-list.js";

const NUMERIC_EFFECTS = new Set(["decrease", "assign", "scale-up", "scale-down"]);

/** Checks that a cost written in the model is a non-negative integer. */
export function checkCostNumber(value: number, text: string, pos: { file: string; line: number; col: number }): void {
  if (!Number.isInteger(value)) throw new PlumblineError("semantic", `action cost must be a non-negative integer, found ${text}`, pos);
  if (value < 0) throw new PlumblineError("semantic", `action cost must be a non-negative integer, found negative ${text}`, pos);
  if (!Number.isSafeInteger(value)) throw new PlumblineError("semantic", `action cost ${text} is too large`, pos);
}

function parseCostAmount(file: string, c: Cursor): CostAmount {
  const n = c.next("a cost: a number or (function ?args …)");
  if (n.kind === "atom" && n.tok === "number") {
    const value = Number(n.text);
    checkCostNumber(value, n.text, posOf(file, n));
    return { kind: "number", value, pos: posOf(file, n) };
  }
  if (n.kind === "list" && n.items.length > 0 && n.items[0].kind === "atom") {
    const h = n.items[0];
    if (h.tok === "name") {
      const fc = new Cursor(file, n, 1);
      const args: Term[] = [];
      while (!fc.atEnd()) args.push(parseTerm(fc));
      return { kind: "function", name: h.text, args, pos: posOf(file, n) };
    }
    if (h.tok === "symbol") {
      throw new PlumblineError("unsupported", `arithmetic cost expression '(${h.text} …)' is not supported; use a number or one static function`, posOf(file, n));
    }
  }
  throw errorAt(file, n, `expected a cost: a number or (function ?args …), found ${describe(n)}`);
}

export function parseEffect(file: string, n: SNode): Effect {
  if (n.kind === "atom") throw errorAt(file, n, `expected an effect '(…)', found ${describe(n)}`);
  const pos = posOf(file, n);
  if (n.items.length === 0) return { kind: "and", effects: [], pos };
  const h = n.items[0];
  if (h.kind !== "atom") throw errorAt(file, h, `expected a predicate name or an effect keyword, found ${describe(h)}`);
  const c = new Cursor(file, n, 1);
  const key = h.tok === "name" ? h.text : "";
  switch (key) {
    case "and": {
      const effects: Effect[] = [];
      while (!c.atEnd()) effects.push(parseEffect(file, c.next("an effect")));
      return { kind: "and", effects, pos };
    }
    case "not": {
      const a = c.list("an atom after 'not'");
      const ah = a.items[0];
      if (!ah || ah.kind !== "atom" || ah.tok !== "name" || ["and", "or", "not", "forall", "exists", "when", "imply"].includes(ah.text)) {
        throw errorAt(file, a, `expected an atom '(predicate …)' after 'not' in an effect, found ${describe(a)}`);
      }
      c.end("(not …)");
      return { kind: "del", atom: parseAtom(file, a), pos };
    }
    case "forall": {
      const vl = c.list("a variable list '(?x - type …)' after 'forall'");
      const vars = parseTypedList(new Cursor(file, vl), "var", "a ?variable");
      const body = parseEffect(file, c.next("an effect in (forall …)"));
      c.end("(forall …)");
      return { kind: "forall", vars, body, pos };
    }
    case "when": {
      const cond = parseFormula(file, c.next("a condition after 'when'"), "condition");
      const body = parseEffect(file, c.next("an effect in (when …)"));
      c.end("(when …)");
      return { kind: "when", cond, body, pos };
    }
    case "increase": {
      const f = c.list("(total-cost) after 'increase'");
      const fh = f.items[0];
      if (!fh || fh.kind !== "atom" || fh.text !== TOTAL_COST || f.items.length !== 1) {
        throw new PlumblineError(
          "unsupported",
          `numeric fluent ${describe(f)}: only (increase (total-cost) …) is supported (numeric fluents are not)`,
          posOf(file, f),
        );
      }
      const amount = parseCostAmount(file, c);
      c.end("(increase …)");
      return { kind: "cost", amount, pos };
    }
    case "or":
    case "exists":
    case "imply":
      throw errorAt(file, h, `'${key}' is a condition, not an effect`);
    default:
      if (NUMERIC_EFFECTS.has(key)) {
        throw new PlumblineError("unsupported", `numeric effect '${key}': numeric fluents are not supported (only (increase (total-cost) …))`, pos);
      }
      if (key) return { kind: "add", atom: parseAtom(file, n), pos };
  }
  throw errorAt(file, h, `expected a predicate name or an effect keyword (and, not, forall, when, increase), found ${describe(h)}`);
}
