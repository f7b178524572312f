// Certificates written before this release's renames say some things in older words (horizon
// methods "explicit-optimal" and "explicit", derivation keys c_min and c_min_positive, encoding keys
// extensions, costCap and boundUnits). Reading one
// renames them in memory to today's words, so the audit compares like with like and every older
// certificate keeps auditing; the files themselves are never changed (nothing hashed is touched).

/** Horizon method names: older → today's (README "Words plumbline uses"). */
export const OLDER_METHOD_NAMES: Readonly<Record<string, string>> = { "explicit-optimal": "optimal-length", explicit: "reachable-states" };

/** Derivation keys: older → today's. */
const OLDER_DERIVATION_KEYS: Readonly<Record<string, string>> = { c_min: "minCost", c_min_positive: "minPositiveCost" };

/** Derivation texts that named a method or key: older → today's. */
const OLDER_TEXTS: Readonly<Record<string, string>> = {
  "superseded by the explicit-optimal method": "superseded by the optimal-length method",
  "floor((C - 1 - h) / c_min), h = lower bound on the sum of (cost - c_min) over a plan": "floor((C - 1 - h) / minCost), h = lower bound on the sum of (cost - minCost) over a plan",
  "min(k + sum over zero-cost SCCs S of K(S), k + (k + 1) * l0), k = floor((C - 1 - h) / c_min_positive)":
    "min(k + sum over zero-cost SCCs S of K(S), k + (k + 1) * l0), k = floor((C - 1 - h) / minPositiveCost)",
};

const isObj = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === "object" && !Array.isArray(v);

/** A derivation with its older keys and texts renamed (deeply; values are otherwise kept as they are). */
function renameDerivation(v: unknown): unknown {
  if (typeof v === "string") return OLDER_TEXTS[v] ?? v;
  if (Array.isArray(v)) return v.map(renameDerivation);
  if (!isObj(v)) return v;
  const out: Record<string, unknown> = {};
  for (const [k, x] of Object.entries(v)) out[OLDER_DERIVATION_KEYS[k] ?? k] = renameDerivation(x);
  return out;
}

/** A recorded horizon report in today's words: method names, the winner, derivation keys and texts. */
export function horizonInTodaysWords(horizon: unknown): unknown {
  if (!isObj(horizon)) return horizon;
  const out: Record<string, unknown> = { ...horizon };
  if (typeof out.winner === "string") out.winner = OLDER_METHOD_NAMES[out.winner] ?? out.winner;
  if (Array.isArray(out.methods)) {
    out.methods = out.methods.map((m) => {
      if (!isObj(m)) return m;
      const method = typeof m.method === "string" ? (OLDER_METHOD_NAMES[m.method] ?? m.method) : m.method;
      return { ...m, method, derivation: renameDerivation(m.derivation) };
    });
  }
  return out;
}

/** Encoding keys: older → today's (certify/format.ts). */
const OLDER_ENCODING_KEYS: Readonly<Record<string, string>> = { extensions: "parts", boundUnits: "costBoundClauses" };
const OLDER_PARAM_KEYS: Readonly<Record<string, string>> = { costCap: "costCountedUpTo" };

/** Renames the keys of `o` by `names` (a key whose new name is already there is left as it is). */
function renameKeys(o: Record<string, unknown>, names: Readonly<Record<string, string>>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(o)) {
    const now = names[k];
    if (now !== undefined && !(now in o)) out[now] = v;
    else out[k] = v;
  }
  return out;
}

/**
 * certificate.json as read, in today's words: the horizon report (older method names and keys)
 * and the encoding record (older keys) renamed. A certificate already in today's words comes back unchanged.
 */
export function inTodaysWords<T>(cert: T): T {
  if (!isObj(cert)) return cert;
  const out: Record<string, unknown> = { ...cert };
  if ("horizon" in out) out.horizon = horizonInTodaysWords(out.horizon);
  if (isObj(out.encoding)) {
    const enc = renameKeys(out.encoding, OLDER_ENCODING_KEYS);
    if (isObj(enc.params)) enc.params = renameKeys(enc.params, OLDER_PARAM_KEYS);
    out.encoding = enc;
  }
  const avoided = out.thresholdAvoided;
  if (isObj(avoided) && typeof avoided.method === "string") out.thresholdAvoided = { ...avoided, method: OLDER_METHOD_NAMES[avoided.method] ?? avoided.method };
  return out as T;
}
