import type { H3Event } from 'h3'

/** Appends one line to the audit log; never fails the request that caused it. */
export async function audit(event: H3Event | null, action: string, fields: { actorId?: number | null, actorEmail?: string | null, subject?: string, details?: unknown } = {}) {
  try {
    await useDb().insert(tables.auditLog).values({
      action,
      actorId: fields.actorId ?? event?.context.user?.id ?? null,
      actorEmail: fields.actorEmail ?? event?.context.user?.email ?? null,
      subject: fields.subject,
      details: fields.details ?? null,
      ip: event ? getRequestIP(event, { xForwardedFor: false }) ?? null : null,
    })
  }
  catch (err) {
    console.error('[audit] could not write', action, err)
  }
}
