// Provenance texts are long (method + published sources) and the same for every row of a topology:
// the compact form names each text once per answer and gives the rows a stable short id.
import { createHash } from 'node:crypto'

interface Provenance { method: string, source: string }
/** method → source → id: a pure function's memo (the id depends only on the texts); two lookups, no joined key */
const ids = new Map<string, Map<string, string>>()
let remembered = 0

function idOf(p: Provenance) {
  let bySource = ids.get(p.method)
  let id = bySource?.get(p.source)
  if (!id) {
    id = `p-${createHash('sha256').update(`${p.method}\u0000${p.source}`).digest('hex').slice(0, 10)}`
    if (remembered < 10_000) {
      if (!bySource) ids.set(p.method, bySource = new Map())
      bySource.set(p.source, id)
      remembered++
    }
  }
  return id
}

const isProvenance = (v: unknown): v is Provenance =>
  !!v && typeof v === 'object' && typeof (v as Provenance).method === 'string' && typeof (v as Provenance).source === 'string'

/** Replaces every `provenance: { method, source }` in the answer by `provenanceId` and adds the texts once. */
export function compactProvenance<T extends object>(answer: T): T & { provenance: Record<string, Provenance> } {
  const texts: Record<string, Provenance> = {}
  const walk = (v: unknown): unknown => {
    if (!v || typeof v !== 'object') return v
    if (Array.isArray(v)) {
      const out: unknown[] = new Array(v.length)
      for (let i = 0; i < v.length; i++) out[i] = walk(v[i])
      return out
    }
    // numeric arrays of a waveform are copied as they are (no provenance inside typed or plain number arrays)
    if (ArrayBuffer.isView(v)) return v
    const out: Record<string, unknown> = {}
    for (const k in v) {
      const x = (v as Record<string, unknown>)[k]
      if (k === 'provenance' && isProvenance(x)) {
        const id = idOf(x)
        texts[id] ??= { method: x.method, source: x.source }
        out.provenanceId = id
      }
      else out[k] = walk(x)
    }
    return out
  }
  return { ...(walk(answer) as T), provenance: texts }
}
