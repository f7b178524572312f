// The tool version, recorded in certificates and printed by --version;
// read once from package.json so there is a single source of truth.
import { readFileSync } from "node:fs";

function readVersion(): string {
  try {
    const url = new URL("../../package.json", import.meta.url);
    return (JSON.parse(readFileSync(url, "utf8")) as { version: string }).version;
  } catch {
    return "0.0.0";
  }
}

export const VERSION: string = readVersion();
