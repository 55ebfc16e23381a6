// Every server route, the permission it needs, and a request that reaches its guard.
// The role-matrix test checks each against every role, and that no route file is missing here.
import type { Permission } from '../../shared/roles'

export interface RouteCase {
  /** route file under server/api, as Nitro names it */
  file: string
  method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE'
  /** a concrete path to call */
  path: string
  access: Permission | 'public' | 'signed-in'
  /** body sent when calling it (invalid on purpose where the route writes: an allowed role then gets 4xx from validation, not from the guard) */
  body?: unknown
}

export const routeTable: RouteCase[] = [
  { file: 'health.get.ts', method: 'GET', path: '/api/health', access: 'public' },
  { file: 'auth/login.post.ts', method: 'POST', path: '/api/auth/login', access: 'public', body: {} },
  { file: 'auth/logout.post.ts', method: 'POST', path: '/api/auth/logout', access: 'public' },
  { file: 'auth/forgot.post.ts', method: 'POST', path: '/api/auth/forgot', access: 'public', body: {} },
  { file: 'auth/set-password.post.ts', method: 'POST', path: '/api/auth/set-password', access: 'public', body: {} },
  { file: 'auth/me.get.ts', method: 'GET', path: '/api/auth/me', access: 'signed-in' },
  { file: 'home.get.ts', method: 'GET', path: '/api/home', access: 'stress:evaluate' },
  { file: 'admin/users.get.ts', method: 'GET', path: '/api/admin/users', access: 'users:manage' },
  { file: 'admin/users.post.ts', method: 'POST', path: '/api/admin/users', access: 'users:manage', body: { email: 'not-an-email' } },
  { file: 'admin/users/[id].patch.ts', method: 'PATCH', path: '/api/admin/users/999999', access: 'users:manage', body: {} },
  { file: 'admin/audit.get.ts', method: 'GET', path: '/api/admin/audit', access: 'audit:read' },
  { file: 'admin/mail.get.ts', method: 'GET', path: '/api/admin/mail', access: 'mail:read' },
  { file: 'admin/mail/[id].get.ts', method: 'GET', path: '/api/admin/mail/does-not-exist', access: 'mail:read' },
  { file: 'tokens.get.ts', method: 'GET', path: '/api/tokens', access: 'tokens:own' },
  { file: 'tokens.post.ts', method: 'POST', path: '/api/tokens', access: 'tokens:own', body: { name: '' } },
  { file: 'tokens/[id].delete.ts', method: 'DELETE', path: '/api/tokens/999999', access: 'tokens:own' },
]
