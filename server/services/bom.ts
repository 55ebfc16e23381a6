// Bills of materials: the live draft from a design's part assignments, and released snapshots that
// never change afterwards (a new release is a new revision with the changes listed).
import type { H3Event } from 'h3'
import { and, desc, eq, sql } from 'drizzle-orm'
import { buildBomSnapshot, diffBoms, unacknowledgedLines, type BomBuildInput, type CapacitorFill, type CoveredPosition, type PositionFill } from '#shared/bom/build'
import { specifiedLines } from '#shared/bom/specified'
import { packGroup, type GroupMember } from '#shared/bom/coverage'
import type { BomLine, BomPurchase, BomSnapshot } from '#shared/bom/types'
import { slotsPerPackage } from '#shared/catalog/matching'
import { sees, type Role } from '#shared/roles'
import { topologyById, topologyName, type DesignInput, type DesignResult } from '#shared/engine'
import type { BomSettings } from '#shared/schemas/design'
import { count, formatMoney, formatSi } from '#shared/utils/format'
import demo from '../db/demo-accounts.json'
import { legPositions, matchDesign, type PositionMatch } from './parts'
import { renderBomPdf } from '../workers/pool'
import { bomToXlsx } from '../exports/bom-xlsx'
import { loadFonts } from '../exports/pdf'

const boms = tables.boms

export const SAFETY_NOTE = 'Stratavolt is a design aid. High-voltage converters must be designed, built and tested by qualified people to the applicable standards and local codes (e.g. IEC 61800-5-1 for adjustable-speed drives). Vendor datasheets govern part ratings; check every figure before ordering.'

function describePart(p: PositionMatch) {
  const a = p.assigned!.part
  return {
    partNumber: a.partNumber,
    manufacturer: a.manufacturer,
    description: a.description ?? `${a.kind} ${a.packageConfiguration} ${formatSi(a.voltageRating, 'V', 4)}${a.currentRating ? ` ${formatSi(a.currentRating, 'A', 4)}` : ''}`,
    kind: a.kind,
    unitPriceBreaks: a.priceBreaks.map(b => ({ quantity: b.minQuantity, price: b.unitPrice })),
    currency: a.currency ?? 'EUR',
    moq: a.minimumOrderQuantity ?? null,
    leadTimeDays: a.leadTimeDays ?? null,
    stock: a.stock ?? null,
    lifecycle: a.lifecycle,
    supplier: a.supplier ?? null,
    partVersionId: p.assigned!.partVersionId,
    approved: p.assigned!.approved,
  }
}

