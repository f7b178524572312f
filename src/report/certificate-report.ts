// The HTML page of one certificate: what is claimed, the audit verdict with its checks, the
// plan as a timeline (lanes by actor) and as a table, bound convergence, the horizon
// derivation as a table, and the certificate's own fields (hashes, encoding, proof).
import type { AuditView, CertificateView } from "./certificate-view.js";
import { findField, isObj } from "./certificate-view.js";
import { boundsChart, planTimelineChart } from "./charts.js";
import { badge, htmlTable, page, section, tile } from "./html.js";
import { checkWords } from "../certify/check-words.js";
import { esc } from "./svg.js";
import { formatSeconds } from "./text-table.js";

const show = (v: unknown): string => {
  if (v === null || v === undefined) return "–";
  if (typeof v === "string") return v;
  if (typeof v === "number" || typeof v === "boolean") return String(v);
  return JSON.stringify(v);
};

/** Nested JSON as (dotted key, value) rows; long arrays are summarised. */
export function flatten(v: unknown, prefix = "", out: Array<[string, string]> = [], depth = 0): Array<[string, string]> {
  if (isObj(v) && depth < 4) {
    for (const [k, x] of Object.entries(v)) flatten(x, prefix ? `${prefix}.${k}` : k, out, depth + 1);
  } else if (Array.isArray(v) && v.length > 0 && v.length <= 8 && depth < 4 && v.some((x) => isObj(x) || Array.isArray(x))) {
    v.forEach((x, i) => flatten(x, `${prefix}[${i}]`, out, depth + 1));
  } else if (Array.isArray(v) && v.length > 12) {
    out.push([prefix, `[${v.slice(0, 12).map(show).join(", ")}, … ${v.length} items]`]);
  } else out.push([prefix, show(v)]);
  return out;
}

/** The horizon methods list, wherever the certificate keeps it. */
function horizonMethods(cert: Record<string, unknown>): { methods: Array<Record<string, unknown>>; holder: Record<string, unknown> } | null {
  const visit = (o: Record<string, unknown>, depth: number): { methods: Array<Record<string, unknown>>; holder: Record<string, unknown> } | null => {
    if (Array.isArray(o.methods) && o.methods.every(isObj)) return { methods: o.methods as Array<Record<string, unknown>>, holder: o };
    if (depth >= 3) return null;
    for (const v of Object.values(o)) if (isObj(v)) {
      const r = visit(v, depth + 1);
      if (r) return r;
    }
    return null;
  };
  return visit(cert, 0);
}

/** A suffix-unsat claim: no threshold was needed; say so beside the one it made unnecessary. */
function suffixSection(cert: Record<string, unknown>): string | null {
  const claim = cert.claim;
  if (!isObj(claim) || claim.how !== "suffix-unsat") return null;
  const enc = isObj(cert.encoding) ? cert.encoding : {};
  const steps = isObj(enc.params) ? enc.params.steps : undefined;
  const avoided = isObj(cert.thresholdAvoided) ? cert.thresholdAvoided : null;
  const pp = isObj(enc.partParams) && isObj(enc.partParams["relaxed-suffix-1"]) ? enc.partParams["relaxed-suffix-1"] : null;
  const pairs = pp && Array.isArray(pp.pairs) ? pp.pairs.length : 0;
  return (
    `<p><strong>Proved at horizon ${esc(show(steps))} with a relaxed suffix</strong>: no plan cheaper than the claimed cost exists at any length — ` +
    `${esc(show(steps))} real steps (never idle, no state repeated before the goal${pairs > 0 ? `; ${pairs} state pairs made distinct` : ""}), then the goal reached ignoring deletes, with every action's cost counted, is already too dear.</p>` +
    (avoided
      ? `<p>A proof at a completeness threshold would have needed <strong>${esc(show(avoided.horizon))}</strong> steps (${esc(show(avoided.method))}, for cost &lt; ${esc(show(avoided.upperCost))}); this figure is informational — the audit does not use it.</p>`
      : "") +
    `<p class="note">audit rebuilds this formula from the model and checks the proof; no horizon needs recomputing.</p>`
  );
}

