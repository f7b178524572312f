// The progress line a person watching a bench sees on stderr: done/total, running, elapsed,
// redrawn in place on a terminal and printed as plain lines (one per finished run) elsewhere.
import { performance } from "node:perf_hooks";
import type { RunRecord } from "../report/record.js";

export interface ProgressSink {
  write(s: string): void;
  isTTY?: boolean;
}

export function clock(seconds: number): string {
  const s = Math.floor(seconds);
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  return `${h}:${String(m).padStart(2, "0")}:${String(s % 60).padStart(2, "0")}`;
}

export class Progress {
  private readonly start = performance.now();
  private done = 0;
  private running = 0;
  private timer: NodeJS.Timeout | null = null;

  constructor(
    private readonly sink: ProgressSink | null,
    private readonly total: number,
    private readonly skipped: number,
  ) {
    if (sink?.isTTY) this.timer = setInterval(() => this.draw(), 1000).unref();
  }

  line(): string {
    const el = (performance.now() - this.start) / 1000;
    return `[bench] ${this.done + this.skipped}/${this.total + this.skipped} done${this.skipped ? ` (${this.skipped} from before)` : ""}, ${this.running} running, ${clock(el)} elapsed`;
  }

  started(): void {
    this.running++;
    this.draw();
  }

  finished(r: RunRecord): void {
    this.running--;
    this.done++;
    if (!this.sink) return;
    const what = `${r.status}${r.cost !== null ? ` cost ${r.cost}` : ""}${r.audit !== "none" ? `, audit ${r.audit}` : ""}${r.reason ? ` — ${r.reason}` : ""}`;
    const msg = `  ${r.instance} · ${r.configuration}: ${what} (${r.seconds.toFixed(1)} s)`;
    if (this.sink.isTTY) this.sink.write(`\r\x1b[K${msg}\n`);
    else this.sink.write(`${this.line()} |${msg}\n`);
    this.draw();
  }

  private draw(): void {
    if (this.sink?.isTTY) this.sink.write(`\r\x1b[K${this.line()}`);
  }

  stop(): void {
    if (this.timer) clearInterval(this.timer);
    if (this.sink?.isTTY) this.sink.write(`\r\x1b[K${this.line()}\n`);
  }
}
