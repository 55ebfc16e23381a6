// The health route's database check: a success at most DB_STATUS_FRESH_MS old answers without a query, unless a
// pool connection closed since; a failure is never reused; a check that began before a close does not count.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest'

let answer: () => Promise<unknown> = () => Promise.resolve([])
let queries = 0
vi.stubGlobal('useDb', () => ({ execute: () => { queries++; return answer() } }))
vi.stubGlobal('databaseProblem', (err: { code?: string }) => `the database is unavailable (${err.code})`)

let status: typeof import('../../../server/utils/db-status')
beforeAll(async () => {
  vi.useFakeTimers({ toFake: ['performance', 'setTimeout'] })
  vi.setSystemTime(0)
  vi.advanceTimersByTime(10_000)
  status = await import('../../../server/utils/db-status')
})
afterAll(() => { vi.useRealTimers() })

describe('database status for health', () => {
  it('asks PostgreSQL once, then answers from that success for up to DB_STATUS_FRESH_MS', async () => {
    expect(await status.databaseStatus()).toBeNull()
    expect(queries).toBe(1)
    vi.advanceTimersByTime(100)
    expect(await status.databaseStatus()).toBeNull()
    expect(queries).toBe(1)
    // older than a quarter: still answered at once, renewed in the background
    vi.advanceTimersByTime(status.DB_STATUS_FRESH_MS / 2)
    expect(await status.databaseStatus()).toBeNull()
    expect(queries).toBe(2)
    await new Promise(resolve => setImmediate(resolve)) // the renewal finished
    vi.advanceTimersByTime(status.DB_STATUS_FRESH_MS + 1)
    await status.databaseStatus()
    expect(queries).toBe(3)
  })

  it('asks again at once after a pool connection closed (a cut network, a restarted server), and reports it down', async () => {
    expect(await status.databaseStatus()).toBeNull()
    const before = queries
    answer = () => Promise.reject(Object.assign(new Error('closed'), { code: 'CONNECTION_CLOSED' }))
    status.databaseConnectionClosed()
    expect(await status.databaseStatus()).toBe('the database is unavailable (CONNECTION_CLOSED)')
    expect(queries).toBe(before + 1)
    // a failure is not reused: the next health asks again (and shares one query with those at the same moment)
    answer = () => Promise.resolve([])
    const both = await Promise.all([status.databaseStatus(), status.databaseStatus()])
    expect(both).toEqual([null, null])
    expect(queries).toBe(before + 2)
  })

  it('does not count a check that began before a connection closed as fresh', async () => {
    vi.advanceTimersByTime(status.DB_STATUS_FRESH_MS + 1)
    let finish: () => void = () => {}
    answer = () => new Promise((resolve) => { finish = () => resolve([]) })
    const pending = status.databaseStatus()
    status.databaseConnectionClosed()
    finish()
    expect(await pending).toBeNull()
    answer = () => Promise.resolve([])
    const before = queries
    await status.databaseStatus()
    expect(queries).toBe(before + 1)
  })
})
