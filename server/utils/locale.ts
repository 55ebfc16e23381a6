import type { H3Event } from 'h3'
import { resolveLocale, type AppLocale } from '#shared/utils/format'

/** The company default locale (NUXT_PUBLIC_LOCALE, default en-GB): used when a user has not chosen one. */
export function companyLocale(event?: H3Event): AppLocale {
  return resolveLocale(null, String(useRuntimeConfig(event).public.locale ?? ''))
}

/** The locale to write text for this request in: the signed-in user's choice, else the company default. */
export function requestLocale(event: H3Event): AppLocale {
  const user = event.context.user as { locale?: string | null } | null | undefined
  return resolveLocale(user?.locale, companyLocale(event))
}
