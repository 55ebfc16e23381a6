import { z } from 'zod'
import { dbInt } from './bounds'

export const assignmentSchema = z.object({
  side: z.enum(['machine', 'grid'], { message: 'Use \'machine\' or \'grid\'' }),
  position: z.string().trim().min(1, 'Name the position').max(40),
  partVersionId: dbInt().positive('Choose a part'),
  seriesCount: z.number().int().min(1).max(32).default(1),
  parallelCount: z.number().int().min(1).max(64).default(1),
})

export const unassignSchema = assignmentSchema.pick({ side: true, position: true })
