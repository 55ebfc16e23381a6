// Provenance texts are long (method + published sources) and the same for every row of a topology:
// the compact form names each text once per answer and gives the rows a stable short id.
import { createHash } from 'node:crypto'

interface Provenance { method: string, source: string }
const ids = new Map<string, string>() // a pure function's memo: the id depends only on the texts

function idOf(p: Provenance) {
  const key = `${p.method}\u0000${p.source}`
  let id = ids.get(key)
  if (!id) {
    id = `p-${createHash('sha256').update(key).digest('hex').slice(0, 10)}`
    if (ids.size < 10_000) ids.set(key, id)
  }
  return id
}

const isProvenance = (v: unknown): v is Provenance =>
  !!v && typeof v === 'object' && typeof (v as Provenance).method === 'string' && typeof (v as Provenance).source === 'string'

/** Replaces every `provenance: { method, source }` in the answer by `provenanceId` and adds the texts once. */
export function compactProvenance<T extends object>(answer: T): T & { provenance: Record<string, Provenance> } {
  const texts: Record<string, Provenance> = {}
  const walk = (v: unknown): unknown => {
    if (Array.isArray(v)) return v.map(walk)
    if (!v || typeof v !== 'object') return v
    const out: Record<string, unknown> = {}
    for (const [k, x] of Object.entries(v)) {
      if (k === 'provenance' && isProvenance(x)) {
        const id = idOf(x)
        texts[id] = { method: x.method, source: x.source }
        out.provenanceId = id
      }
      else out[k] = walk(x)
    }
    return out
  }
  return { ...(walk(answer) as T), provenance: texts }
}
