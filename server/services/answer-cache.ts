// Answers computed from a saved design, kept in PostgreSQL (table computed_answers) so that opening an unchanged
// design sends the stored bytes instead of evaluating it again. The key is a hash of the build and of everything
// the answer is computed from, so nothing is ever invalidated by hand: a saved revision, another assignment, a
// catalogue commit (the generation) or a new build gives another key. Every instance reads and writes the same rows.
import { createHash } from 'node:crypto'
import { and, desc, eq, notInArray } from 'drizzle-orm'
import type { EncodedAnswer } from '../workers/encode'

export type AnswerKind = 'design-results' | 'parts-summary'

/** Rows kept per design and kind (the latest revision and a few others viewed lately). */
export const ANSWERS_KEPT = 4

/**
 * `nuxt dev` rebuilds the engine without a new build id, so there an answer could outlive the code that made it:
 * the cache is off (and off with STRATAVOLT_ANSWER_CACHE=off).
 */
const enabled = () => !import.meta.dev && process.env.STRATAVOLT_ANSWER_CACHE !== 'off'

/** SHA-256 over the build id, the kind and the JSON of what the answer is computed from. */
export function answerKey(kind: AnswerKind, from: unknown): string {
  const build = useRuntimeConfig().app.buildId
  return createHash('sha256').update(`${build}\n${kind}\n`).update(JSON.stringify(from)).digest('hex')
}

/** The stored answer of `key`, or null. */
export async function storedAnswer(key: string): Promise<EncodedAnswer | null> {
  if (!enabled()) return null
  const [row] = await useDb().select({ body: tables.computedAnswers.body, gzip: tables.computedAnswers.gzip })
    .from(tables.computedAnswers).where(eq(tables.computedAnswers.key, key))
  return row ? { body: new Uint8Array(row.body.buffer, row.body.byteOffset, row.body.byteLength), gzip: row.gzip } : null
}

/**
 * Keeps an answer under `key` and drops the design's older answers of this kind beyond ANSWERS_KEPT. Two requests
 * computing the same answer at once both insert: the second finds the key taken and leaves the first row (the same
 * bytes). A design deleted meanwhile takes its rows with it (or refuses the insert: the answer is sent all the same).
 */
export async function keepAnswer(key: string, kind: AnswerKind, designId: number, answer: EncodedAnswer): Promise<void> {
  if (!enabled()) return
  const t = tables.computedAnswers
  try {
    const db = useDb()
    await db.insert(t).values({ key, kind, designId, body: Buffer.from(answer.body.buffer, answer.body.byteOffset, answer.body.byteLength), gzip: answer.gzip })
      .onConflictDoNothing({ target: t.key })
    const newest = db.select({ key: t.key }).from(t).where(and(eq(t.designId, designId), eq(t.kind, kind))).orderBy(desc(t.createdAt)).limit(ANSWERS_KEPT)
    await db.delete(t).where(and(eq(t.designId, designId), eq(t.kind, kind), notInArray(t.key, newest)))
  }
  catch (err) {
    // 23503: the design was deleted while its answer was computed; nothing to keep it for
    if ((err as { code?: string }).code !== '23503') throw err
  }
}
