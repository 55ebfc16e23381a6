// The work the pool of worker threads does: evaluations, matching, trade studies, catalogue file reading
// and PDF rendering. Pure functions of their message. Matching tasks carry the catalogue index of the
// generation the main thread read from PostgreSQL for this request, in shared memory (no copy per thread);
// each thread keeps that index opened (with the parts it parsed) until a task names another generation.
import { EngineInputError, evaluateDesign, evaluateStress, type DesignInput, type EvaluateOptions, type StressInput } from '#shared/engine'
import { openSharedIndex, type PartIndex, type SharedPartIndex } from '#shared/catalog/matching'
import type { TradeStudyInput } from '#shared/schemas/trade-study'
import { designInputSchema, stressInputSchema } from '#shared/schemas/stress'
import { parseValid } from '../utils/validate'
import { readCatalogFile, type ReadOptions } from '../catalog/read'
import { buildCurrentIndex, indexDigest } from '../catalog/current-index'
import { previewDesign, type PreviewView } from '../services/designs'
import { matchDesignPositions, type DesignMatchRequest } from '../services/parts'
import { partsAnswer, type DesignHead } from '../services/parts-answer'
import { tradeStudyRows } from '../services/trade-study'
import { bomToPdf } from '../exports/bom-pdf'
import { designReportPdf } from '../exports/design-pdf'
import type { PdfFonts } from '../exports/pdf'
import { compactProvenance } from './provenance'
import { encodeAnswer, type EncodeRequest } from './encode'
import type { BomPurchase, BomSnapshot } from '#shared/bom/types'

/** what the BOM PDF takes besides the snapshot and purchasing's entries */
export interface BomPdfOptions { openOnly?: boolean, locale?: string }

/** A task whose answer goes straight to the client: `encode` asks the thread for the JSON bytes (encode.ts). */
export type EncodedTask = Task & { encode: EncodeRequest }

export type Task
  = | { kind: 'stress', input: StressInput, options: EvaluateOptions, provenance?: 'compact' | 'full' }
    | { kind: 'evaluate', input: DesignInput, provenance?: 'compact' | 'full' }
  /** the request body as it came (JSON text), validated here as readValid would (400 / 422 come back as errors) */
    | { kind: 'stress-body', body: string | undefined, provenance?: 'compact' | 'full' }
    | { kind: 'evaluate-body', body: string | undefined, provenance?: 'compact' | 'full' }
    | { kind: 'preview', input: DesignInput, view?: Partial<PreviewView> }
    | { kind: 'trade-study', generation: number, index: SharedPartIndex, duty: TradeStudyInput }
    | { kind: 'match-design', generation: number, index: SharedPartIndex, request: DesignMatchRequest }
    | { kind: 'parts-answer', generation: number, index: SharedPartIndex, request: DesignMatchRequest, design: DesignHead, seesCatalogue: boolean }
    | { kind: 'build-index', rows: string }
    | { kind: 'read-catalog', file: Uint8Array, filename: string, limits: ReadOptions }
    | { kind: 'bom-pdf', fonts?: PdfFonts, args: { snapshot: BomSnapshot, purchase: BomPurchase, options?: BomPdfOptions } }
    | { kind: 'design-pdf', fonts?: PdfFonts, report: Parameters<typeof designReportPdf>[0] }

export type TaskError
  = | { kind: 'engine', field: string, message: string }
    | { kind: 'http', statusCode: number, message: string, data?: unknown }

export type TaskResult
  = | { ok: true, value: unknown }
    | { ok: false, error: TaskError }
  /** this thread has no fonts yet: send them along */
    | { ok: false, needs: 'fonts' }

let catalog: { generation: number, index: PartIndex } | null = null
let fonts: PdfFonts | null = null

/** The task's catalogue index, opened once per generation (parts already parsed stay parsed until then). */
function catalogFor(task: { generation: number, index: SharedPartIndex }): PartIndex {
  if (!catalog || catalog.generation !== task.generation) catalog = { generation: task.generation, index: openSharedIndex(task.index) }
  return catalog.index
}

