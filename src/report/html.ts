// The page shell every HTML report shares: inline CSS, no scripts, no links or requests to
// anything outside the file, and the footer saying plans are only as good as the model.
import { CHART_CSS, esc } from "./svg.js";
import { VERSION } from "../util/version.js";

const CSS = `
:root { --fg:#1d2330; --muted:#5b6475; --line:#d9dee7; --bg:#f5f7fa; --card:#fff; --accent:#0072B2; --bad:#b3261e; --good:#1e7d4f; --warn:#9a6700; }
* { box-sizing: border-box; }
body { margin:0; background:var(--bg); color:var(--fg); font:14px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,"DejaVu Sans",sans-serif; }
header { background:#14324a; color:#fff; padding:20px 32px 18px; }
header h1 { margin:0 0 4px; font-size:22px; font-weight:600; letter-spacing:.2px; }
header .sub { color:#c9d6e3; font-size:13px; }
main { max-width:1160px; margin:0 auto; padding:20px 24px 8px; }
section { background:var(--card); border:1px solid var(--line); border-radius:8px; padding:16px 20px; margin:0 0 18px; }
h2 { font-size:17px; margin:0 0 10px; font-weight:600; }
h3 { font-size:14px; margin:14px 0 6px; font-weight:600; }
p.note, .note { color:var(--muted); font-size:12.5px; margin:6px 0 0; }
.tiles { display:flex; flex-wrap:wrap; gap:12px; margin:0 0 18px; }
.tile { flex:1 1 150px; background:var(--card); border:1px solid var(--line); border-radius:8px; padding:10px 14px; }
.tile .v { font-size:24px; font-weight:600; }
.tile .v.long { font-size:17px; padding-top:5px; }
.tile .k { color:var(--muted); font-size:12px; text-transform:uppercase; letter-spacing:.5px; }
.tile.bad { border-color:var(--bad); background:#fdecea; } .tile.bad .v { color:var(--bad); }
.tile.good .v { color:var(--good); }
table { border-collapse:collapse; width:100%; font-size:13px; font-variant-numeric:tabular-nums; }
th, td { padding:5px 8px; border-bottom:1px solid var(--line); text-align:right; white-space:nowrap; }
th { background:#eef1f6; font-weight:600; position:sticky; top:0; white-space:normal; vertical-align:bottom; }
th:first-child, td:first-child, td.l, th.l, th.wrap { text-align:left; }
tbody tr:nth-child(even) td { background:#fafbfd; }
td.wrap { white-space:normal; text-align:left; word-break:break-word; }
.scroll { overflow-x:auto; max-height:560px; overflow-y:auto; border:1px solid var(--line); border-radius:6px; }
.badge { display:inline-block; padding:1px 7px; border-radius:10px; font-size:12px; font-weight:600; }
.s-optimal { background:#dff3e8; color:var(--good); } .s-feasible { background:#fff4d6; color:var(--warn); }
.s-unsolvable { background:#e4ecf7; color:#23507d; } .s-unknown, .s-unfinished { background:#eceef2; color:#4a5263; }
.s-error, .s-invalid, .s-rejected { background:#fdecea; color:var(--bad); } .s-valid { background:#dff3e8; color:var(--good); } .s-none { color:var(--muted); }
.alarm { border:3px solid var(--bad); background:#fdecea; color:var(--bad); border-radius:8px; padding:14px 18px; margin:0 0 18px; }
.alarm h2 { color:var(--bad); font-size:19px; text-transform:uppercase; }
.alarm li { margin:4px 0; color:#5c1410; }
.ok { border-left:4px solid var(--good); padding:6px 12px; background:#eef8f2; color:#17583a; border-radius:4px; }
.charts { display:grid; grid-template-columns:repeat(auto-fill,minmax(460px,1fr)); gap:12px; }
figure { margin:0; } figcaption { color:var(--muted); font-size:12.5px; margin-top:2px; }
details { margin:8px 0; } summary { cursor:pointer; color:var(--accent); font-weight:600; }
code, .mono { font-family:ui-monospace,"DejaVu Sans Mono",Menlo,Consolas,monospace; font-size:12.5px; }
footer { max-width:1160px; margin:0 auto; padding:8px 24px 28px; color:var(--muted); font-size:12.5px; }
footer strong { color:var(--fg); }
`;

export const MODEL_CAVEAT =
  "Plans are only as good as the model: a proven-optimal plan of a model that leaves out a real constraint can still be unsafe or wrong in the real world. Check the model before acting on any plan.";

/** A complete HTML document with everything inline. */
export function page(titleText: string, subtitle: string, body: string): string {
  return [
    "<!DOCTYPE html>",
    '<html lang="en">',
    "<head>",
    '<meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    // forbid every fetch: the report must work offline and leak nothing
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">`,
    `<title>${esc(titleText)}</title>`,
    `<style>${CSS}${CHART_CSS}</style>`,
    "</head>",
    "<body>",
    `<header><h1>${esc(titleText)}</h1><div class="sub">${subtitle}</div></header>`,
    `<main>${body}</main>`,
    `<footer><p><strong>${esc(MODEL_CAVEAT)}</strong></p><p>Written by plumbline ${esc(VERSION)}. This page is self-contained: no scripts, no requests.</p></footer>`,
    "</body>",
    "</html>",
    "",
  ].join("\n");
}

export function section(heading: string, body: string, id?: string): string {
  return `<section${id ? ` id="${esc(id)}"` : ""}><h2>${esc(heading)}</h2>${body}</section>`;
}

/**
 * An HTML table; cells are already-escaped markup. `left` lists left-aligned column indexes,
 * `wrap` columns whose long text may wrap (left-aligned too).
 */
export function htmlTable(headers: readonly string[], rows: readonly (readonly string[])[], opts: { left?: number[]; wrap?: number[]; className?: string } = {}): string {
  const cls = (i: number) => (opts.wrap?.includes(i) ? ' class="wrap"' : opts.left?.includes(i) ? ' class="l"' : "");
  const head = `<thead><tr>${headers.map((h, i) => `<th${cls(i)}>${esc(h)}</th>`).join("")}</tr></thead>`;
  const body = `<tbody>${rows.map((r) => `<tr>${r.map((c, i) => `<td${cls(i)}>${c}</td>`).join("")}</tr>`).join("")}</tbody>`;
  return `<table${opts.className ? ` class="${esc(opts.className)}"` : ""}>${head}${body}</table>`;
}

export function badge(word: string): string {
  return `<span class="badge s-${esc(word)}">${esc(word)}</span>`;
}

export function tile(key: string, value: string, tone?: "good" | "bad"): string {
  return `<div class="tile${tone ? ` ${tone}` : ""}"><div class="v${value.length > 12 ? " long" : ""}">${esc(value)}</div><div class="k">${esc(key)}</div></div>`;
}
