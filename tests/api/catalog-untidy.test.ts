// The catalogue import with an untidy supplier sheet, end to end against the built server: header row
// found, supplier words mapped, partial commit after a confirmation naming the count, refused rows as a
// sheet, a re-import that keeps hand-made edits (stock, lead time, lifecycle, approval), an identical
// re-upload that makes no version, deleting an uncommitted import, bulk changes, real issue counts.
import ExcelJS from 'exceljs'
import { beforeAll, describe, expect, it } from 'vitest'
import { signInAs, unique, type Client } from '../support/api'
import { workbookBuffer } from '../fixtures/catalog/workbooks'
import { UNTIDY_HEADERS, untidyRows } from '../fixtures/catalog/untidy'

function upload(c: Client, buffer: Buffer, filename: string) {
  const form = new FormData()
  form.append('file', new Blob([new Uint8Array(buffer)]), filename)
  return c.request('POST', '/api/catalog/imports', form).then(async r => ({ status: r.status, body: await r.json() as any }))
}

const choiceOf = (body: any) => ({ mapping: body.mapping, decimalSeparator: body.decimalSeparator, valueMapping: body.valueMapping, constants: body.constants })

async function part(c: Client, prefix: string, suffix: string) {
  const r = await c.json('GET', `/api/catalog/parts?q=${encodeURIComponent(`${prefix}-${suffix}`)}`)
  expect(r.status).toBe(200)
  const rows = (r.body as any).rows.filter((x: any) => x.partNumber === `${prefix}-${suffix}`)
  return rows[0]
}