/** A task that carries a request body as text → the same task with the validated input (throws 400 / 422 as readValid). */
function fromBody(task: Extract<Task, { kind: 'stress-body' | 'evaluate-body' }>): Task {
  if (task.kind === 'evaluate-body') return { kind: 'evaluate', input: parseValid(task.body, designInputSchema), provenance: task.provenance }
  // the waveform and spectrum are computed only when the answer carries them
  const { includeWaveform, ...input } = parseValid(task.body, stressInputSchema)
  return { kind: 'stress', input, options: { includeWaveform: !!includeWaveform, includeSpectrum: !!includeWaveform }, provenance: task.provenance }
}

async function run(task: Task): Promise<TaskResult> {
  switch (task.kind) {
    case 'stress': {
      const r = evaluateStress(task.input, task.options)
      return { ok: true, value: task.provenance === 'compact' ? compactProvenance(r) : r }
    }
    case 'evaluate': {
      const r = evaluateDesign(task.input)
      return { ok: true, value: task.provenance === 'compact' ? compactProvenance(r) : r }
    }
    case 'stress-body':
    case 'evaluate-body':
      return run(fromBody(task))
    case 'preview':
      return { ok: true, value: previewDesign(task.input, task.view) }
    case 'trade-study':
      return { ok: true, value: tradeStudyRows(task.duty, catalogFor(task)) }
    case 'match-design':
      return { ok: true, value: matchDesignPositions(task.request, catalogFor(task)) }
    case 'parts-answer':
      return { ok: true, value: partsAnswer(task.design, matchDesignPositions(task.request, catalogFor(task)), task.seesCatalogue) }
    case 'build-index': {
      const index = buildCurrentIndex(task.rows)
      return { ok: true, value: { index, digest: indexDigest(index) } }
    }
    case 'read-catalog':
      return { ok: true, value: await readCatalogFile(Buffer.from(task.file.buffer, task.file.byteOffset, task.file.byteLength), task.filename, task.limits) }
    case 'bom-pdf':
    case 'design-pdf': {
      // a thread boundary turns Buffers into plain Uint8Arrays; pdfmake wants Buffers
      if (task.fonts) fonts = Object.fromEntries(Object.entries(task.fonts).map(([k, v]: [string, Uint8Array]) => [k, Buffer.from(v.buffer, v.byteOffset, v.byteLength)])) as unknown as PdfFonts
      if (!fonts) return { ok: false, needs: 'fonts' }
      const pdf = task.kind === 'bom-pdf' ? await bomToPdf(task.args.snapshot, fonts, task.args.purchase, task.args.options) : await designReportPdf(task.report, fonts)
      return { ok: true, value: new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength) }
    }
  }
}

/** Runs one task; errors the route would answer with come back as data (a thread boundary drops their class). */
export async function runTask(task: Task | EncodedTask): Promise<TaskResult> {
  try {
    const tv = performance.now()
    // a body is validated first (timed apart: Server-Timing `validate`), then computed as the plain task
    const plain = task.kind === 'stress-body' || task.kind === 'evaluate-body' ? fromBody(task) : task
    const t0 = performance.now()
    const result = await run(plain)
    if (!('encode' in task && task.encode && result.ok)) return result
    const t1 = performance.now()
    const encoded = encodeAnswer(result.value, task.encode)
    const timing = { ...(plain === task ? {} : { validateMs: t0 - tv }), computeMs: t1 - t0, encodeMs: performance.now() - t1 }
    return { ok: true, value: { ...encoded, timing } }
  }
  catch (err) {
    if (err instanceof EngineInputError) return { ok: false, error: { kind: 'engine', field: err.field, message: err.message } }
    const e = err as { statusCode?: number, message?: string, data?: unknown }
    if (typeof e?.statusCode === 'number' && e.statusCode < 500) return { ok: false, error: { kind: 'http', statusCode: e.statusCode, message: e.message ?? '', data: e.data } }
    throw err
  }
}
