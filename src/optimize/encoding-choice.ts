// Which encoding the optimizer builds its formulas with: the default (the best measured
// combination, see DEVELOPERS.md "Encodings"), or what --encoding names — a bare step encoding or a full formula id.
import { chooseCostEncoding, type CostEncodingId, type PartId, type StepEncodingId } from "../encode/index.js";
import type { Task } from "../ground/task.js";
import { PlumblineError } from "../util/errors.js";
import { encodeOptionsOf, parseFormulaId, type FormulaSpec } from "./formula.js";

export const DEFAULT_ENCODING: StepEncodingId = "forall-1";
export const DEFAULT_PARTS: readonly PartId[] = ["reach-1", "empty-steps-last-1"];

export interface EncodingChoice {
  encoding: StepEncodingId;
  /** "auto": chosen per formula by size (chooseCostEncoding), and recorded in its spec. */
  cost: CostEncodingId | "auto";
  parts: PartId[];
}

/**
 * A bare step encoding ("seq-1") takes the default cost choice and parts; a full formula id
 * ("forall-1+cost-adder-1+empty-steps-last-1") is used exactly. Unknown ids are usage errors.
 */
export function resolveEncoding(text: string | undefined): EncodingChoice {
  if (text === undefined) return { encoding: DEFAULT_ENCODING, cost: "auto", parts: [...DEFAULT_PARTS] };
  let id;
  try {
    id = parseFormulaId(text);
  } catch (e) {
    throw new PlumblineError("usage", `--encoding: ${(e as Error).message}`);
  }
  return { encoding: id.encoding, cost: id.cost ?? "auto", parts: id.parts ?? [...DEFAULT_PARTS] };
}

/** The formula spec for `steps` steps and bound settings, the cost encoding chosen when "auto". */
export function specFor(task: Task, choice: EncodingChoice, base: Omit<FormulaSpec, "encoding" | "cost" | "parts">): FormulaSpec {
  const spec: FormulaSpec = { ...base, encoding: choice.encoding, cost: "cost-adder-1", parts: [...choice.parts] };
  spec.cost = choice.cost === "auto" ? chooseCostEncoding(task, encodeOptionsOf(spec)).id : choice.cost;
  return spec;
}
