// The instances.json format of a scenario folder: committed instance → generator parameters
// and the exact figures derived from them (optimal cost, lengths, state count, how found).
import * as fs from "node:fs";
import * as path from "node:path";

export interface InstanceRecord {
  /** The problem name inside the file. */
  problem?: string;
  /** Size class: tiny and small instances are re-solved by the reference Dijkstra in tests. */
  size: "tiny" | "small" | "medium" | "large";
  /** Every generator parameter, seed included (the file is exactly the generator's output). */
  generator: Record<string, number> & { seed: number };
  /** What makes the instance interesting, written by hand. */
  note?: string;
  /** Reachable states (the PDDL task's and the explicit model's agree; tests check). */
  states?: number;
  optimalCost?: number | null;
  /** Fewest actions among cheapest plans. */
  optimalLength?: number | null;
  /** Fewest actions among all plans. */
  shortestLength?: number | null;
  /** Cheapest cost of a plan with at most shortestLength actions (null: not computed). */
  cheapestAtShortestLength?: number | null;
  /** Every cheapest plan is longer than a shortest plan. */
  cheapestLongerThanShortest?: boolean;
  /** Cost and length of the committed .plan file. */
  planCost?: number;
  planLength?: number;
  /** How the figures were found. */
  source?: string;
}

export function instancesFile(dir: string): string {
  return path.join(dir, "instances.json");
}

export function readInstances(dir: string): Record<string, InstanceRecord> {
  return JSON.parse(fs.readFileSync(instancesFile(dir), "utf8")) as Record<string, InstanceRecord>;
}
