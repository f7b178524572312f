// JUnit XML for a bulk audit — the result format CI systems read: one testcase per certificate,
// one <failure> naming every failed check, <error> for certificates without a verdict.
import { hostname } from "node:os";
import type { BulkEntry } from "../certify/index.js";
import { VERSION } from "../util/version.js";
import { esc } from "./svg.js";

// The elements and attributes follow the published JUnit XML schemas (the JUnit 4 schema of the
// Jenkins JUnit model, and the Apache Ant one): testsuites > testsuite > testcase > failure | error.
// Every attribute either schema requires is written (testsuite: name, tests, failures, errors,
// time, timestamp without a zone, hostname, and inside testsuites package and id; testcase: name,
// classname, time), and a testcase holds at most one failure or error element, as the Ant schema allows.

/** Text safe inside XML 1.0: characters XML forbids are dropped, markup characters escaped. */
export function xmlText(s: string): string {
  return esc(s.replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, ""));
}

const secs = (s: number) => (Number.isFinite(s) ? s.toFixed(3) : "0.000");

export interface JunitOptions {
  /** The suite's name (default "plumbline audit"). */
  name?: string;
  /** When the run started (default now). */
  started?: Date;
  /** Extra properties recorded on the suite (e.g. the time limit). */
  properties?: Record<string, string>;
}

function testcase(e: BulkEntry): string {
  const open = `    <testcase name="${xmlText(e.dir)}" classname="plumbline.audit" time="${secs(e.seconds)}"`;
  if (e.verdict === "valid") return `${open}/>`;
  let body: string;
  if (e.verdict === "rejected") {
    const lines = e.checks.filter((c) => !c.ok && !c.skipped).map((c) => `${c.name}: ${c.detail}`);
    body = `<failure message="${xmlText(`rejected: ${e.failed.join(", ")}`)}" type="rejected">${xmlText(lines.join("\n"))}</failure>`;
  } else {
    body = `<error message="${xmlText(`${e.verdict}: ${e.reason ?? ""}`)}" type="${e.verdict}">${xmlText(e.reason ?? "")}</error>`;
  }
  return `${open}>\n      ${body}\n    </testcase>`;
}

/** The JUnit XML document for `entries` (one testsuite). */
export function junitXml(entries: readonly BulkEntry[], opts: JunitOptions = {}): string {
  const failures = entries.filter((e) => e.verdict === "rejected").length;
  const errors = entries.filter((e) => e.verdict !== "valid" && e.verdict !== "rejected").length;
  const time = secs(entries.reduce((t, e) => t + e.seconds, 0));
  const name = xmlText(opts.name ?? "plumbline audit");
  const stamp = (opts.started ?? new Date()).toISOString().slice(0, 19);
  const props = { tool: `plumbline ${VERSION}`, caution: "a valid certificate speaks about the model as written: plans are only as good as the model", ...opts.properties };
  const counts = `tests="${entries.length}" failures="${failures}" errors="${errors}"`;
  return [
    `<?xml version="1.0" encoding="UTF-8"?>`,
    `<testsuites name="${name}" ${counts} time="${time}">`,
    `  <testsuite name="${name}" package="plumbline" id="0" ${counts} skipped="0" time="${time}" timestamp="${stamp}" hostname="${xmlText(hostname() || "localhost")}">`,
    `    <properties>`,
    ...Object.entries(props).map(([k, v]) => `      <property name="${xmlText(k)}" value="${xmlText(v)}"/>`),
    `    </properties>`,
    ...entries.map(testcase),
    `    <system-out/>`,
    `    <system-err/>`,
    `  </testsuite>`,
    `</testsuites>`,
    ``,
  ].join("\n");
}
