import { designMatchTask, type matchDesignPositions } from '~~/server/services/parts'
import { answerKey, keepAnswer, storedAnswer } from '~~/server/services/answer-cache'
import { runInPool } from '~~/server/workers/pool'
import { idParam } from '#shared/schemas/auth'
import { sees } from '#shared/roles'

// The design page's figures from the assigned parts (losses, efficiency, cost, T_j per side, T_j peak per
// position over the period, the mission life) without
// searching the catalogue for candidates: the parts page (GET …/parts) does that. Cost only for roles
// that see catalogue data. Computed once per design input, assignments and catalogue generation: the figures are
// kept in PostgreSQL (computed_answers, keyed by all that was read for them) and read again while none changed.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'designs:read')
  const { id } = paramsValid(event, idParam)
  const { design, task } = await designMatchTask(id, 0, { summaryOnly: true })
  const key = answerKey('parts-summary', { generation: task.generation, request: task.request })
  const stored = await storedAnswer(key)
  let figures: Figures
  if (stored) figures = JSON.parse(new TextDecoder().decode(stored.body)) as Figures
  else {
    const { summary, positions, thermal } = await runInPool<ReturnType<typeof matchDesignPositions>>({ kind: 'match-design', ...task })
    // T_j over the period per assigned position (the hottest point) and the mission life.
    const junction = positions.filter(p => p.assigned?.thermal).map(p => ({ side: p.side, position: p.position, meanC: p.assigned!.thermal!.meanC, peakC: p.assigned!.thermal!.peakC, pointName: p.assigned!.thermal!.worstPointName, limitC: p.assigned!.thermal!.limitC, peakOk: p.assigned!.thermal!.peakOk }))
    figures = { summary, junction, life: thermal.life }
    await keepAnswer(key, 'parts-summary', id, { body: new TextEncoder().encode(JSON.stringify(figures)), gzip: false })
  }
  setResponseHeader(event, 'Server-Timing', `cache;desc=${stored ? 'hit' : 'miss'}`)
  const head = { id: design.id, name: design.name, revision: design.revision }
  if (sees(user.role, 'catalogue')) return { design: head, ...figures }
  return { design: head, ...figures, summary: figures.summary.map(s => ({ ...s, costPerDesign: null as number | null })) }
})

type Matched = ReturnType<typeof matchDesignPositions>
interface Figures {
  summary: Matched['summary']
  junction: { side: string, position: string, meanC: number, peakC: number, pointName: string, limitC: number, peakOk: boolean }[]
  life: Matched['thermal']['life']
}
