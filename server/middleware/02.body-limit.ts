// Reads the body of every state-changing request here, counting bytes as they arrive, and stops at
// the limit with 413 whatever Content-Length or Transfer-Encoding claim (a chunked body has no
// length at all). Routes then read the buffered body through h3 as usual.
import type { H3Event } from 'h3'

/** Bytes: JSON bodies. */
export const BODY_LIMIT_BYTES = 1024 * 1024
/** Bytes: a catalogue file upload (multipart). */
export const UPLOAD_LIMIT_BYTES = 12 * 1024 * 1024

/** Bytes of a refused body still read and dropped, so the client can read the 413 (then the socket closes). */
const DRAIN_BYTES = 8 * 1024 * 1024
const DRAIN_MS = 5000

function tooLarge(event: H3Event, limit: number): never {
  // Closing at once with unread data makes the kernel reset the connection and the client
  // loses the answer; dropping a bounded amount first lets it see the 413. Nothing is kept.
  const req = event.node.req
  const socket = req.socket
  let dropped = 0
  const close = () => { clearTimeout(timer); socket?.destroy() }
  const timer = setTimeout(close, DRAIN_MS)
  timer.unref()
  req.on('data', (chunk: Buffer) => { dropped += chunk.length; if (dropped > DRAIN_BYTES) close() })
  req.on('end', () => clearTimeout(timer))
  req.resume()
  setResponseHeader(event, 'Connection', 'close')
  throw createError({ statusCode: 413, message: `The request body is larger than ${Math.round(limit / 1024 / 1024)} MB.` })
}

function readCapped(event: H3Event, limit: number): Promise<Buffer | 'too-large'> {
  const req = event.node.req
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    let received = 0
    const cleanup = () => {
      req.off('data', onData)
      req.off('end', onEnd)
      req.off('error', onError)
    }
    const onData = (chunk: Buffer) => {
      received += chunk.length
      if (received > limit) {
        cleanup()
        chunks.length = 0
        resolve('too-large')
        return
      }
      chunks.push(chunk)
    }
    const onEnd = () => { cleanup(); resolve(Buffer.concat(chunks)) }
    const onError = (err: Error) => { cleanup(); reject(err) }
    req.on('data', onData)
    req.on('end', onEnd)
    req.on('error', onError)
  })
}

export default defineEventHandler(async (event) => {
  const method = event.method
  if (method === 'GET' || method === 'HEAD' || method === 'OPTIONS') return
  if (!event.path.startsWith('/api/')) return
  const limit = isUploadRoute(event.path) ? UPLOAD_LIMIT_BYTES : BODY_LIMIT_BYTES
  const declared = Number(getHeader(event, 'content-length') ?? 0)
  if (declared > limit) tooLarge(event, limit)
  const chunked = /\bchunked\b/i.test(getHeader(event, 'transfer-encoding') ?? '')
  if (!chunked && !(declared > 0)) return // no body
  const body = await readCapped(event, limit).catch(() => {
    throw createError({ statusCode: 400, message: 'The request body could not be read.' })
  })
  if (body === 'too-large') tooLarge(event, limit)
  // h3's readRawBody / readBody / readMultipartFormData take this buffer first.
  ;(event as unknown as { _requestBody?: Buffer })._requestBody = body
})
