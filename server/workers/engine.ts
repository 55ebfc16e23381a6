// Entry of the worker threads (piscina). Bundled on its own by esbuild at build time into
// .output/server/workers/engine.mjs (see nuxt.config.ts and server/workers/bundle.ts).
import { runTask, type Task } from './tasks'

export default function (task: Task) {
  return runTask(task)
}