/** The BOM input from the assignments: semiconductors per position (modules once), capacitor banks, hand-added lines. */
export function bomInputFrom(positions: PositionMatch[], settings: BomSettings, design: DesignInput, result?: DesignResult): { input: BomBuildInput, missing: string[], stale: string[] } {
  const missing: string[] = []
  const stale: string[] = []
  const fills: PositionFill[] = []
  const covered: CoveredPosition[] = []
  const banks: CapacitorFill[] = []
  // Semiconductors grouped by side and part version: one group is one set of packages (packGroup).
  const groups = new Map<string, PositionMatch[]>()
  for (const p of positions) {
    if (!p.assigned) { missing.push(`${p.side} ${p.position}`); continue }
    if (p.assigned.review.stale) stale.push(`${p.side} ${p.position}`)
    const a = p.assigned
    if (p.duty.kind === 'capacitor') {
      // The bank as assigned: positions × series × parallel (a 2s×14p bank is 28 pieces per position).
      banks.push({ ...describePart(p), side: p.side, position: p.position, count: p.duty.positionsPerPhase * a.seriesCount * a.parallelCount, seriesCount: a.seriesCount, parallelCount: a.parallelCount })
      continue
    }
    const key = `${p.side}|${a.partVersionId}`
    groups.set(key, [...(groups.get(key) ?? []), p])
  }
  for (const members of groups.values()) {
    const first = members[0]!
    const part = first.assigned!.part
    const leg = new Map(legPositions(design, first.side).map(l => [l.name, l]))
    const packed = packGroup(part, members.map(m => ({
      position: m.position,
      kind: m.duty.kind as GroupMember['kind'],
      countPerPhase: m.duty.positionsPerPhase,
      seriesCount: m.assigned!.seriesCount,
      parallelCount: m.assigned!.parallelCount,
      ...(leg.get(m.position)?.antiParallelTo ? { antiParallelTo: leg.get(m.position)!.antiParallelTo } : {}),
      coveredBy: m.assigned!.coveredBy,
    })), first.duty.phases, kind => slotsPerPackage(part, kind))
    const host = members.find(m => m.position === packed.host)!
    fills.push({
      ...describePart(host),
      side: host.side,
      position: host.position,
      positionsPerPhase: host.duty.positionsPerPhase,
      phases: host.duty.phases,
      perPackage: Math.max(1, slotsPerPackage(part, host.duty.kind)),
      seriesCount: host.assigned!.seriesCount,
      parallelCount: host.assigned!.parallelCount,
      packagesPerConverter: packed.packagesPerConverter,
      ...(packed.unusedSlots.length ? { unusedSlots: packed.unusedSlots } : {}),
    })
    for (const c of packed.covered) covered.push({ side: host.side, position: c.position, coveredBy: c.coveredBy, partNumber: part.partNumber, manufacturer: part.manufacturer })
  }
  return {
    input: {
      positions: fills,
      capacitors: banks,
      covered,
      manualLines: settings.manualLines.map(l => ({ ...l, partNumber: l.partNumber || null, manufacturer: l.manufacturer || null })),
      specified: specifiedLines(result),
      buildQuantity: settings.buildQuantity,
      sparesPercent: settings.sparesPercent,
      currency: 'EUR',
    },
    missing,
    stale,
  }
}

function designSummary(input: DesignInput): BomSnapshot['designSummary'] {
  const rows: BomSnapshot['designSummary'] = []
  for (const [side, c] of [['Machine side', input.machineSide], ['Grid side', input.gridSide]] as const) {
    if (!c) continue
    rows.push([`${side}: topology`, topologyById[c.topology].label, ''])
    if (c.levels) rows.push([`${side}: levels`, c.levels, ''])
    if (c.dcVoltage) rows.push([`${side}: DC voltage (nominal / worst case)`, `${c.dcVoltage} / ${c.dcVoltageMax ?? c.dcVoltage}`, 'V'])
    rows.push([`${side}: switching frequency`, c.switchingHz, 'Hz'])
    for (const p of c.operatingPoints) rows.push([`${side}: ${p.name}`, `${p.lineVoltageRms} V, ${p.phaseCurrentRms} A, PF ${p.powerFactor}, ${p.fundamentalHz} Hz`, ''])
  }
  return rows
}

export function topologySummary(input: DesignInput) {
  const m = input.machineSide
  const one = topologyName(m.topology, m.levels)
  const g = input.gridSide
  if (!g) return one
  return g.topology === m.topology ? `${one}, back-to-back` : `${one}, back-to-back with a ${topologyName(g.topology, g.levels)} grid side`
}

/** Recorded acknowledgements of gated lines, by line key. */
export async function acknowledgementsOf(designId: number) {
  const rows = await useDb().select().from(tables.bomAcknowledgements).where(eq(tables.bomAcknowledgements.designId, designId))
  return new Map(rows.map(r => [r.lineKey, r]))
}

/** Puts each recorded acknowledgement on its gated line (only for the part version it was given for). */
function applyAcknowledgements(lines: BomLine[], acks: Awaited<ReturnType<typeof acknowledgementsOf>>) {
  for (const line of lines) {
    if (!line.gate?.length) continue
    const ack = acks.get(line.key)
    line.acknowledgement = ack && ack.partVersionId === line.partVersionId ? { reason: ack.reason, by: ack.acknowledgedByName, at: ack.acknowledgedAt.toISOString() } : null
  }
}

