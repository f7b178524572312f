// The audit's checks in plain words, for the people who act on a schedule: what each check
// establishes, without solver terms (the check's own detail says how, shown with --verbose).

/** What a passed check establishes, by check name (certify/audit.ts). */
export const CHECK_WORDS: Readonly<Record<string, string>> = {
  format: "the certificate is in a form this version of plumbline reads",
  "input-files": "the certificate holds its domain and problem files",
  "input-hashes": "the domain and problem files are the ones the certificate was made for",
  ground: "the model was read and expanded into its actions again, from the PDDL files alone",
  "plan-hash": "the plan file is the one the certificate was made with",
  "plan-replay": "the plan was run on the model: every action is allowed where it is taken, and the goal is reached",
  "plan-cost": "the plan costs what the certificate says",
  "horizon-upper-cost": "the step limit of the proof was worked out for a cost at least the plan's",
  "horizon-derivation": "the step limit was worked out again from the model and agrees: a cheaper plan, if one existed, would fit within it",
  encoding: "the formula of the proof is one this version knows how to rebuild",
  "cost-bound-clauses": "the formula asks exactly for a plan cheaper than the claimed cost",
  "cnf-hash": "the formula was rebuilt from the model and is the one the proof is about",
  "proof-hash": "the proof file is the one the certificate was made with",
  "proof-check": "an independent checker confirmed the proof: no cheaper plan exists",
  "landmarks-hash": "the lower-bound record is the one the certificate was made with",
  "landmark-check": "the lower-bound record was checked again: every plan needs actions costing at least that much",
  "lower-bound-equals-cost": "that lower bound equals the plan's cost, so no plan is cheaper",
  "relaxed-unreachable": "the goal cannot be reached even if no action ever undid anything, so no plan exists",
  finished: "the audit ran to the end",
  "second-derivation": "the step limit and the optimum were worked out a second way, by code that shares nothing with the first, and agree",
  informational: "the certificate's other figures (sizes, counts) match what the audit recomputed, or are named as not checked",
  "suffix-terms": "the proof's formula is the kind that covers plans of any length (real steps, then a relaxed suffix)",
  "state-space": "every state the model can reach was visited again by a plain search: no plan is cheaper than this one",
  "search-hash": "the search record is the one the certificate was made with",
  "search-check": "the search record was checked state by state: every way to a cheaper plan was followed or shown to cost too much",
  "landmarks-part": "the actions the formula says every plan needs were checked again: each is truly needed",
};

/** The plain sentence for a check, or its name when it has none yet. */
export function checkWords(name: string): string {
  return CHECK_WORDS[name] ?? name;
}
