// Requests from another client address: on Linux every 127.x.y.z is the loopback, so binding the
// socket to, say, 127.0.0.23 makes the server see a different client (throttling per client).
import { request as httpRequest } from 'node:http'
import { baseUrl } from './api'

export interface AddressedResponse { status: number, headers: Record<string, string | string[] | undefined>, body: any, ms: number }

export function requestFrom(localAddress: string, method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<AddressedResponse> {
  const url = new URL(path, baseUrl)
  const payload = body === undefined ? undefined : Buffer.from(JSON.stringify(body))
  return new Promise((resolve, reject) => {
    const started = performance.now()
    const req = httpRequest({
      host: url.hostname, port: url.port, path: url.pathname + url.search, method, localAddress,
      headers: { origin: baseUrl, ...(payload ? { 'content-type': 'application/json', 'content-length': String(payload.length) } : {}), ...headers },
    }, (res) => {
      const chunks: Buffer[] = []
      res.on('data', c => chunks.push(c))
      res.on('end', () => {
        const text = Buffer.concat(chunks).toString('utf8')
        let parsed: unknown = text
        try { parsed = JSON.parse(text) }
        catch { /* not JSON */ }
        resolve({ status: res.statusCode ?? 0, headers: res.headers, body: parsed, ms: performance.now() - started })
      })
    })
    req.on('error', reject)
    req.end(payload)
  })
}

/** A fresh client address per call in 127.<a>.<b>.<c>, distinct across test files and runs. */
let counter = Math.floor(Math.random() * 15_000_000)
export function freshAddress(): string {
  counter = (counter + 1) % 16_000_000
  const n = counter + 256 // skip 127.0.0.x, the address the other tests use
  return `127.${(n >> 16) & 255}.${(n >> 8) & 255}.${Math.max(2, n & 255)}`
}
