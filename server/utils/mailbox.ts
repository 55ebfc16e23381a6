import { readdir, readFile } from 'node:fs/promises'
import { join } from 'node:path'

export interface StoredMail {
  id: string
  receivedAt: string
  from: string
  to: string[]
  subject: string
  text: string
  attachments: { filename: string, contentType: string, size: number, contentBase64: string }[]
}

/** What the local fake SMTP server received (its mailbox folder), newest first. */
export async function readMailbox(): Promise<StoredMail[]> {
  const dir = useRuntimeConfig().mailboxDir
  if (!dir) return []
  let names: string[]
  try { names = (await readdir(dir)).filter(n => n.endsWith('.json')) }
  catch { return [] }
  const mails = await Promise.all(names.map(async n => JSON.parse(await readFile(join(dir, n), 'utf8')) as StoredMail))
  return mails.sort((a, b) => b.receivedAt.localeCompare(a.receivedAt))
}

export async function readStoredMail(id: string): Promise<StoredMail | null> {
  if (!/^[\w-]+$/.test(id)) return null
  const dir = useRuntimeConfig().mailboxDir
  if (!dir) return null
  try { return JSON.parse(await readFile(join(dir, `${id}.json`), 'utf8')) }
  catch { return null }
}
