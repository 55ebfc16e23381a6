// One part identity in the database (issue 15 item 3): the parts.key index holds partKey(), the SQL function the
// migration re-keys with agrees with it, an import spelling a stored part differently updates that part, and the
// re-keying migration reports spellings that the old index kept apart instead of merging them.
import { readFileSync } from 'node:fs'
import postgres from 'postgres'
import { afterAll, describe, expect, it } from 'vitest'
import { CATALOG_COLUMNS } from '../../catalog/columns'
import { partKey } from '../../shared/catalog/part-key'
import { signInAs, unique, type Client } from '../support/api'

const db = postgres(process.env.STRATAVOLT_TEST_DATABASE_URL!, { max: 2, onnotice: () => {} })
afterAll(() => db.end())

function capacitorCsv(manufacturer: string, partNumber: string, stock: number) {
  const values: Record<string, string> = {
    partNumber, manufacturer, kind: 'capacitor', voltageRating: '1300',
    capacitance: '0.0012', rippleCurrentRating: '95', priceBreaks: '1:51.00', currency: 'EUR', stock: String(stock),
  }
  const rows = [CATALOG_COLUMNS.map(c => c.header), CATALOG_COLUMNS.map(c => values[c.key] ?? '')]
  return rows.map(r => r.map(v => `"${v.replace(/"/g, '""')}"`).join(',')).join('\r\n') + '\r\n'
}

async function importCsv(c: Client, csv: string, name: string) {
  const form = new FormData()
  form.append('file', new Blob([csv]), `${name}.csv`)
  const up = await c.request('POST', '/api/catalog/imports', form)
  const uploaded = await up.json() as any
  expect(up.status, JSON.stringify(uploaded)).toBe(201)
  const r = await c.json('POST', `/api/catalog/imports/${uploaded.import.id}/commit`, { mapping: uploaded.mapping, decimalSeparator: uploaded.decimalSeparator })
  expect(r.status, JSON.stringify(r.body)).toBe(200)
  return r.body as { added: number, updated: number, unchanged: number }
}

const AWKWARD: [string, string][] = [
  ['  Kestrel   Capacitors ', 'kc-1100 500'],
  ['Kestrel\t\u00a0Capacitors', 'KC\u3000-\n1100'],
  ['Ｋｅｓｔｒｅｌ', 'ｋｃ－１'],
  ['Électro Vénus', 'év-ß'],
  ['A|B\\C', '|x\\'],
  ['Ørsted İstanbul ﬁne', 'ǆ-ﬀ'],
  ['\u2003Nordic\u2028Power\u205f', '\ufeffNP\u00851'],
]

describe('part key in the database', () => {
  it('the SQL function the migration re-keys with gives partKey() for awkward spellings', async () => {
    for (const [manufacturer, partNumber] of AWKWARD) {
      const [row] = await db`select stratavolt_part_key(${manufacturer}, ${partNumber}) as key`
      expect(row!.key, JSON.stringify([manufacturer, partNumber])).toBe(partKey(manufacturer, partNumber))
    }
  })

  it('an import naming a stored part in another spelling updates it: one part, one key', async () => {
    const components = await signInAs('component-engineer')
    const pn = unique('PK-CAP')
    expect(await importCsv(components, capacitorCsv('Kestrel Capacitors', pn, 40), pn)).toMatchObject({ added: 1 })
    const spelled = `${pn.slice(0, 3)} ${pn.slice(3).toLowerCase()}`
    expect(await importCsv(components, capacitorCsv(' KESTREL  capacitors', spelled, 41), `${pn}-2`)).toMatchObject({ added: 0, updated: 1 })
    const rows = await db`select id, key, manufacturer, part_number from parts where key = ${partKey('Kestrel Capacitors', pn)}`
    expect(rows).toHaveLength(1)
    expect(rows[0]!.part_number).toBe(pn) // the part keeps the spelling it was created with
    // the index refuses a second part with the same key
    await expect(db`insert into parts (manufacturer, part_number, key) values ('x', 'y', ${rows[0]!.key})`).rejects.toThrow(/parts_key/)
  })
})

describe('a part the re-keying marked as another spelling', () => {
  it('cannot be edited (409 naming the part it repeats); the kept part can; the part answer says which it repeats', async () => {
    const components = await signInAs('component-engineer')
    const pn = unique('PK-DUP')
    await importCsv(components, capacitorCsv('Kestrel Capacitors', pn, 5), pn)
    const [kept] = await db`select id, key, current_version_id from parts where key = ${partKey('Kestrel Capacitors', pn)}`
    const [version] = await db`select catalog_version_id, data from part_versions where id = ${kept!.current_version_id}`
    // what migration 0008 leaves for a second spelling the old index allowed
    const [repeat] = await db`insert into parts (manufacturer, part_number, key, key_conflict_with) values ('Kestrel  Capacitors', ${pn}, ${kept!.key}, ${kept!.id}) returning id`
    const [repeatVersion] = await db`insert into part_versions (part_id, catalog_version_id, part_number, manufacturer, kind, package_config, lifecycle, data, is_current)
      values (${repeat!.id}, ${version!.catalog_version_id}, ${pn}, 'Kestrel  Capacitors', 'capacitor', 'single', 'active', ${db.json(version!.data)}, true) returning id`
    await db`update parts set current_version_id = ${repeatVersion!.id} where id = ${repeat!.id}`

    const refused = await components.json('PATCH', `/api/catalog/parts/${repeat!.id}`, { stock: 9 })
    expect(refused.status).toBe(409)
    expect(refused.body.message).toContain(`part ${kept!.id}`)
    expect((await components.json('GET', `/api/catalog/parts/${repeat!.id}`)).body.keyConflictWith).toBe(kept!.id)
    expect((await components.json('PATCH', `/api/catalog/parts/${kept!.id}`, { stock: 9 })).status).toBe(200)
    // the refused edit wrote nothing on either part
    const versions = await db`select part_id, count(*)::int as n from part_versions where part_id in (${kept!.id}, ${repeat!.id}) group by part_id order by part_id`
    expect(versions.map(v => v.n)).toEqual([2, 1])
  })
})

