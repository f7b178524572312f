// Per-state bookkeeping shared by A* and GBFS: the state table plus growable columns
// (g, h, parent, creating action, closed flag) and plan extraction along parent links.
import type { CompiledTask } from "./compiled.js";
import { GrowF64, GrowI32, StateTable } from "./state-table.js";
import type { SearchResult, StopReason } from "./types.js";

export interface RunStats {
  expanded: number;
  generated: number;
  /** performance.now() at the start. */
  t0: number;
  heuristic: string;
  /** Bytes of the open lists and other arrays outside the space. */
  extraBytes: number;
}

export class SearchSpace {
  readonly table: StateTable;
  readonly g = new GrowF64(1024, Infinity);
  readonly h = new GrowF64(1024, -1);
  readonly parent = new GrowI32(1024, -1);
  readonly via = new GrowI32(1024, -1);
  readonly closed = new GrowI32(1024, 0);

  constructor(ct: CompiledTask) {
    this.table = new StateTable(ct.words);
  }

  /** Interns the state in buf and makes sure every column covers its id. */
  intern(buf: Uint32Array): number {
    const id = this.table.intern(buf, 0);
    if (this.table.isNew) {
      this.g.ensure(id);
      this.h.ensure(id);
      this.parent.ensure(id);
      this.via.ensure(id);
      this.closed.ensure(id);
    }
    return id;
  }

  get bytes(): number {
    return this.table.bytes + this.g.a.byteLength + this.h.a.byteLength + this.parent.a.byteLength + this.via.a.byteLength + this.closed.a.byteLength;
  }

  /** Action ids from the initial state (id 0) to `id`. */
  planTo(id: number): number[] {
    const plan: number[] = [];
    let cur = id;
    let guard = this.table.size + 1;
    while (cur !== 0) {
      if (--guard < 0) throw new Error("search: parent links form a cycle");
      plan.push(this.via.a[cur]);
      cur = this.parent.a[cur];
    }
    return plan.reverse();
  }

  /** The fields every search reports, for a goal state id (or -1). */
  result(status: SearchResult["status"], goalId: number, st: RunStats, stopReason?: StopReason): SearchResult {
    return {
      status,
      plan: goalId >= 0 ? this.planTo(goalId) : null,
      cost: goalId >= 0 ? this.g.a[goalId] : null,
      expanded: st.expanded,
      generated: st.generated,
      seconds: (performance.now() - st.t0) / 1000,
      heuristic: st.heuristic,
      initialH: this.h.a[0],
      stopReason,
      states: this.table.size,
      searchBytes: this.bytes + st.extraBytes,
    };
  }
}
