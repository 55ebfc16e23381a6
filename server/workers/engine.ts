// Entry of the worker threads (piscina). Bundled on its own by esbuild at build time into
// .output/server/workers/engine.mjs (see nuxt.config.ts and server/workers/bundle.ts).
import { setPriority } from 'node:os'
import { runTask, type Task } from './tasks'

// Computations yield the CPU to the event loop (health, sign-in, light routes) when the cores are busy.
// On Linux the nice value is per thread: this lowers only this worker thread, not the main one.
try {
  setPriority(Number(process.env.STRATAVOLT_WORKER_NICE ?? 10))
}
catch { /* not permitted here: run at normal priority */ }

export default function (task: Task) {
  return runTask(task)
}
