// Bills of materials: the live draft from a design's part assignments, and released snapshots that
// never change afterwards (a new release is a new revision with the changes listed).
import type { H3Event } from 'h3'
import { desc, eq } from 'drizzle-orm'
import { buildBomSnapshot, diffBoms, type BomBuildInput, type CapacitorFill, type PositionFill } from '#shared/bom/build'
import type { BomPurchase, BomSnapshot } from '#shared/bom/types'
import { slotsPerPackage } from '#shared/catalog/matching'
import { legLayout, topologyById, type DesignInput } from '#shared/engine'
import type { BomSettings } from '#shared/schemas/design'
import { formatSi } from '#shared/utils/si'
import demo from '../db/demo-accounts.json'
import { matchDesign, type PositionMatch } from './parts'
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
  }
}

/** The BOM input from the assignments: semiconductors per position, capacitor banks, hand-added lines. */
export function bomInputFrom(positions: PositionMatch[], settings: BomSettings, design: DesignInput): { input: BomBuildInput, missing: string[] } {
  const missing: string[] = []
  const covered = coveredDiodes(positions, design)
  const fills: PositionFill[] = []
  const banks = new Map<string, CapacitorFill>()
  for (const p of positions) {
    if (!p.assigned) { missing.push(`${p.side} ${p.position}`); continue }
    if (covered.has(`${p.side}:${p.position}`)) continue
    const a = p.assigned
    if (p.duty.kind === 'capacitor') {
      // Back-to-back: both converters share one DC link, so a DC-link capacitor position is bought once (the larger bank).
      const shared = p.label.startsWith('dc-link')
      const key = shared ? `dc-link:${p.position}` : `${p.side}:${p.position}`
      const perConverter = a.evaluation?.packagesPerConverter ?? p.duty.positionsPerPhase * a.seriesCount * a.parallelCount
      const previous = banks.get(key)
      if (!previous || previous.count < perConverter) banks.set(key, { ...describePart(p), side: shared ? 'dc-link' : p.side, position: p.position, count: perConverter })
      continue
    }
    fills.push({
      ...describePart(p),
      side: p.side,
      position: p.position,
      positionsPerPhase: p.duty.positionsPerPhase,
      phases: p.duty.phases,
      perPackage: Math.max(1, a.evaluation?.slotsPerPackage ?? slotsPerPackage(a.part, p.duty.kind)),
      seriesCount: a.seriesCount,
      parallelCount: a.parallelCount,
    })
  }
  return {
    input: {
      positions: fills,
      capacitors: [...banks.values()],
      manualLines: settings.manualLines.map(l => ({ ...l, partNumber: l.partNumber || null, manufacturer: l.manufacturer || null })),
      buildQuantity: settings.buildQuantity,
      sparesPercent: settings.sparesPercent,
      currency: 'EUR',
    },
    missing,
  }
}

/**
 * Anti-parallel diode positions that sit in their switch's own package: the diode position is assigned
 * the same switch-with-diode part as its switch, so the switch's line already buys it.
 */
export function coveredDiodes(positions: PositionMatch[], design: DesignInput): Set<string> {
  const covered = new Set<string>()
  for (const [side, converter] of [['machine', design.machineSide], ['grid', design.gridSide]] as const) {
    if (!converter) continue
    for (const item of legLayout(converter.topology, converter.levels).items) {
      if (!item.antiParallelTo) continue
      const diode = positions.find(p => p.side === side && p.position === item.name)?.assigned
      const sw = positions.find(p => p.side === side && p.position === item.antiParallelTo)?.assigned
      if (diode && sw && diode.partVersionId === sw.partVersionId && diode.part.kind === 'switch-diode') covered.add(`${side}:${item.name}`)
    }
  }
  return covered
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
  const one = `${topologyById[m.topology].label}${m.levels && m.topology !== 'two-level' ? ` (N = ${m.levels})` : ''}`
  return input.gridSide ? `${one}, back-to-back` : one
}

/** The live BOM of a design (not saved), with the positions still missing a part. */
export async function draftBom(designId: number, releasedBy = '') {
  const { design, positions } = await matchDesign(designId)
  const settings = design.bomSettings as BomSettings
  const { input, missing } = bomInputFrom(positions, settings, design.input as DesignInput)
  const [last] = await useDb().select({ revision: boms.revision }).from(boms).where(eq(boms.designId, designId)).orderBy(desc(boms.revision)).limit(1)
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
  return { design, settings, snapshot, missing }
}

