import type { Role } from '../roles'

declare module '#auth-utils' {
  interface User {
    id: number
    email: string
    name: string
    role: Role
    /** chosen locale (en-GB, de-DE, sv-SE, en-US); null: the company default */
    locale?: string | null
  }
  interface UserSession {
    sessionVersion: number
    /** Set (with no user) by GET /api/_auth/session when this session no longer counts. */
    ended?: 'disabled' | 'ended'
    /** Set by GET /api/_auth/session: the locale pages format in (the user's choice, else the company default). */
    locale?: string
  }
}

export {}
