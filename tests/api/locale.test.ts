// Issue 14 item 5: one locale per person. PUT /api/settings/locale validates and audits the choice, the session
// answer carries it, and the exports (BOM workbook and PDF, design report) write dates and numbers in it.
import { execFileSync } from 'node:child_process'
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import ExcelJS from 'exceljs'
import { describe, expect, it } from 'vitest'
import { client, linkIn, signIn, signInAs, unique, waitForMail, type Client } from '../support/api'

const input = {
  machineSide: {
    topology: 'two-level', levels: 2, dcVoltage: 650, dcVoltageMax: 750, switchingHz: 6000, modulation: 'space-vector', overshootVoltage: 60,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 400, phaseCurrentRms: 120, powerFactor: 0.9, fundamentalHz: 50 }],
  },
}

/** A person of our own (the demo accounts stay in the company default for the other tests). */
async function newPerson(role: string): Promise<{ person: Client, email: string }> {
  const admin = await signInAs('admin')
  const email = `${unique('locale')}@example.com`
  expect((await admin.json('POST', '/api/admin/users', { email, name: 'Linnea Locale', role })).status).toBe(201)
  const token = new URL(linkIn((await waitForMail(email, 'invited')).text)).searchParams.get('token')!
  expect((await client().json('POST', '/api/auth/set-password', { token, password: 'locale-password-123' })).status).toBe(200)
  return { person: await signIn(email, 'locale-password-123'), email }
}

/** A released BOM of a design with the best-ranked part on every position. */
async function releasedBom() {
  const eng = await signInAs('design-engineer')
  const { body: design } = await eng.json('POST', '/api/designs', { name: unique('Locale BOM'), input })
  const { body } = await eng.json('GET', `/api/designs/${design.id}/parts`)
  for (const p of body.positions) {
    const c = p.candidates[0]
    await eng.json('PUT', `/api/designs/${design.id}/parts`, { side: p.side, position: p.position, partVersionId: c.partVersionId, seriesCount: c.seriesCount, parallelCount: c.parallelCount })
  }
  expect((await eng.json('PUT', `/api/designs/${design.id}/bom/settings`, { buildQuantity: 1200, sparesPercent: 10, manualLines: [{ description: 'Heatsink', quantityPerUnit: 1, unitPrice: 1234.5 }] })).status).toBe(200)
  const released = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
  expect(released.status).toBe(201)
  return { designId: design.id as number, bomId: released.body.id as number, designName: design.name as string }
}

async function designSheetValue(person: Client, bomId: number, label: string) {
  const r = await person.request('GET', `/api/boms/${bomId}/export.xlsx`)
  expect(r.status).toBe(200)
  const wb = new ExcelJS.Workbook()
  await wb.xlsx.load(Buffer.from(await r.arrayBuffer()) as unknown as ArrayBuffer)
  const sheet = wb.getWorksheet('Design')!
  return sheet.getRows(1, sheet.rowCount)!.find(row => row.getCell(1).value === label)?.getCell(2).value
}

