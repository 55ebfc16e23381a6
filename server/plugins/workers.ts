// Starts the worker threads with the server (not on the first request) and stops them on shutdown.
import { closePool, warmPool } from '../workers/pool'

export default defineNitroPlugin((nitro) => {
  warmPool()
  nitro.hooks.hook('close', () => closePool())
})
