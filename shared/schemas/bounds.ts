import { z } from 'zod'

/** Largest value of a PostgreSQL `integer` (int4) column: ids, revisions, stock, counts. */
export const PG_INT_MAX = 2_147_483_647

/** A row id in a path or query (`serial` column): 1 … 2³¹−1, so a larger number is a 4xx, never a database error. */
export const dbIdValue = z.coerce.number().int('Not a valid id').positive('Not a valid id').max(PG_INT_MAX, 'Not a valid id')

/** A whole number stored in an `integer` column. */
export const dbInt = () => z.number().int().max(PG_INT_MAX, `At most ${PG_INT_MAX}`)
