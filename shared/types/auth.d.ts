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
  }
}

export {}