function derivationSection(cert: Record<string, unknown>): string {
  const suffix = suffixSection(cert);
  if (suffix !== null) return suffix;
  const h = horizonMethods(cert);
  if (!h) {
    const d = findField(cert, ["derivation", "horizonDerivation", "horizon"]);
    if (d === undefined) {
      const claim = isObj(cert.claim) ? cert.claim : {};
      if (claim.how === "state-space" && isObj(cert.stateSpace))
        return `<p><strong>Proved by exhaustive search</strong> of all ${esc(show(cert.stateSpace.states))} reachable states (no SAT proof): no plan is cheaper. audit repeats that search itself.</p>`;
      if (claim.how === "landmark-search" && isObj(cert.search))
        return `<p><strong>Proved by a recorded A* search with landmark bounds</strong> (${esc(show(cert.search.states))} states, ${esc(show(cert.search.expanded))} expanded; no SAT proof): every state the search did not expand carries landmarks showing that no plan through it is cheaper. audit checks every state of the record.</p>`;
      return `<p class="note">The certificate records no horizon derivation (a lower-bound or unsolvability claim needs none).</p>`;
    }
    return htmlTable(["quantity", "value"], flatten(d).map(([k, v]) => [`<code>${esc(k)}</code>`, `<span class="mono">${esc(v)}</span>`]), { left: [1] });
  }
  const winner = typeof h.holder.winner === "string" ? h.holder.winner : null;
  const rows = h.methods.map((m) => {
    const name = String(m.method ?? m.name ?? "?");
    const inputs = flatten(m.derivation ?? {})
      .map(([k, v]) => `${k} = ${v}`)
      .join("; ");
    const isWinner = name === winner;
    return [
      isWinner ? `<strong>${esc(name)}</strong> ✓` : esc(name),
      m.value === null || m.value === undefined ? `<span class="note">not applicable</span>` : isWinner ? `<strong>${esc(show(m.value))}</strong>` : esc(show(m.value)),
      m.sound === false ? `<strong style="color:#b3261e">no</strong>` : esc(show(m.sound ?? "–")),
      `<span class="mono">${esc(inputs)}</span>`,
    ];
  });
  const top = Object.entries(h.holder)
    .filter(([k, v]) => k !== "methods" && !isObj(v) && !Array.isArray(v))
    .map(([k, v]) => [`<code>${esc(k)}</code>`, esc(show(v))]);
  return (
    (top.length ? htmlTable(["quantity", "value"], top, { left: [1] }) + "<h3>Methods</h3>" : "") +
    `<div class="scroll">${htmlTable(["method", "horizon", "sound", "numbers it used"], rows, { wrap: [3] })}</div>` +
    `<p class="note">The horizon is the smallest sound bound; a plan cheaper than the claimed cost would have to fit within that many steps, and the proof shows none does. audit recomputes every number here.</p>`
  );
}

function auditSection(a: AuditView): string {
  const source = a.source === "run" ? "audited just now" : a.source === "recorded" ? "recorded by an earlier audit (not re-run)" : "not audited";
  const head = `<p>${badge(a.status)} <span class="note">${esc(source)}${a.seconds !== null ? `, ${esc(formatSeconds(a.seconds))}` : ""}${a.note ? ` — ${esc(a.note)}` : ""}</span></p>`;
  if (!a.checks.length) return head;
  // each check in plain words first (certify/check-words.ts), its name and technical detail beside it
  return head + htmlTable(["check", "result", "detail"], a.checks.map((c) => [`${esc(checkWords(c.name))} <span class="note">(${esc(c.name)})</span>`, c.ok === null ? "–" : badge(c.ok ? "valid" : "invalid").replace(/>valid</, ">passed<").replace(/>invalid</, ">FAILED<"), `<span class="note">${esc(c.detail)}</span>`]), { left: [1, 2] });
}

