// The pool of worker threads (piscina, one thread per core) that keeps long computations off the
// event loop, so health and cheap routes answer while evaluations, part matching, trade studies, catalogue
// reads and PDFs run. The worker file is bundled beside the server (workers/engine.mjs); under
// `nuxt dev` without it, tasks run inline.
import { existsSync } from 'node:fs'
import { availableParallelism } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'
import { promisify } from 'node:util'
import { gunzip } from 'node:zlib'
import { Piscina } from 'piscina'
import { EngineInputError } from '#shared/engine'
import { loadFonts, type PdfFonts } from '../exports/pdf'
import type { BomPurchase, BomSnapshot } from '#shared/bom/types'
import type { H3Event } from 'h3'
import { runTask, type BomPdfOptions, type EncodedTask, type Task, type TaskResult } from './tasks'
import type { EncodedAnswer } from './encode'
import { SizedCache } from '#shared/utils/sized-cache'

export const WORKER_FILE = join('workers', 'engine.mjs')
const gunzipAsync = promisify(gunzip)

/**
 * Looks for workers/engine.mjs beside the entry script (`node .output/server/index.mjs`) and in the folders
 * above this module (.nuxt/dev under `nuxt dev`). Nitro's import.meta.url is only right once the entry ran.
 */
function findWorkerFile(): string | null {
  if (process.env.STRATAVOLT_WORKER_FILE) return process.env.STRATAVOLT_WORKER_FILE
  const starts = [process.argv[1] ? dirname(process.argv[1]) : '', dirname(fileURLToPath(import.meta.url))]
  for (const start of starts.filter(Boolean)) {
    let dir = start
    for (let i = 0; i < 6; i++) {
      const candidate = join(dir, WORKER_FILE)
      if (existsSync(candidate)) return candidate
      dir = dirname(dir)
    }
  }
  return null
}

/** Threads in the pool: the cores this process may use, at least one (`STRATAVOLT_WORKERS` overrides). */
export const poolSize = Math.max(1, Number(process.env.STRATAVOLT_WORKERS) || availableParallelism())

let pool: Piscina | null | undefined
function usePool(): Piscina | null {
  if (pool !== undefined) return pool
  const file = findWorkerFile()
  if (!file) {
    if (!import.meta.dev) throw new Error(`worker file ${WORKER_FILE} is missing beside the built server: rebuild with \`nuxt build\``)
    pool = null
    return pool
  }
  pool = new Piscina({ filename: pathToFileURL(file).href, minThreads: poolSize, maxThreads: poolSize, idleTimeout: 60_000 })
  return pool
}

/** Starts the threads now (at server start) rather than on the first request. */
export function warmPool() {
  usePool()
}

export async function closePool() {
  if (pool) await pool.destroy()
  pool = undefined
}

function rethrow(result: Exclude<TaskResult, { ok: true } | { needs: unknown }>): never {
  const e = result.error
  if (e.kind === 'engine') return withEngine(() => { throw new EngineInputError(e.field, e.message) })
  throw createError({ statusCode: e.statusCode, message: e.message, data: e.data })
}

async function dispatch(task: Task | EncodedTask): Promise<TaskResult> {
  const p = usePool()
  return p ? p.run(task) as Promise<TaskResult> : runTask(task)
}

/**
 * Runs a task on a worker thread and returns its value; engine and HTTP errors are raised here as the
 * route would raise them. `supply` answers a thread whose fonts copy is missing.
 */
export async function runInPool<T>(task: Task | EncodedTask, supply?: { fonts?: () => Promise<PdfFonts> }): Promise<T> {
  let result = await dispatch(task)
  if (!result.ok && 'needs' in result) {
    if (result.needs === 'fonts' && supply?.fonts && (task.kind === 'bom-pdf' || task.kind === 'design-pdf')) result = await dispatch({ ...task, fonts: await supply.fonts() })
    if (!result.ok && 'needs' in result) throw new Error(`worker task ${task.kind} needs ${result.needs}`)
  }
  if (!result.ok) return rethrow(result)
  return result.value as T
}

/** Bytes of answers kept by answerFromPool's `key`; the least recently sent go first beyond it. */
export const KEPT_ANSWER_BYTES = 16 * 1024 * 1024

/** Encoded answers by key (gzip or plain, the task's kind, the caller's key), and the ones being computed. */
const keptAnswers = new SizedCache<EncodedAnswer>(KEPT_ANSWER_BYTES, a => a.body.byteLength)
const pendingAnswers = new Map<string, Promise<EncodedAnswer>>()

