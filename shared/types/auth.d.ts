import type { Role } from '../roles'

declare module '#auth-utils' {
  interface User {
    id: number
    email: string
    name: string
    role: Role
  }
  interface UserSession {
    sessionVersion: number
    /** Set (with no user) by GET /api/_auth/session when this session no longer counts. */
    ended?: 'disabled' | 'ended'
  }
}

export {}
