// The locale pages format dates, numbers and money in, and quantity fields read their decimal mark in: the one
// the session answer names (the user's choice, else the company default; server/plugins/03.session-refresh.ts).
// The server fetches the session while rendering and the browser hydrates the same answer, so both write the
// same text: no hydration mismatch.
import { DEFAULT_LOCALE, formatDate, formatDateTime, formatInteger, formatMoney, formatNumber, formatSi, resolveLocale, type AppLocale, type NumberOptions } from '#shared/utils/format'
import type { ComputedRef } from 'vue'

type SessionLike = { locale?: string, user?: { locale?: string | null } | null } | null | undefined

function localeOf(session: SessionLike, companyDefault: unknown): AppLocale {
  return resolveLocale(session?.locale ?? session?.user?.locale, String(companyDefault ?? ''))
}

/** The active locale, reactive: follows a change of the user's choice at once. Call it in setup. */
export function useLocale(): ComputedRef<AppLocale> {
  const { session } = useUserSession()
  const companyDefault = useRuntimeConfig().public.locale
  return computed(() => localeOf(session.value as SessionLike, companyDefault))
}

/**
 * The active locale read where no setup runs (helpers called while a component renders, e.g. a table
 * column's format function); the company default outside a Nuxt app (unit tests).
 */
export function activeLocale(): AppLocale {
  const nuxtApp = tryUseNuxtApp()
  if (!nuxtApp) return DEFAULT_LOCALE
  const session = nuxtApp.payload.state['$snuxt-session'] as SessionLike
  return localeOf(session, nuxtApp.$config.public.locale)
}

/** The formatting helpers bound to the active locale, for templates: `fmt.dateTime(row.at)`, `fmt.money(v, 'EUR')`. */
export function useFormat() {
  const locale = useLocale()
  return {
    locale,
    number: (v: number | null | undefined, options?: NumberOptions) => formatNumber(v, locale.value, options),
    integer: (v: number | null | undefined) => formatInteger(v, locale.value),
    money: (v: number | null | undefined, currency: string | null = 'EUR') => formatMoney(v, currency, locale.value),
    date: (v: string | number | Date | null | undefined) => formatDate(v, locale.value),
    dateTime: (v: string | number | Date | null | undefined) => formatDateTime(v, locale.value),
    si: (v: number | null | undefined, unit: string, digits?: number) => formatSi(v, unit, digits, locale.value),
  }
}
