// Queued jobs besides the catalogue commit: trade studies over many topologies and PDFs of large BOMs.
// Both compute on the worker-thread pool of whichever instance took the job.
import type { BomSnapshot } from '#shared/bom/types'
import type { TradeStudyInput } from '#shared/schemas/trade-study'
import type { Role } from '#shared/roles'
import { bomFile, bomForRole, loadBom, purchaseOf } from '../services/bom'
import { runTradeStudy } from '../services/trade-study'
import { jobProgress, type JobRow } from './jobs'

export async function tradeStudyJob(job: JobRow) {
  const duty = job.input as TradeStudyInput
  await jobProgress(job.id, 0.05, `Evaluating ${duty.candidates?.length ?? 'the default'} candidates`)
  return runTradeStudy(duty)
}

/** Where a job's file is kept (shared upload storage, so the instance that answers the download need not be the one that rendered it). */
export const jobFileKey = (jobId: string) => `jobs:${jobId}.pdf`

export async function bomPdfJob(job: JobRow) {
  const { bomId, role, openOnly, locale } = job.input as { bomId: number, role?: Role, openOnly?: boolean, locale?: string }
  // the fields the person who queued it may see (jobs made before roles travelled: the most restricted view)
  const bom = bomForRole(await loadBom(bomId), await purchaseOf(bomId), role ?? 'viewer')
  await jobProgress(job.id, 0.1, `Rendering ${(bom.snapshot as BomSnapshot).lines.length} lines`)
  const file = await bomFile(bom.snapshot as BomSnapshot, 'pdf', { purchase: bom.purchase, openOnly, locale })
  await useStorage('uploads').setItemRaw(jobFileKey(job.id), file.content)
  return { filename: file.filename, bytes: file.content.length, contentType: 'application/pdf' }
}
