// Which PDDL requirement flags plumbline accepts and which it refuses by name, so an
// unsupported model is rejected up front with a message that says what is missing.
import type { SourcePos } from "../util/errors.js";
import { PlumblineError } from "../util/errors.js";

export const SUPPORTED_REQUIREMENTS: readonly string[] = [
  ":strips",
  ":typing",
  ":negative-preconditions",
  ":disjunctive-preconditions",
  ":equality",
  ":existential-preconditions",
  ":universal-preconditions",
  ":quantified-preconditions",
  ":conditional-effects",
  ":adl",
  ":action-costs",
];

/** Known flags plumbline does not handle, with the feature named in the refusal. */
export const REFUSED_REQUIREMENTS: Readonly<Record<string, string>> = {
  ":numeric-fluents": "numeric fluents",
  ":fluents": "numeric fluents",
  ":object-fluents": "object fluents",
  ":durative-actions": "durative actions",
  ":duration-inequalities": "durative actions",
  ":continuous-effects": "continuous effects",
  ":derived-predicates": "derived predicates",
  ":domain-axioms": "derived predicates (axioms)",
  ":timed-initial-literals": "timed initial literals",
  ":preferences": "preferences",
  ":constraints": "state-trajectory constraints",
  ":time": "processes and events",
};

/** Throws unless `name` is a requirement flag plumbline supports. */
export function checkRequirement(name: string, pos: SourcePos): void {
  if (SUPPORTED_REQUIREMENTS.includes(name)) return;
  const feature = REFUSED_REQUIREMENTS[name];
  if (feature) throw new PlumblineError("unsupported", `requirement ${name}: ${feature} are not supported`, pos);
  throw new PlumblineError("parse", `unknown requirement '${name}'; expected one of ${SUPPORTED_REQUIREMENTS.join(" ")}`, pos);
}