/** The live BOM of a design (not saved), with what still blocks its release. */
export async function draftBom(designId: number, releasedBy = '') {
  // The revision released when the request came in, read before the matching (a worker thread may take a while):
  // two releases sent at once both draft the same next revision, so the lock in releaseBom lets one through.
  const [last] = await useDb().select({ revision: boms.revision }).from(boms).where(eq(boms.designId, designId)).orderBy(desc(boms.revision)).limit(1)
  const { design, positions, result } = await matchDesign(designId)
  const settings = design.bomSettings as BomSettings
  const { input, missing, stale } = bomInputFrom(positions, settings, design.input as DesignInput, result)
  const snapshot = buildBomSnapshot({
    company: demo.company,
    designId,
    designName: design.name,
    designRevision: design.revision,
    topologySummary: topologySummary(design.input as DesignInput),
    revision: (last?.revision ?? 0) + 1,
    releasedAt: new Date().toISOString(),
    releasedBy,
    designSummary: designSummary(design.input as DesignInput),
    safetyNote: SAFETY_NOTE,
  }, input)
  applyAcknowledgements(snapshot.lines, await acknowledgementsOf(designId))
  const unacknowledged = unacknowledgedLines(snapshot.lines).map(l => ({ key: l.key, partNumber: l.partNumber, gate: l.gate! }))
  const previous = last ? await latestRelease(designId) : null
  const changes = previous ? diffBoms(previous.snapshot as BomSnapshot, snapshot) : null
  return { design, settings, snapshot, missing, stale, unacknowledged, changes }
}

export async function latestRelease(designId: number) {
  const [row] = await useDb().select().from(boms).where(eq(boms.designId, designId)).orderBy(desc(boms.revision)).limit(1)
  return row ?? null
}

export async function purchaseOf(bomId: number): Promise<BomPurchase> {
  const rows = await useDb().select().from(tables.bomPurchaseLines).where(eq(tables.bomPurchaseLines.bomId, bomId))
  return Object.fromEntries(rows.map(r => [r.lineKey, {
    supplier: r.supplier,
    quotedUnitPrice: r.quotedUnitPrice,
    quoteCurrency: r.quoteCurrency,
    orderReference: r.orderReference,
    status: r.status as NonNullable<BomPurchase[string]['status']>,
    statusDates: r.statusDates,
    promisedDelivery: r.promisedDelivery,
  }]))
}

/** A released BOM as one role may see it: purchasing's private fields only for the roles restrictedFields names. */
export function bomForRole<T extends { snapshot: unknown }>(bom: T, purchase: BomPurchase, role: Role): T & { purchase: BomPurchase } {
  if (sees(role, 'purchase')) return { ...bom, purchase }
  const snapshot = bom.snapshot as BomSnapshot
  return { ...bom, snapshot: { ...snapshot, lines: snapshot.lines.map(({ supplier: _supplier, ...line }) => ({ ...line, supplier: null })) }, purchase: {} }
}

export async function pdfFonts() {
  return loadFonts(name => useStorage('assets:fonts').getItemRaw(name))
}

function bomFileName(snapshot: BomSnapshot, format: 'xlsx' | 'pdf') {
  return `BOM-${snapshot.designName.replace(/[^\w-]+/g, '_').slice(0, 40)}-rev${snapshot.revision}.${format}`
}

export interface BomFileOptions {
  /** purchasing's entries by line key */
  purchase?: BomPurchase
  /** the previous release, for the changes sheet */
  previous?: BomSnapshot | null
  /** only lines not yet received, grouped by supplier (purchasing's open-lines view) */
  openOnly?: boolean
  /** the requesting user's locale for dates and numbers shown as text */
  locale?: string
}

/** One export of a BOM: Excel workbook or PDF. */
export async function bomFile(snapshot: BomSnapshot, format: 'xlsx' | 'pdf', options: BomFileOptions = {}) {
  const purchase = options.purchase ?? {}
  const locale = options.locale ?? companyLocale()
  // PDFs render on the worker-thread pool (server/workers)
  const content = format === 'xlsx' ? await bomToXlsx(snapshot, purchase, { ...options, locale }) : await renderBomPdf(snapshot, purchase, { openOnly: options.openOnly, locale })
  return { filename: bomFileName(snapshot, format), content }
}

