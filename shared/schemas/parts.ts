import { z } from 'zod'
import { dbInt } from './bounds'

export const assignmentSchema = z.object({
  side: z.enum(['machine', 'grid'], { message: 'Use \'machine\' or \'grid\'' }),
  position: z.string().trim().min(1, 'Name the position').max(40),
  partVersionId: dbInt().positive('Choose a part'),
  seriesCount: z.number().int().min(1).max(32).default(1),
  parallelCount: z.number().int().min(1).max(64).default(1),
})

export const unassignSchema = z.object({
  side: z.enum(['machine', 'grid', 'dc-link'], { message: 'Use \'machine\', \'grid\' or \'dc-link\'' }),
  position: z.string().trim().min(1, 'Name the position').max(40),
})

export const assignmentWithCoverSchema = assignmentSchema.extend({
  side: z.enum(['machine', 'grid', 'dc-link'], { message: 'Use \'machine\', \'grid\' or \'dc-link\'' }),
  /** also fill the positions a module covers (the positions named in the candidate's `covers`) */
  fillCovered: z.boolean().default(false),
})

export const confirmAssignmentSchema = z.object({
  side: z.enum(['machine', 'grid', 'dc-link'], { message: 'Use \'machine\', \'grid\' or \'dc-link\'' }),
  position: z.string().trim().min(1, 'Name the position').max(40),
  reason: z.string().trim().min(5, 'Give a reason of at least 5 characters').max(500),
})
