// Starting a worker thread on a module of ours, whether we run as compiled JavaScript or as
// TypeScript sources through tsx (the new thread then needs tsx's loader registered first).
import { Worker } from "node:worker_threads";

/**
 * A worker running the module `stem` (".js" compiled, ".ts" under tsx) next to the module whose
 * `import.meta.url` is `self`, with `workerData` = `data`.
 */
export function startThread(self: string, stem: string, data: unknown): Worker {
  if (!self.endsWith(".ts")) return new Worker(new URL(`./${stem}.js`, self), { workerData: data });
  const loader = import.meta.resolve("tsx/esm/api");
  const entry = new URL(`./${stem}.ts`, self).href;
  // tsx's own --require/--import hooks must not be inherited: they would load the entry a second way
  const execArgv: string[] = [];
  for (let i = 0; i < process.execArgv.length; i++) {
    const a = process.execArgv[i];
    if ((a === "--require" || a === "--import") && /tsx/.test(process.execArgv[i + 1] ?? "")) i++;
    else if (!/tsx/.test(a)) execArgv.push(a);
  }
  const boot = `import(${JSON.stringify(loader)}).then((m) => { m.register(); return import(${JSON.stringify(entry)}); })`;
  return new Worker(boot, { eval: true, workerData: data, execArgv });
}
