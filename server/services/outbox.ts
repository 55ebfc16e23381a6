// Mail outbox: rows written in the same transaction as what they report (a BOM release), sent by a
// worker loop on any instance. Each batch is claimed with FOR UPDATE SKIP LOCKED, so two instances
// never send the same row, and a crash between the commit and the send only delays the mail.
import { sql } from 'drizzle-orm'
import { releaseMail } from './bom'

/** Attempts before a row is marked failed (shown on the outgoing-mail page). */
export const OUTBOX_MAX_ATTEMPTS = 8

/** Wait before the next attempt: 30 s doubling per failed attempt, at most one hour. */
export function outboxBackoffMs(attempts: number, baseMs = 30_000): number {
  return Math.min(baseMs * 2 ** Math.max(0, attempts - 1), 3_600_000)
}

type OutboxRow = { id: number, kind: string, to: string, subject: string, payload: { bomId?: number, releasedBy?: string }, attempts: number }

async function compose(row: OutboxRow) {
  if (row.kind === 'bom-released' && row.payload.bomId) return releaseMail(row.payload.bomId, row.payload.releasedBy ?? 'Someone')
  throw new Error(`unknown outbox kind ${row.kind}`)
}

/** Sends the due rows (at most `limit`); returns how many were sent and how many failed this round. */
export async function drainOutbox(limit = 5): Promise<{ sent: number, failed: number }> {
  let sent = 0
  let failed = 0
  await useDb().transaction(async (tx) => {
    const rows = [...await tx.execute<OutboxRow>(sql`
      select id, kind, "to", subject, payload, attempts from mail_outbox
      where status = 'pending' and next_attempt_at <= now()
      order by id limit ${limit} for update skip locked`)]
    for (const row of rows) {
      let error: string | null
      try {
        const mail = await compose(row)
        const result = await sendMailResult({ to: row.to, subject: row.subject, ...mail })
        error = result.ok ? null : (result.error ?? 'sending failed')
      }
      catch (err) {
        error = err instanceof Error ? err.message : String(err)
      }
      const attempts = row.attempts + 1
      if (!error) {
        sent++
        await tx.execute(sql`update mail_outbox set status = 'sent', attempts = ${attempts}, sent_at = now(), last_error = null where id = ${row.id}`)
      }
      else {
        failed++
        const give = attempts >= OUTBOX_MAX_ATTEMPTS
        await tx.execute(sql`update mail_outbox set status = ${give ? 'failed' : 'pending'}, attempts = ${attempts}, last_error = ${error},
          next_attempt_at = now() + (${outboxBackoffMs(attempts)} * interval '1 millisecond') where id = ${row.id}`)
      }
    }
  })
  return { sent, failed }
}

/** Pending and failed sends first, then the latest sent ones (the admin's outgoing-mail page). */
export async function outboxOverview(limit = 50) {
  const rows = await useDb().execute<{ id: number, kind: string, to: string, subject: string, status: string, attempts: number, next_attempt_at: Date, last_error: string | null, sent_at: Date | null, created_at: Date }>(sql`
    select id, kind, "to", subject, status, attempts, next_attempt_at, last_error, sent_at, created_at from mail_outbox
    order by case status when 'failed' then 0 when 'pending' then 1 else 2 end, id desc limit ${limit}`)
  const list = [...rows].map(r => ({ id: r.id, kind: r.kind, to: r.to, subject: r.subject, status: r.status, attempts: r.attempts, nextAttemptAt: r.next_attempt_at, lastError: r.last_error, sentAt: r.sent_at, createdAt: r.created_at }))
  return { pending: list.filter(r => r.status === 'pending'), failed: list.filter(r => r.status === 'failed'), sent: list.filter(r => r.status === 'sent') }
}
