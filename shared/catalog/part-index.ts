// The catalogue as matching reads it: per position kind, the figures the fit, sizing and cost-bound checks
// need in typed columns sorted by voltage rating, so a position scans only the parts whose voltage can pass
// and reads a part object only when the part could still place among the shown candidates. Built once per
// catalogue generation; the columns (and the parts as JSON text) can live in SharedArrayBuffers, so every
// worker thread reads the same copy without cloning 100 000 objects.

import { PACKAGE_CONFIGURATION_IDS, PACKAGE_CONFIGURATIONS } from '../../catalog/columns'
import type { CatalogPart, Lifecycle } from './types'

export type PositionKind = 'switch' | 'diode' | 'clamp-diode' | 'capacitor'

export const POSITION_KINDS: readonly PositionKind[] = ['switch', 'diode', 'clamp-diode', 'capacitor']

const LIFECYCLE_RANK: Record<Lifecycle, number> = { active: 0, nrnd: 1, obsolete: 2 }

/**
 * Approval and lifecycle rank of a part: 0 for approved and active (the default view), then NRND,
 * obsolete; parts component engineering has not approved (approved === false) after all approved ones.
 * Parts without an approval flag (plain catalogue data) count as approved.
 */
export function approvalRank(part: Pick<CatalogPart, 'lifecycle'> & { approved?: boolean }): number {
  return (part.approved === false ? 3 : 0) + LIFECYCLE_RANK[part.lifecycle]
}

/** Positions of the duty's kind that one package of the part covers (0 = cannot serve it). */
export function slotsPerPackage(part: Pick<CatalogPart, 'kind' | 'packageConfiguration'>, position: PositionKind): number {
  const cfg = PACKAGE_CONFIGURATIONS[part.packageConfiguration]
  if (!cfg || !cfg.kinds.includes(part.kind)) return 0
  switch (position) {
    case 'switch': return part.kind === 'switch-diode' || part.kind === 'switch' ? cfg.switches : 0
    case 'diode': return part.kind === 'diode' ? cfg.diodes : part.kind === 'switch-diode' ? cfg.switches : 0
    // A switch package serves clamp positions only when it has clamp diodes of its own (NPC leg).
    case 'clamp-diode': return part.kind === 'diode' ? cfg.clampDiodes : part.kind === 'switch-diode' && part.packageConfiguration === 'npc-leg' ? cfg.clampDiodes : 0
    case 'capacitor': return part.kind === 'capacitor' ? 1 : 0
  }
}

/** Code of a package configuration in the columns: its place in PACKAGE_CONFIGURATION_IDS (UNKNOWN_CONFIGURATION otherwise). */
export const UNKNOWN_CONFIGURATION = PACKAGE_CONFIGURATION_IDS.length
export const OBSOLETE = LIFECYCLE_RANK.obsolete

/** One position kind's parts in columns, sorted by voltage rating (missing ratings first, ties in catalogue order). */
export interface PositionColumns {
  readonly count: number
  /** V; NaN when missing */
  readonly voltageRating: Float64Array
  /** A: current rating (semiconductors) or ripple-current rating (capacitors); NaN when missing */
  readonly currentRating: Float64Array
  /** F, capacitors; NaN when missing */
  readonly capacitance: Float64Array
  /** per piece, the lowest price of any break (Infinity without prices): cost per design is never below it × packages */
  readonly lowestPrice: Float64Array
  /** the part's place in the catalogue (the order ties keep) */
  readonly order: Int32Array
  /** device slots of this position kind in one package */
  readonly slots: Int32Array
  /** package configuration code (see UNKNOWN_CONFIGURATION) */
  readonly configuration: Uint8Array
  /** 0 active, 1 NRND, 2 obsolete */
  readonly lifecycle: Uint8Array
  /** approvalRank */
  readonly rank: Uint8Array
}

/** What can cross a thread boundary: the columns, the parts' ids and the parts as JSON text (all shareable). */
export interface PartColumns {
  readonly size: number
  readonly byPosition: Readonly<Record<PositionKind, PositionColumns>>
  /** the id given at build (idOf) per catalogue place; NaN without one */
  readonly ids: Float64Array
}

/** The columns and a way to the part object at a catalogue place: build once per catalogue, match many positions. */
export interface PartIndex extends PartColumns {
  readonly kind: 'part-index'
  part: (order: number) => CatalogPart
}

/** The columns with the parts as UTF-8 JSON text, all in SharedArrayBuffers (send it in a worker message as is). */
export interface SharedPartIndex extends PartColumns {
  readonly kind: 'shared-part-index'
  /** byte offsets of part i's text: [offsets[i], offsets[i + 1]) */
  readonly textOffsets: Float64Array
  readonly text: Uint8Array
}

type Allocate = (bytes: number) => ArrayBufferLike
const plain: Allocate = bytes => new ArrayBuffer(bytes)
const shared: Allocate = bytes => new SharedArrayBuffer(bytes)