describe('migration 0008 re-keys stored parts', () => {
  // The migrations up to 0007 are applied in a schema of their own, parts are written the way the old index let
  // them be, then 0008 runs: the way an operator's database with years of imports is migrated.
  const schema = `rekey_${Date.now().toString(36)}`
  const migration = (tag: string) => readFileSync(new URL(`../../drizzle/${tag}.sql`, import.meta.url), 'utf8')
    .replaceAll('"public".', `"${schema}".`).split('--> statement-breakpoint')
  const journal = JSON.parse(readFileSync(new URL('../../drizzle/meta/_journal.json', import.meta.url), 'utf8')) as { entries: { tag: string }[] }
  afterAll(async () => { await db.unsafe(`drop schema if exists "${schema}" cascade`) })

  it('keeps every part, marks the later spelling of one part, and writes each group to the audit log', async () => {
    await db.begin(async (tx) => {
      await tx.unsafe(`create schema "${schema}"`)
      await tx.unsafe(`set local search_path = "${schema}", public`)
      const tags = journal.entries.map(e => e.tag)
      const last = tags.indexOf('0008_part_key_and_money')
      for (const tag of tags.slice(0, last)) for (const statement of migration(tag)) if (statement.trim()) await tx.unsafe(statement)

      const [version] = await tx.unsafe(`insert into catalog_versions (number) values (1) returning id`)
      const legacy: [string, string][] = [
        ['Kestrel Capacitors', 'KC-1100'], // kept: the oldest spelling
        ['Kestrel Capacitors ', 'KC-1100'], // the old index did not trim
        ['Kestrel  Capacitors', 'kc-11 00'], // nor fold inner blanks or case
        ['Norvale Semiconductor', 'NV-12'], // alone: no conflict
        ['Norvale Semiconductor', 'NV-13'],
      ]
      const ids: number[] = []
      for (const [manufacturer, partNumber] of legacy) {
        const [p] = await tx.unsafe(`insert into parts (manufacturer, part_number) values ($1, $2) returning id`, [manufacturer, partNumber])
        const [v] = await tx.unsafe(`insert into part_versions (part_id, catalog_version_id, part_number, manufacturer, kind, package_config, unit_price, lifecycle, data, is_current)
          values ($1, $2, $3, $4, 'capacitor', 'single', 12.345678, 'active', '{}', true) returning id`, [p!.id, version!.id, partNumber, manufacturer])
        await tx.unsafe(`update parts set current_version_id = $1 where id = $2`, [v!.id, p!.id])
        ids.push(p!.id)
      }
      const before = await tx.unsafe(`select count(*)::int as parts, (select count(*)::int from part_versions) as versions from parts`)

      for (const statement of migration('0008_part_key_and_money')) if (statement.trim()) await tx.unsafe(statement)

      const after = await tx.unsafe(`select count(*)::int as parts, (select count(*)::int from part_versions) as versions from parts`)
      expect(after[0]).toEqual(before[0]) // nothing merged, nothing dropped
      const parts = await tx.unsafe(`select id, key, key_conflict_with from parts order by id`)
      expect(parts.map(p => p.key)).toEqual(legacy.map(([m, n]) => partKey(m, n)))
      expect(parts.map(p => p.key_conflict_with)).toEqual([null, ids[0], ids[0], null, null])
      const audit = await tx.unsafe(`select action, subject, details from audit_log where action = 'Part key conflict'`)
      expect(audit).toHaveLength(1)
      expect(audit[0]!.details).toMatchObject({
        key: partKey('Kestrel Capacitors', 'KC-1100'),
        kept: { partId: ids[0], partNumber: 'KC-1100' },
        conflicting: [{ partId: ids[1], manufacturer: 'Kestrel Capacitors ' }, { partId: ids[2], partNumber: 'kc-11 00' }],
      })
      // money is an exact decimal now
      const [price] = await tx.unsafe(`select unit_price::text as price, pg_typeof(unit_price)::text as type from part_versions limit 1`)
      expect(price).toEqual({ price: '12.345678', type: 'numeric' })
      // the index holds one part per key among those not marked
      await expect(tx.savepoint(sp => sp.unsafe(`insert into parts (manufacturer, part_number, key) values ('KESTREL CAPACITORS', 'KC1100', $1)`, [parts[0]!.key]))).rejects.toThrow(/parts_key/)
    })
  })
})