export async function latestRelease(designId: number) {
  const [row] = await useDb().select().from(boms).where(eq(boms.designId, designId)).orderBy(desc(boms.revision)).limit(1)
  return row ?? null
}

export async function purchaseOf(bomId: number): Promise<BomPurchase> {
  const rows = await useDb().select().from(tables.bomPurchaseLines).where(eq(tables.bomPurchaseLines.bomId, bomId))
  return Object.fromEntries(rows.map(r => [r.lineKey, { supplier: r.supplier, quotedUnitPrice: r.quotedUnitPrice, orderReference: r.orderReference }]))
}

export async function pdfFonts() {
  return loadFonts(name => useStorage('assets:fonts').getItemRaw(name))
}

function bomFileName(snapshot: BomSnapshot, format: 'xlsx' | 'pdf') {
  return `BOM-${snapshot.designName.replace(/[^\w-]+/g, '_').slice(0, 40)}-rev${snapshot.revision}.${format}`
}

/** One export of a BOM: Excel workbook or PDF. */
export async function bomFile(snapshot: BomSnapshot, format: 'xlsx' | 'pdf', purchase: BomPurchase = {}) {
  const content = format === 'xlsx' ? await bomToXlsx(snapshot, purchase) : await renderBomPdf(snapshot, purchase)
  return { filename: bomFileName(snapshot, format), content }
}

/** Answers a download of a released BOM. */
export async function sendBomFile(event: H3Event, id: number, format: 'xlsx' | 'pdf') {
  const bom = await loadBom(id)
  const file = await bomFile(bom.snapshot as BomSnapshot, format, await purchaseOf(id))
  setResponseHeaders(event, {
    'Content-Type': format === 'pdf' ? 'application/pdf' : 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    'Content-Disposition': `attachment; filename="${file.filename}"`,
  })
  return file.content
}

/** Releases the draft as an immutable snapshot and mails purchasing with both files attached. */
export async function releaseBom(designId: number, user: { id: number, name: string }) {
  const { snapshot, missing } = await draftBom(designId, user.name)
  if (missing.length) {
    throw createError({ statusCode: 422, message: `Assign a part to every position before releasing: ${missing.slice(0, 8).join(', ')}${missing.length > 8 ? ` and ${missing.length - 8} more` : ''}.`, data: { missing } })
  }
  const db = useDb()
  const released = await db.transaction(async (tx) => {
    const [previous] = await tx.select().from(boms).where(eq(boms.designId, designId)).orderBy(desc(boms.revision)).limit(1).for('update')
    const revision = (previous?.revision ?? 0) + 1
    const final = { ...snapshot, revision }
    const changes = previous ? diffBoms(previous.snapshot as BomSnapshot, final) : null
    const [row] = await tx.insert(boms).values({ designId, revision, designRevision: snapshot.designRevision, status: 'released', snapshot: final, changes, releasedBy: user.id }).returning()
    return row!
  })
  const s = released.snapshot as BomSnapshot
  const files = { xlsx: await bomFile(s, 'xlsx'), pdf: await bomFile(s, 'pdf') }
  const mailSent = await sendMail({
    to: useRuntimeConfig().purchasingEmail,
    subject: `BOM released: ${s.designName}, revision ${s.revision}`,
    text: `${user.name} released revision ${s.revision} of the bill of materials for "${s.designName}" (design revision ${s.designRevision}).\n\n${s.totals.lines} lines, ${s.totals.pieces} pieces, ${s.totals.extendedPrice.toLocaleString('en', { maximumFractionDigits: 2 })} ${s.currency} at catalogue prices for ${s.buildQuantity} sets.\n\nOpen it: ${appUrl(`/boms/${released.id}`)}\n\nThe Excel and PDF files are attached.\n\n${SAFETY_NOTE}\n`,
    attachments: [
      { filename: files.xlsx.filename, content: files.xlsx.content, contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet' },
      { filename: files.pdf.filename, content: files.pdf.content, contentType: 'application/pdf' },
    ],
  })
  return { bom: released, mailSent }
}

export async function loadBom(id: number) {
  const [row] = await useDb().select().from(boms).where(eq(boms.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such bill of materials.' })
  return row
}
