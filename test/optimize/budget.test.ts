// The optimizer's pause between SAT time slices (turn-taking with the A* helper on one core) must
// never delay a stop: Budget.sleep ends at the deadline and on an abort, whichever comes first.
import { afterEach, describe, expect, it } from "vitest";
import { Budget } from "../../src/optimize/budget.js";
import { clearAbort, requestAbort } from "../../src/util/limits.js";

afterEach(() => clearAbort());

describe("Budget.sleep", () => {
  it("waits the time asked when nothing stops it", async () => {
    const b = new Budget({});
    const t0 = Date.now();
    await b.sleep(120);
    expect(Date.now() - t0).toBeGreaterThanOrEqual(110);
  });

  it("ends at the deadline, not after the time asked", async () => {
    const b = new Budget({ timeLimit: 0.2 });
    await b.sleep(600_000); // the test would time out if the deadline did not end it
    expect(b.stop()).toBe("time");
  });

  it("ends when the abort signal fires, and when the abort flag is raised", async () => {
    const ac = new AbortController();
    const b = new Budget({ signal: ac.signal });
    setTimeout(() => ac.abort(), 100);
    await b.sleep(600_000);
    expect(b.stop()).toBe("interrupted");
    const c = new Budget({});
    setTimeout(() => requestAbort(), 100);
    await c.sleep(600_000);
    expect(c.stop()).toBe("interrupted");
  });
});
