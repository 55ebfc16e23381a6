// Reads the body of every state-changing request here, counting bytes as they arrive, and stops at
// the limit with 413 whatever Content-Length or Transfer-Encoding claim (a chunked body has no
// length at all). Routes then read the buffered body through h3 as usual.
import type { H3Event } from 'h3'

/** Bytes: JSON bodies. */
export const BODY_LIMIT_BYTES = 1024 * 1024
/** Bytes: a catalogue file upload (multipart). */
export const UPLOAD_LIMIT_BYTES = 12 * 1024 * 1024

/** ms: how long a refused connection stays open after the 413 is out, so the client reads it. */
const LINGER_MS = 1000
/** ms: the longest a refused connection stays open at all. */
const MAX_LINGER_MS = 5000

function tooLarge(event: H3Event, limit: number): never {
  // Stop reading: TCP back-pressure holds the sender, nothing more is received or kept. The socket
  // is closed shortly after the 413 has been written; closing at once (or `Connection: close`,
  // which makes Node close on finish) resets the connection while the client is still sending, and
  // the client loses the answer.
  const req = event.node.req
  req.pause()
  const socket = req.socket
  const close = () => socket?.destroy()
  setTimeout(close, MAX_LINGER_MS).unref()
  event.node.res.once('finish', () => setTimeout(close, LINGER_MS).unref())
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
        req.pause()
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
