import { z } from 'zod'
import { designInputSchema } from './stress'
import { dbInt } from './bounds'

export const designStatus = z.enum(['active', 'archived'])

export const designCreateSchema = z.object({
  name: z.string().trim().min(1, 'Name the design').max(120, 'Use at most 120 characters'),
  description: z.string().trim().max(2000).default(''),
  input: designInputSchema,
})

/** A save: `revision` is the revision the editor started from (optimistic locking). */
export const designSaveSchema = designCreateSchema.extend({
  revision: dbInt().positive().max(2_147_483_646, 'Not a valid revision'),
})

export const designPatchSchema = z.object({ status: designStatus })

export const designListQuery = z.object({
  status: z.enum(['active', 'archived', 'all']).default('active'),
})

export const bomSettingsSchema = z.object({
  buildQuantity: z.number().int().min(1, 'At least 1').max(100000),
  sparesPercent: z.number().min(0).max(100),
  manualLines: z.array(z.object({
    description: z.string().trim().min(1, 'Describe the line').max(200),
    partNumber: z.string().trim().max(80).default(''),
    manufacturer: z.string().trim().max(80).default(''),
    quantityPerUnit: z.number().int().min(1).max(100000),
    unitPrice: z.number().min(0).nullable().default(null),
    currency: z.string().trim().length(3).default('EUR'),
  })).max(200).default([]),
})
export type BomSettings = z.infer<typeof bomSettingsSchema>