/**
 * Runs a task whose value is the route's whole answer and sends it as the thread encoded it (JSON, gzipped when
 * the client accepts gzip and it is at least THREAD_GZIP_MIN_BYTES): the route returns what this returns. The
 * compression plugin leaves a body with Content-Encoding alone, and a plain one from the thread too (marked
 * below), so a small answer the thread chose not to gzip is not gzipped after all on the event loop.
 *
 * With `key` (a digest of everything the task's answer depends on, read from the database for this request), the
 * encoded answer is kept and sent again for the same key without a thread: requests with the same key while it is
 * computed wait for that one computation. Only for tasks that are pure functions of their message.
 */
export async function answerFromPool<T = unknown>(event: H3Event, task: Task, options: { key?: string } = {}): Promise<T> {
  const gzip = acceptsGzip(event)
  const key = options.key === undefined ? null : `${gzip ? 'gzip' : 'plain'}:${task.kind}:${options.key}`
  const kept = key ? keptAnswers.get(key) : undefined
  let answer: EncodedAnswer
  if (kept) {
    answer = { ...kept, timing: { computeMs: 0, encodeMs: 0 } }
  }
  else if (key) {
    let pending = pendingAnswers.get(key)
    if (!pending) {
      pending = encodedInPool(event, task, gzip)
      pendingAnswers.set(key, pending)
      pending.then(a => keptAnswers.set(key, a), () => {}).finally(() => pendingAnswers.delete(key))
    }
    answer = await pending
  }
  else {
    answer = await encodedInPool(event, task, gzip)
  }
  return sendEncoded<T>(event, answer, undefined, !!kept)
}

/** The task's answer encoded on a thread (JSON, gzipped from THREAD_GZIP_MIN_BYTES when `gzip` or the client takes it). */
export function encodedInPool(event: H3Event | null, task: Task, gzip = !!event && acceptsGzip(event)): Promise<EncodedAnswer> {
  return runInPool<EncodedAnswer>({ ...task, encode: { gzip } } as EncodedTask)
}

const acceptsGzip = (event: H3Event) => !!getRequestHeader(event, 'accept-encoding')?.includes('gzip')

/**
 * Sends encoded answer bytes as the route's answer (gzipped ones unpacked first for a client that does not take
 * gzip, such as the server-side render's own requests). `cache` says in Server-Timing whether they were stored in
 * PostgreSQL, `kept` that they were kept on this instance (no thread work).
 */
export async function sendEncoded<T = unknown>(event: H3Event, answer: EncodedAnswer, cache?: 'hit' | 'miss', kept = false): Promise<T> {
  let { body, gzip: zipped } = answer
  if (zipped && !acceptsGzip(event)) {
    body = await gunzipAsync(body)
    zipped = false
  }
  setResponseHeader(event, 'Content-Type', 'application/json')
  // W3C Server-Timing: the thread's own work, so the load bench (or any client) can tell the per-request overhead
  const t = answer.timing
  const timing = [
    ...(t ? [...(t.validateMs === undefined ? [] : [`validate;dur=${t.validateMs.toFixed(3)}`]), `compute;dur=${t.computeMs.toFixed(3)}`, `encode;dur=${t.encodeMs.toFixed(3)}`] : []),
    ...(cache ? [`cache;desc=${cache}`] : []),
    ...(kept ? ['kept'] : []),
  ]
  if (timing.length) setResponseHeader(event, 'Server-Timing', timing.join(', '))
  appendResponseHeader(event, 'Vary', 'Accept-Encoding')
  if (zipped) setResponseHeader(event, 'Content-Encoding', 'gzip')
  else event.context.encodedOnThread = true
  // typed as the answer these bytes encode, so the route's callers ($fetch, useFetch) keep their types
  return Buffer.from(body.buffer, body.byteOffset, body.byteLength) as unknown as T
}

/** pdfmake's Roboto files from the `fonts` server asset, read once per process (sent once to each thread). */
let fontsOnce: Promise<PdfFonts> | null = null
function pdfFontsOnce() {
  fontsOnce ??= loadFonts(name => useStorage('assets:fonts').getItemRaw(name))
  return fontsOnce
}

async function pdfResult(value: Uint8Array) {
  return Buffer.from(value.buffer, value.byteOffset, value.byteLength)
}

/** A BOM as PDF, rendered on a worker thread. */
export async function renderBomPdf(snapshot: BomSnapshot, purchase: BomPurchase = {}, options?: BomPdfOptions): Promise<Buffer> {
  return pdfResult(await runInPool<Uint8Array>({ kind: 'bom-pdf', args: { snapshot, purchase, options } }, { fonts: pdfFontsOnce }))
}

/** The design report as PDF, rendered on a worker thread. */
export async function renderDesignReport(report: Extract<Task, { kind: 'design-pdf' }>['report']): Promise<Buffer> {
  return pdfResult(await runInPool<Uint8Array>({ kind: 'design-pdf', report }, { fonts: pdfFontsOnce }))
}

declare module 'h3' {
  interface H3EventContext {
    /** the answer was encoded on a worker thread (as it should go out): the compression plugin leaves it alone */
    encodedOnThread?: boolean
  }
}