/** Answers a download of a released BOM, with purchasing's fields only for the roles that see them. */
export async function sendBomFile(event: H3Event, id: number, format: 'xlsx' | 'pdf', role: Role, openOnly = false, locale?: string) {
  const row = await loadBom(id)
  const bom = bomForRole(row, await purchaseOf(id), role)
  const previous = await previousRelease(row.designId, row.revision)
  const file = await bomFile(bom.snapshot as BomSnapshot, format, { purchase: bom.purchase, previous: previous?.snapshot as BomSnapshot | undefined, openOnly, locale: locale ?? requestLocale(event) })
  setResponseHeaders(event, {
    'Content-Type': format === 'pdf' ? 'application/pdf' : 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    'Content-Disposition': `attachment; filename="${file.filename}"`,
  })
  return file.content
}

export async function previousRelease(designId: number, revision: number) {
  const [row] = await useDb().select().from(boms).where(and(eq(boms.designId, designId), sql`${boms.revision} < ${revision}`)).orderBy(desc(boms.revision)).limit(1)
  return row ?? null
}

function refuse(statusCode: number, message: string, data: Record<string, unknown>): never {
  throw createError({ statusCode, message, data })
}

/**
 * Releases the draft as an immutable snapshot, once: the design row is locked for the release, so two
 * releases of the same draft (double click, two tabs) commit one revision and the other answers 409.
 * The mail to purchasing is written to the outbox in the same transaction and sent by the outbox worker
 * (server/services/outbox.ts), so a crash after the commit still mails purchasing.
 * `expectedRevision`: the BOM revision the releasing page showed as the draft.
 */
export async function releaseBom(designId: number, user: { id: number, name: string }, expectedRevision?: number) {
  const { snapshot, missing, stale, unacknowledged } = await draftBom(designId, user.name)
  if (missing.length) {
    refuse(422, `Assign a part to every position before releasing: ${missing.slice(0, 8).join(', ')}${missing.length > 8 ? ` and ${missing.length - 8} more` : ''}.`, { missing })
  }
  if (stale.length) {
    refuse(422, `These assignments were rated against an older design revision and no longer fit: ${stale.join(', ')}. Re-assign them with new counts or confirm them.`, { stale })
  }
  if (unacknowledged.length) {
    refuse(422, `These lines hold parts that are not approved, not recommended or obsolete: ${unacknowledged.map(l => `${l.partNumber} (${l.gate.join(', ')})`).join('; ')}. Replace each part or acknowledge it with a reason.`, { unacknowledged })
  }
  if (expectedRevision !== undefined && expectedRevision !== snapshot.revision) {
    refuse(409, `Revision ${snapshot.revision - 1} was released meanwhile; reload the BOM to see it.`, { revision: snapshot.revision - 1 })
  }
  const db = useDb()
  const released = await db.transaction(async (tx) => {
    // One release per design at a time: the second waits here, then finds the revision taken.
    const [locked] = await tx.select({ revision: tables.designs.revision }).from(tables.designs).where(eq(tables.designs.id, designId)).for('update')
    if (!locked) refuse(404, 'No such design.', {})
    if (locked.revision !== snapshot.designRevision) refuse(409, `The design changed (revision ${locked.revision}) while releasing; reload the BOM.`, { designRevision: locked.revision })
    const [previous] = await tx.select().from(boms).where(eq(boms.designId, designId)).orderBy(desc(boms.revision)).limit(1)
    if ((previous?.revision ?? 0) + 1 !== snapshot.revision) refuse(409, `Revision ${previous!.revision} of this BOM was just released; reload to see it.`, { revision: previous!.revision })
    const changes = previous ? diffBoms(previous.snapshot as BomSnapshot, snapshot) : null
    const [row] = await tx.insert(boms).values({ designId, revision: snapshot.revision, designRevision: snapshot.designRevision, status: 'released', snapshot, changes, releasedBy: user.id }).returning()
    await tx.insert(tables.mailOutbox).values({
      kind: 'bom-released',
      to: useRuntimeConfig().purchasingEmail,
      subject: `BOM released: ${snapshot.designName}, revision ${snapshot.revision}`,
      payload: { bomId: row!.id, releasedBy: user.name },
    })
    return row!
  }).catch((err: unknown) => {
    // Two first releases race past the lock on no previous row: the unique (design, revision) index decides.
    const code = (err as { code?: string, cause?: { code?: string } }).code ?? (err as { cause?: { code?: string } }).cause?.code
    if (code === '23505') refuse(409, 'This revision of the BOM was just released by another request; reload to see it.', {})
    throw err
  })
  return { bom: released, mailQueued: true }
}