export function certificateReportHtml(v: CertificateView, audit: AuditView): string {
  const c = v.certificate;
  const claim = findField(c, ["claim"]);
  const claimText = isObj(claim) ? [claim.status ?? claim.kind ?? claim.claim, claim.method ?? claim.how ?? claim.by].filter((x) => x !== undefined).map(show).join(" · ") : show(claim);
  const cost = findField(c, ["cost", "planCost"]);
  const length = findField(c, ["length", "planLength"]);
  const suffixSteps = isObj(claim) && claim.how === "suffix-unsat" && isObj(c.encoding) && isObj(c.encoding.params) ? c.encoding.params.steps : undefined;
  const horizon = suffixSteps !== undefined ? `${show(suffixSteps)} (relaxed suffix)` : (horizonMethods(c)?.holder.horizon ?? findField(c, ["horizon"]));
  const parts: string[] = [];
  parts.push(
    `<div class="tiles">${[
      tile("claim", claimText || "–"),
      tile("plan cost", show(cost ?? v.planCost)),
      tile("plan length", show(length ?? v.plan?.length)),
      tile("horizon", typeof horizon === "number" || typeof horizon === "string" ? String(horizon) : "–"),
      tile("audit", audit.status, audit.status === "valid" ? "good" : audit.status === "rejected" ? "bad" : undefined),
    ].join("")}</div>`,
  );
  if (audit.status === "rejected") parts.push(`<div class="alarm"><h2>⚠ The audit rejected this certificate</h2><p>Do not rely on its optimality claim. The failing checks are listed below.</p></div>`);
  parts.push(section("Audit", auditSection(audit), "audit"));

  let planBody: string;
  if (v.plan) {
    let cum = 0;
    const rows = v.plan.map((s, i) => {
      cum += s.cost;
      return [String(i + 1), `<span class="mono">(${esc([s.name, ...s.args].join(" "))})</span>`, String(s.cost), String(cum)];
    });
    planBody =
      (v.plan.length ? `<figure>${planTimelineChart(v.plan)}<figcaption>One block per action, in the lane of its first argument (usually who acts); colour by kind of action. Hover a block for its cost.</figcaption></figure>` : `<p>The goal holds in the initial state: the empty plan.</p>`) +
      `<details${v.plan.length <= 40 ? " open" : ""}><summary>Plan actions (${v.plan.length})</summary><div class="scroll">${htmlTable(["#", "action", "cost", "total"], rows, { left: [1] })}</div></details>` +
      (v.planNote ? `<p class="note"><strong>${esc(v.planNote)}</strong></p>` : `<p class="note">Costs from replaying plan.txt on the lifted model in this folder: total ${v.planCost}.</p>`);
  } else planBody = `<p class="note">${esc(v.planNote ?? "no plan")}</p>`;
  parts.push(section("Plan", planBody, "plan"));

  const lb = findField(c, ["lowerBound"]);
  parts.push(
    section(
      "Bound convergence",
      v.timeline.length
        ? `<figure>${boundsChart(v.problemName, [{ configuration: "solve", timeline: v.timeline, end: Math.max(...v.timeline.map((p) => p.seconds)) }], typeof cost === "number" ? cost : null, { width: 720, height: 280 })}<figcaption>Solid: cost of the best plan known; dashed: the best proven lower bound. They meet where optimality was proven. Drawn from the certificate's timeline as the solver recorded it: audit does not verify the timeline (informational only); the verified claim is the audit's verdict above.</figcaption></figure>`
        : `<p class="note">The certificate records no timeline of bounds${typeof lb === "number" ? `; its lower bound is ${lb}` : ""}.</p>`,
      "bounds",
    ),
  );
  parts.push(section("Horizon derivation", derivationSection(c), "horizon"));
  const rows = flatten(c)
    .filter(([k]) => !/(^|\.)methods(\[|$)|timeline/.test(k))
    .map(([k, val]) => [`<code>${esc(k)}</code>`, `<span class="mono">${esc(val.length > 160 ? val.slice(0, 160) + "…" : val)}</span>`]);
  parts.push(section("Certificate contents", `<div class="scroll">${htmlTable(["field", "value"], rows, { wrap: [1] })}</div><p class="note">Folder: <code>${esc(v.dir)}</code>. Anyone can re-check it with <code>plumbline audit</code>; it trusts only the domain and problem files.</p>`, "contents"));
  return page(`plumbline certificate: ${v.problemName}`, `${esc(claimText || "no claim")} · cost ${esc(show(cost ?? v.planCost))} · audit ${esc(audit.status)}`, parts.join("\n"));
}