function columnsOf(parts: readonly CatalogPart[], idOf: ((part: CatalogPart) => number) | undefined, allocate: Allocate): PartColumns {
  const byPosition = {} as Record<PositionKind, PositionColumns>
  const n = parts.length
  const ids = new Float64Array(allocate(8 * n))
  // Read each part once into flat arrays; the columns of every position kind are filled from these.
  const voltage = new Float64Array(n)
  const current = new Float64Array(n)
  const ripple = new Float64Array(n)
  const capacitance = new Float64Array(n)
  const lowestPrice = new Float64Array(n)
  const configuration = new Uint8Array(n)
  const lifecycle = new Uint8Array(n)
  const rank = new Uint8Array(n)
  const slots = POSITION_KINDS.map(() => new Int32Array(n))
  const configurationCode = new Map<string, number>(PACKAGE_CONFIGURATION_IDS.map((id, i) => [id, i]))
  const number = (v: unknown) => (typeof v === 'number' ? v : Number.NaN)
  for (let i = 0; i < n; i++) {
    const p = parts[i]!
    ids[i] = idOf ? idOf(p) : Number.NaN
    voltage[i] = number(p.voltageRating)
    current[i] = number(p.currentRating)
    ripple[i] = number(p.rippleCurrentRating)
    capacitance[i] = number(p.capacitance)
    let lowest = Infinity
    for (const b of p.priceBreaks ?? []) if (b.unitPrice < lowest) lowest = b.unitPrice
    lowestPrice[i] = lowest
    configuration[i] = configurationCode.get(p.packageConfiguration) ?? UNKNOWN_CONFIGURATION
    lifecycle[i] = LIFECYCLE_RANK[p.lifecycle]
    rank[i] = approvalRank(p as CatalogPart & { approved?: boolean })
    POSITION_KINDS.forEach((position, k) => { slots[k]![i] = slotsPerPackage(p, position) })
  }
  // sorted by voltage rating, missing ratings first, ties in catalogue order
  const sortKey = voltage.map(v => (Number.isNaN(v) ? -Infinity : v))
  POSITION_KINDS.forEach((position, k) => {
    const slotsOf = slots[k]!
    const places: number[] = []
    for (let i = 0; i < n; i++) if (slotsOf[i]! > 0) places.push(i)
    places.sort((a, b) => sortKey[a]! - sortKey[b]! || a - b)
    const count = places.length
    const columns: PositionColumns = {
      count,
      voltageRating: new Float64Array(allocate(8 * count)),
      currentRating: new Float64Array(allocate(8 * count)),
      capacitance: new Float64Array(allocate(8 * count)),
      lowestPrice: new Float64Array(allocate(8 * count)),
      order: new Int32Array(allocate(4 * count)),
      slots: new Int32Array(allocate(4 * count)),
      configuration: new Uint8Array(allocate(count)),
      lifecycle: new Uint8Array(allocate(count)),
      rank: new Uint8Array(allocate(count)),
    }
    const currentOf = position === 'capacitor' ? ripple : current
    for (let j = 0; j < count; j++) {
      const i = places[j]!
      columns.voltageRating[j] = voltage[i]!
      columns.currentRating[j] = currentOf[i]!
      columns.capacitance[j] = capacitance[i]!
      columns.lowestPrice[j] = lowestPrice[i]!
      columns.order[j] = i
      columns.slots[j] = slotsOf[i]!
      columns.configuration[j] = configuration[i]!
      columns.lifecycle[j] = lifecycle[i]!
      columns.rank[j] = rank[i]!
    }
    byPosition[position] = columns
  })
  return { size: n, byPosition, ids }
}

/** The index of parts in this thread (`idOf` names each part for MatchOptions.exceptId). */
export function indexParts(parts: readonly CatalogPart[], idOf?: (part: CatalogPart) => number): PartIndex {
  return { kind: 'part-index', ...columnsOf(parts, idOf, plain), part: order => parts[order]! }
}

/** The index in shared memory with the parts as JSON text, for worker threads (openSharedIndex reads it). */
export function sharePartIndex(parts: readonly CatalogPart[], idOf?: (part: CatalogPart) => number): SharedPartIndex {
  const texts = parts.map(p => JSON.stringify(p))
  const encoder = new TextEncoder()
  // Catalogue text is mostly printable ASCII (one byte per character; JSON escapes control characters): only
  // the other texts are measured by encoding them.
  const wide = /[^ -~]/
  const textOffsets = new Float64Array(shared(8 * (parts.length + 1)))
  let bytes = 0
  texts.forEach((t, i) => {
    textOffsets[i] = bytes
    bytes += wide.test(t) ? encoder.encode(t).byteLength : t.length
  })
  textOffsets[parts.length] = bytes
  const text = new Uint8Array(shared(bytes))
  texts.forEach((t, i) => encoder.encodeInto(t, text.subarray(textOffsets[i]!, textOffsets[i + 1]!)))
  return { kind: 'shared-part-index', ...columnsOf(parts, idOf, shared), textOffsets, text }
}

/** A shared index as a PartIndex: a part's text is parsed the first time matching reads the part, then kept. */
export function openSharedIndex(index: SharedPartIndex): PartIndex {
  const parsed = new Map<number, CatalogPart>()
  const decoder = new TextDecoder()
  const part = (order: number): CatalogPart => {
    let p = parsed.get(order)
    if (!p) {
      // TextDecoder refuses views of shared memory: copy the few hundred bytes out first
      const bytes = index.text.slice(index.textOffsets[order]!, index.textOffsets[order + 1]!)
      p = JSON.parse(decoder.decode(bytes)) as CatalogPart
      parsed.set(order, p)
    }
    return p
  }
  return { kind: 'part-index', size: index.size, byPosition: index.byPosition, ids: index.ids, part }
}

/** Catalogue place of the part with this id (-1 when none). */
export function placeOf(index: PartColumns, id: number): number {
  const ids = index.ids
  for (let i = 0; i < ids.length; i++) if (ids[i] === id) return i
  return -1
}
