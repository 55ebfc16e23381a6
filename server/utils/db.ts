import { drizzle } from 'drizzle-orm/postgres-js'
import postgres from 'postgres'
import * as schema from '../db/schema'
import { databaseConnectionClosed } from './db-status'

export const tables = schema

let client: ReturnType<typeof postgres> | undefined
let db: ReturnType<typeof drizzle<typeof schema>> | undefined

/** The app's one Drizzle instance over one connection pool. */
export function useDb() {
  if (!db) {
    const url = useRuntimeConfig().databaseUrl || process.env.DATABASE_URL
    if (!url) throw new Error('NUXT_DATABASE_URL is not set')
    // onclose: a lost connection makes the health route ask PostgreSQL again (db-status.ts)
    client = postgres(url, { max: 10, onnotice: () => {}, onclose: () => databaseConnectionClosed() })
    db = drizzle(client, { schema })
  }
  return db
}

export type Db = ReturnType<typeof useDb>
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]