describe('catalogue import: an untidy supplier sheet, without editing the file', () => {
  let engineer: Client
  const prefix = unique('UT')
  let importId: number
  let first: any

  beforeAll(async () => { engineer = await signInAs('component-engineer') })

  it('reads the sheet: header row, skipped rows, supplier words, currency from the header, real issue count', async () => {
    // The header set carries the prefix, so the remembered mapping belongs to this run.
    const rows = untidyRows(prefix)
    rows[2] = [...UNTIDY_HEADERS, `Batch ${prefix}`]
    const r = await upload(engineer, await workbookBuffer([{ name: 'Price list', rows }]), `${prefix}.xlsx`)
    expect(r.status, JSON.stringify(r.body).slice(0, 400)).toBe(201)
    first = r.body
    importId = r.body.import.id
    expect(r.body.headerRowNumber).toBe(3)
    expect(r.body.skipped.map((s: any) => `${s.rowNumber}:${s.reason}`)).toEqual(['1:above-header', '7:blank', '13:notes', '14:notes'])
    expect(r.body.valueMapping.kind).toMatchObject({ 'igbt module': 'switch-diode', 'film capacitor': 'capacitor' })
    const p = r.body.preview
    expect(p).toMatchObject({ rowsRead: 7, validParts: 4, rowsWithErrors: 2, currencyFromHeader: 'EUR', duplicatesSkipped: [{ rowNumber: 9, sameAs: 4 }] })
    expect(p.decimalSeparators.find((s: any) => s.key === 'voltageRating')).toMatchObject({ separator: ',', source: 'cells' })
    expect(r.body.changes).toMatchObject({ added: 4, changed: 0, unchanged: 0 })
    const list = (await engineer.json('GET', '/api/catalog/imports')).body as any[]
    expect(list.find(i => i.id === importId)).toMatchObject({ status: 'preview', issueCount: p.issueCount })
    expect(p.issueCount).toBe(3) // two conflicting rows + the exact repeat (a warning)
  })

  it('lets the user move the header row, and names an empty one', async () => {
    const moved = await engineer.json('POST', `/api/catalog/imports/${importId}/preview`, { ...choiceOf(first), headerRow: 4 })
    expect(moved.status).toBe(200)
    expect((moved.body as any).headerRowNumber).toBe(4)
    const empty = await engineer.json('POST', `/api/catalog/imports/${importId}/preview`, { ...choiceOf(first), headerRow: 2 })
    expect(empty.status).toBe(422)
    expect((empty.body as any).message).toMatch(/row 2 is empty/)
    const back = await engineer.json('POST', `/api/catalog/imports/${importId}/preview`, { ...choiceOf(first), headerRow: 3 })
    expect((back.body as any).preview.validParts).toBe(4)
  })

  it('commits the valid rows only after a confirmation naming how many are left out', async () => {
    const plain = await engineer.json('POST', `/api/catalog/imports/${importId}/commit`, choiceOf(first))
    expect(plain.status).toBe(422)
    expect((plain.body as any).message).toMatch(/2 rows have errors\. Import the 4 valid rows and leave the 2 refused ones\?/)
    expect((plain.body as any).data.refusedCount).toBe(2)
    const wrong = await engineer.json('POST', `/api/catalog/imports/${importId}/commit`, { ...choiceOf(first), leaveRefused: 1 })
    expect(wrong.status).toBe(422)
    expect(await part(engineer, prefix, 'HB')).toBeUndefined()
    const ok = await engineer.json('POST', `/api/catalog/imports/${importId}/commit`, { ...choiceOf(first), leaveRefused: 2 })
    expect(ok.status, JSON.stringify(ok.body)).toBe(200)
    expect(ok.body).toMatchObject({ added: 4, updated: 0, refused: 2 })
    const hb = await part(engineer, prefix, 'HB')
    expect(hb).toMatchObject({ kind: 'switch-diode', voltageRating: 1200, unitPrice: 182, currency: 'EUR', stock: 140, leadTimeDays: 56, lifecycle: 'active' })
    const sw = await engineer.json('GET', `/api/catalog/parts/${(await part(engineer, prefix, 'SW')).id}`)
    expect((sw.body as any).versions[0].data.diodeThresholdVoltage).toBeUndefined() // optional figure left empty
    expect(await part(engineer, prefix, 'X')).toBeUndefined()
  })

  it('downloads the refused rows as a sheet with a reason column', async () => {
    const r = await engineer.request('GET', `/api/catalog/imports/${importId}/refused.xlsx`)
    expect(r.status).toBe(200)
    const wb = new ExcelJS.Workbook()
    await wb.xlsx.load(await r.arrayBuffer())
    const sheet = wb.worksheets[0]!
    const header = (sheet.getRow(1).values as unknown[]).slice(1)
    expect(header.slice(-2)).toEqual(['Reason', 'Row in the upload'])
    expect(sheet.actualRowCount).toBe(3)
    const row2 = (sheet.getRow(2).values as unknown[]).slice(1)
    expect(row2[0]).toBe(`${prefix}-X`)
    expect(row2.at(-2)).toMatch(/also on row 11 with other values/)
    expect(row2.at(-1)).toBe(10)
  })

  it('a re-import without stock, lead time and lifecycle columns keeps the values set in the app', async () => {
    const hb = await part(engineer, prefix, 'HB')
    expect((await engineer.json('PATCH', `/api/catalog/parts/${hb.id}`, { stock: 7, leadTimeDays: 30, lifecycle: 'nrnd', approved: true })).status).toBe(200)
    // The supplier's next list: new price, no stock / lead time / status columns at all.
    const keep = UNTIDY_HEADERS.map((h, i) => ({ h, i })).filter(({ h }) => !['Qty in stock', 'Lead time', 'Status'].includes(h)).map(({ i }) => i)
    const rows = untidyRows(prefix, { igbtPrice: '1:190,00; 10:175,00' }).map(r => (r.length > 2 ? keep.map(i => r[i] ?? null) : r))
    rows[2] = [...keep.map(i => UNTIDY_HEADERS[i]!), `Batch ${prefix} 2`]
    const r = await upload(engineer, await workbookBuffer([{ name: 'Price list', rows }]), `${prefix}-update.xlsx`)
    expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBe(201)
    // Without the stock column the two X rows (they differed only in stock) are the same: one imports.
    expect(r.body.changes).toMatchObject({ added: 1, changed: 1, unchanged: 3 })
    expect(r.body.preview).toMatchObject({ rowsWithErrors: 0, duplicatesSkipped: [{ rowNumber: 9, sameAs: 4 }, { rowNumber: 11, sameAs: 10 }] })
    const change = r.body.changes.changes[0]
    expect(change).toMatchObject({ partId: hb.id, row: 4 })
    expect(change.fields).toEqual([{ key: 'priceBreaks', label: 'Unit price breaks', old: [{ minQuantity: 1, unitPrice: 182 }, { minQuantity: 10, unitPrice: 169.5 }], new: [{ minQuantity: 1, unitPrice: 190 }, { minQuantity: 10, unitPrice: 175 }] }])
    const commit = await engineer.json('POST', `/api/catalog/imports/${r.body.import.id}/commit`, choiceOf(r.body))
    expect(commit.status, JSON.stringify(commit.body)).toBe(200)
    expect(commit.body).toMatchObject({ added: 1, updated: 1, unchanged: 3, refused: 0 })
    const after = await part(engineer, prefix, 'HB')
    expect(after).toMatchObject({ unitPrice: 190, stock: 7, leadTimeDays: 30, lifecycle: 'nrnd', approved: true })
  })

  it('an identical re-upload makes no new catalogue version', async () => {
    const before = (await engineer.json('GET', '/api/catalog/versions')).body as any[]
    const rows = untidyRows(prefix, { igbtPrice: '1:190,00; 10:175,00' })
    rows[2] = [...UNTIDY_HEADERS, `Batch ${prefix}`]
    // Stock, lead time and lifecycle as the app has them now, so nothing differs.
    rows[3] = rows[3]!.map((c, i) => (UNTIDY_HEADERS[i] === 'Qty in stock' ? 7 : UNTIDY_HEADERS[i] === 'Lead time' ? 30 : UNTIDY_HEADERS[i] === 'Status' ? 'phase out' : c))
    rows[8] = rows[3]!.slice()
    const r = await upload(engineer, await workbookBuffer([{ name: 'Price list', rows }]), `${prefix}-same.xlsx`)
    expect(r.status).toBe(201)
    expect(r.body.changes, JSON.stringify(r.body.changes)).toMatchObject({ added: 0, changed: 0, unchanged: 4 })
    const commit = await engineer.json('POST', `/api/catalog/imports/${r.body.import.id}/commit`, { ...choiceOf(r.body), leaveRefused: 2 })
    expect(commit.status).toBe(200)
    expect(commit.body).toMatchObject({ catalogVersionId: null, number: null, added: 0, updated: 0, unchanged: 4 })
    const after = (await engineer.json('GET', '/api/catalog/versions')).body as any[]
    expect(after[0].number).toBe(before[0].number)
  })

  it('deletes an uncommitted import with its stored file; a committed one stays', async () => {
    const r = await upload(engineer, await workbookBuffer([{ name: 'Price list', rows: untidyRows(`${prefix}-DEL`) }]), `${prefix}-delete.xlsx`)
    const id = r.body.import.id
    expect((await engineer.request('GET', `/api/catalog/imports/${id}/file`)).status).toBe(200)
    const purchasing = await signInAs('purchasing')
    expect((await purchasing.json('DELETE', `/api/catalog/imports/${id}`)).status).toBe(403)
    expect((await engineer.json('DELETE', `/api/catalog/imports/${id}`)).status).toBe(200)
    expect((await engineer.json('GET', `/api/catalog/imports/${id}`)).status).toBe(404)
    expect((await engineer.request('GET', `/api/catalog/imports/${id}/file`)).status).toBe(404)
    expect((await engineer.json('DELETE', `/api/catalog/imports/${importId}`)).status).toBe(409)
  })

  it('approves and changes the lifecycle of several parts at once, after a confirmation of the count', async () => {
    const ids = [(await part(engineer, prefix, 'SW')).id, (await part(engineer, prefix, 'D')).id]
    const unconfirmed = await engineer.json('POST', '/api/catalog/parts/bulk', { ids, approved: true, confirm: 1 })
    expect(unconfirmed.status).toBe(422)
    expect((unconfirmed.body as any).data.issues.map((i: any) => i.path)).toContain('confirm')
    const r = await engineer.json('POST', '/api/catalog/parts/bulk', { ids, approved: true, lifecycle: 'obsolete', confirm: 2 })
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body).toMatchObject({ changed: 2, approved: true, lifecycle: 'obsolete' })
    for (const s of ['SW', 'D']) expect(await part(engineer, prefix, s)).toMatchObject({ approved: true, lifecycle: 'obsolete' })
    const missing = await engineer.json('POST', '/api/catalog/parts/bulk', { ids: [999_999_999], approved: true, confirm: 1 })
    expect(missing.status).toBe(422)
  })
})