/** The release mail of a BOM, built when the outbox sends it (the snapshot never changes). */
export async function releaseMail(bomId: number, releasedBy: string) {
  const row = await loadBom(bomId)
  const s = row.snapshot as BomSnapshot
  const previous = await previousRelease(row.designId, row.revision)
  const files = { xlsx: await bomFile(s, 'xlsx', { previous: previous?.snapshot as BomSnapshot | undefined }), pdf: await bomFile(s, 'pdf') }
  const gated = s.lines.filter(l => l.gate?.length)
  return {
    text: `${releasedBy} released revision ${s.revision} of the bill of materials for "${s.designName}" (design revision ${s.designRevision}).\n\n${s.totals.lines} lines, ${s.totals.pieces} pieces, ${formatMoney(s.totals.extendedPrice, s.currency, companyLocale())} at catalogue prices for ${s.buildQuantity} sets.${gated.length ? `\n\n${count(gated.length, 'line')} ${gated.length === 1 ? 'holds' : 'hold'} parts that are not approved, not recommended or obsolete, released with a design engineer's recorded reason (marked in the files).` : ''}\n\nOpen it: ${appUrl(`/boms/${row.id}`)}\n\nThe Excel and PDF files are attached.\n\n${SAFETY_NOTE}\n`,
    attachments: [
      { filename: files.xlsx.filename, content: files.xlsx.content, contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet' },
      { filename: files.pdf.filename, content: files.pdf.content, contentType: 'application/pdf' },
    ],
  }
}

export async function loadBom(id: number) {
  const [row] = await useDb().select().from(boms).where(eq(boms.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such bill of materials.' })
  return row
}

/** Released and draft BOMs that use a part (any version of it): what component engineers see before changing its approval or lifecycle. */
export async function bomsUsingPart(partId: number) {
  const db = useDb()
  const [part] = await db.select().from(tables.parts).where(eq(tables.parts.id, partId))
  if (!part) throw createError({ statusCode: 404, message: 'No such part.' })
  // releases keep the line keys they were written with: match those and what the line names, re-keyed
  const key = part.key
  const released = await db.execute<{ id: number, design_id: number, design_name: string, revision: number, status: string, quantity_order: number }>(sql`
    select b.id, b.design_id, d.name as design_name, b.revision, b.status, (l->>'quantityOrder')::int as quantity_order
    from boms b join designs d on d.id = b.design_id, jsonb_array_elements(b.snapshot->'lines') l
    where not coalesce((l->>'manual')::boolean, false)
      and (l->>'key' = ${key} or stratavolt_part_key(l->>'manufacturer', l->>'partNumber') = ${key}) order by d.name, b.revision`)
  const drafts = await db.execute<{ design_id: number, design_name: string, positions: string[] }>(sql`
    select d.id as design_id, d.name as design_name, array_agg(a.side || ' ' || a.position order by a.side, a.position) as positions
    from part_assignments a join part_versions v on v.id = a.part_version_id join designs d on d.id = a.design_id
    where v.part_id = ${partId} group by d.id, d.name order by d.name`)
  return {
    released: [...released].map(r => ({ bomId: r.id, designId: r.design_id, designName: r.design_name, revision: r.revision, status: r.status, quantityOrder: r.quantity_order })),
    drafts: [...drafts].map(r => ({ designId: r.design_id, designName: r.design_name, positions: r.positions })),
  }
}
