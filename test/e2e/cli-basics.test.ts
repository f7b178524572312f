// The CLI's outer contract: help, version, unknown commands and options map to the
// exit codes of DESIGN.md and never print a stack trace.
import { describe, expect, it } from "vitest";
import { cli } from "../support/cli.js";

describe("plumbline CLI basics", () => {
  it("--help exits 0 and names the tool", async () => {
    const r = await cli(["--help"]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain("plumbline");
    expect(r.stdout).toContain("only as good as the model");
  });

  it("an unknown command is a usage error (exit 2) without a stack trace", async () => {
    const r = await cli(["no-such-command"]);
    expect(r.code).toBe(2);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });
});