function pdfText(bytes: Buffer): string {
  const dir = mkdtempSync(join(tmpdir(), 'sv-locale-'))
  try {
    writeFileSync(join(dir, 'x.pdf'), bytes)
    return execFileSync('pdftotext', [join(dir, 'x.pdf'), '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ')
  }
  finally { rmSync(dir, { recursive: true, force: true }) }
}

describe('PUT /api/settings/locale', () => {
  it('401 signed out', async () => {
    const r = await client().json('PUT', '/api/settings/locale', { locale: 'de-DE' })
    expect(r.status).toBe(401)
  })

  it('422 on an unknown locale, naming the field by its label and keeping the machine path', async () => {
    const { person } = await newPerson('viewer')
    for (const locale of ['fr-FR', 'de', 42]) {
      const r = await person.json('PUT', '/api/settings/locale', { locale })
      expect(r.status).toBe(422)
      expect(r.body.message).toContain('Language and number format')
      expect(r.body.message).toContain('de-DE')
      expect(r.body.data.issues[0].path).toBe('locale')
    }
    const missing = await person.json('PUT', '/api/settings/locale', {})
    expect(missing.status).toBe(422)
    expect(missing.body.data.issues[0].path).toBe('locale')
    // nothing was written: the session answer still names the company default
    expect((await person.json('GET', '/api/_auth/session')).body.locale).toBe('en-GB')
  })

  it('refuses a state change from a foreign origin (CSRF rule)', async () => {
    const { person } = await newPerson('viewer')
    const r = await person.request('PUT', '/api/settings/locale', { locale: 'de-DE' }, { origin: 'https://evil.example' })
    expect(r.status).toBe(403)
    expect((await person.json('GET', '/api/_auth/session')).body.locale).toBe('en-GB')
  })

  it('saves the choice, audits it, carries it in the session answer, and null goes back to the company default', async () => {
    const { person, email } = await newPerson('viewer')
    const r = await person.json('PUT', '/api/settings/locale', { locale: 'sv-SE' })
    expect(r).toEqual({ status: 200, body: { locale: 'sv-SE', effective: 'sv-SE' } })
    const session = (await person.json('GET', '/api/_auth/session')).body
    expect(session.locale).toBe('sv-SE')
    expect(session.user).toMatchObject({ email, locale: 'sv-SE' })
    // two at once: both answer, the last one written is what stays (one column, no partial state)
    const [a, b] = await Promise.all([person.json('PUT', '/api/settings/locale', { locale: 'de-DE' }), person.json('PUT', '/api/settings/locale', { locale: 'de-DE' })])
    expect([a.status, b.status]).toEqual([200, 200])
    expect((await person.json('GET', '/api/_auth/session')).body.locale).toBe('de-DE')
    expect((await person.json('PUT', '/api/settings/locale', { locale: null })).body).toEqual({ locale: null, effective: 'en-GB' })
    expect((await person.json('GET', '/api/_auth/session')).body.locale).toBe('en-GB')
    const admin = await signInAs('admin')
    const audit = await admin.json('GET', `/api/admin/audit?q=${encodeURIComponent(email)}`)
    const rows = (Array.isArray(audit.body) ? audit.body : audit.body.rows) as { action: string, details: unknown }[]
    const changes = rows.filter(row => row.action === 'locale changed')
    expect(changes.map(c => c.details)).toEqual(expect.arrayContaining([{ from: null, to: 'sv-SE' }, { from: 'de-DE', to: null }]))
  })
})

describe('exports in the requesting user\'s locale', () => {
  it('the BOM workbook writes the release date, and the BOM PDF and design report their numbers and dates, in the chosen locale', async () => {
    const { designId, bomId } = await releasedBom()
    const { person } = await newPerson('viewer')

    // company default (en-GB): "14 Mar 2026, 09:30 UTC" style
    const gb = await designSheetValue(person, bomId, 'Released at')
    expect(gb).toMatch(/^\d{1,2} [A-Z][a-z]{2} \d{4}, \d{2}:\d{2} UTC$/)
    expect(await designSheetValue(person, bomId, 'Build quantity')).toBe(1200)

    expect((await person.json('PUT', '/api/settings/locale', { locale: 'de-DE' })).status).toBe(200)
    const de = await designSheetValue(person, bomId, 'Released at')
    expect(de).toMatch(/^\d{2}\.\d{2}\.\d{4}, \d{2}:\d{2} UTC$/)
    // numbers stay numbers in the workbook
    expect(await designSheetValue(person, bomId, 'Build quantity')).toBe(1200)

    if (existsSync('/usr/bin/pdftotext')) {
      const bom = await person.request('GET', `/api/boms/${bomId}/export.pdf`)
      expect(bom.status).toBe(200)
      const text = pdfText(Buffer.from(await bom.arrayBuffer()))
      // 1200 sets and 1320 pieces of the manual line (10 % spares) with the German thousands separator
      expect(text).toContain('1.200 sets')
      expect(text).toContain(`released ${de}`)
      expect(text).toMatch(/1\.234,50/)
      const report = await person.request('GET', `/api/designs/${designId}/report.pdf`)
      expect(report.status).toBe(200)
      const reportText = pdfText(Buffer.from(await report.arrayBuffer()))
      expect(reportText).toMatch(/\d{2}\.\d{2}\.\d{4}, \d{2}:\d{2} UTC/)
      // the operating point's power factor 0.9 with two decimals
      expect(reportText).toContain('0,90')
    }
  }, 60_000)
})

describe('purchasing\'s home (issue 14 item 6)', () => {
  it('names the design of each BOM waiting to be bought, not a row number', async () => {
    const { bomId, designName } = await releasedBom()
    const buyer = await signInAs('purchasing')
    const home = await buyer.json('GET', '/api/home')
    const task = home.body.tasks.find((t: { title: string }) => t.title === 'Bills of materials to buy')
    const item = task.items.find((i: { to: string }) => i.to === `/boms/${bomId}`)
    expect(item?.label).toBe(`${designName}, BOM revision 1 — released`)
    for (const i of task.items) expect(i.label).not.toMatch(/^BOM \d/)
  }, 60_000)
})
