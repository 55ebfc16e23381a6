import { z } from 'zod'
import { roles } from '../roles'
import { dbIdValue } from './bounds'
import { LOCALES } from '../utils/format'

export const email = z.string().trim().toLowerCase().max(254).email('Enter a valid e-mail address')
export const newPassword = z.string().min(10, 'Use at least 10 characters').max(200, 'Use at most 200 characters')

export const loginSchema = z.object({
  email,
  password: z.string().min(1, 'Enter your password').max(200),
})

export const inviteSchema = z.object({
  email,
  name: z.string().trim().min(1, 'Enter a name').max(120),
  role: z.enum(roles, { message: `Choose one of: ${roles.join(', ')}` }),
})

export const userPatchSchema = z.object({
  role: z.enum(roles, { message: `Choose one of: ${roles.join(', ')}` }).optional(),
  disabled: z.boolean().optional(),
}).refine(v => v.role !== undefined || v.disabled !== undefined, { message: 'Give a role or disabled' })

export const setPasswordSchema = z.object({
  token: z.string().min(20, 'The link is incomplete').max(200),
  password: newPassword,
})

export const forgotSchema = z.object({ email })

export const apiTokenCreateSchema = z.object({
  name: z.string().trim().min(1, 'Name the token (e.g. "CI script")').max(80),
})

/** A person's locale for dates, numbers and money; null goes back to the company default. */
export const localeSettingSchema = z.object({
  locale: z.enum(LOCALES, { message: `Choose one of: ${LOCALES.join(', ')}, or none for the company default` }).nullable(),
})

export const idParam = z.object({ id: dbIdValue })
