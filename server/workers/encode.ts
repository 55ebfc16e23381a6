// An answer made ready to send on the worker thread that computed it: JSON text, gzipped when the client takes
// gzip and the body is large enough to gain (THREAD_GZIP_MIN_BYTES). The main thread then only writes bytes: it
// does not rebuild the object from the thread message (a structured clone of a 20-point evaluation costs more than its JSON), does
// not serialise it and does not start a zlib stream for it.
import { gzipSync } from 'node:zlib'

/** Bytes: the compression plugin sends bodies below this as they are (compressing them makes them larger). */
export const COMPRESS_MIN_BYTES = 1024

/**
 * Bytes: answers encoded here are gzipped from this size. Below it the body is a few TCP segments and gzip costs
 * the thread more than the bytes cost the network: measured on the 5.8 KB stress answer, encode 0.42 ms with gzip
 * against 0.11 ms without (Server-Timing, single round trips on the loaded 2-core machine), to save 4 KB.
 */
export const THREAD_GZIP_MIN_BYTES = 8 * 1024

export interface EncodeRequest { gzip: boolean }
export interface EncodedAnswer {
  body: Uint8Array
  gzip: boolean
  /** ms the thread spent validating the body (tasks that carry it), computing the value and encoding it (sent as Server-Timing, so a client can tell overhead from work) */
  timing?: { validateMs?: number, computeMs: number, encodeMs: number }
}

export function encodeAnswer(value: unknown, request: EncodeRequest): EncodedAnswer {
  const json = Buffer.from(JSON.stringify(value) ?? 'null')
  const gzip = request.gzip && json.byteLength >= THREAD_GZIP_MIN_BYTES
  const bytes = gzip ? gzipSync(json) : json
  // a thread boundary copies a plain view of exactly these bytes (a pooled Buffer's backing store can be larger)
  return { body: new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength), gzip }
}
