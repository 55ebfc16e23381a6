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
  /**
   * Statuses an allowed role gets. Default: 400 / 422 (the validation error) when a body is sent, 404
   * for a path naming a row that does not exist (999999), else 200.
   */
  ok?: number[]
}

/** What an allowed role must get from a route (never just "not 401/403"). */
export function expectedFor(route: RouteCase): number[] {
  if (route.ok) return route.ok
  // validation runs before the lookup
  if (route.body !== undefined) return [400, 422]
  if (route.path.includes('999999') || route.path.includes('does-not-exist')) return [404]
  return [200]
}

export const routeTable: RouteCase[] = [
  { file: 'health.get.ts', method: 'GET', path: '/api/health', access: 'public' },
  { file: 'auth/login.post.ts', method: 'POST', path: '/api/auth/login', access: 'public', body: {} },
  { file: 'auth/logout.post.ts', method: 'POST', path: '/api/auth/logout', access: 'public' },
  { file: 'auth/forgot.post.ts', method: 'POST', path: '/api/auth/forgot', access: 'public', body: {} },
  { file: 'auth/set-password.post.ts', method: 'POST', path: '/api/auth/set-password', access: 'public', body: {} },
  { file: 'auth/me.get.ts', method: 'GET', path: '/api/auth/me', access: 'signed-in' },
  { file: 'jobs/[id]/file.get.ts', method: 'GET', path: '/api/jobs/00000000-0000-4000-8000-000000000000/file', access: 'signed-in', ok: [404] },
  { file: 'jobs/[id].get.ts', method: 'GET', path: '/api/jobs/00000000-0000-4000-8000-000000000000', access: 'signed-in', ok: [404] },
  { file: 'home.get.ts', method: 'GET', path: '/api/home', access: 'stress:evaluate' },
  { file: 'admin/users.get.ts', method: 'GET', path: '/api/admin/users', access: 'users:manage' },
  { file: 'admin/users.post.ts', method: 'POST', path: '/api/admin/users', access: 'users:manage', body: { email: 'not-an-email' } },
  { file: 'admin/users/[id].patch.ts', method: 'PATCH', path: '/api/admin/users/999999', access: 'users:manage', body: {} },
  { file: 'admin/audit.get.ts', method: 'GET', path: '/api/admin/audit', access: 'audit:read' },
  { file: 'admin/mail.get.ts', method: 'GET', path: '/api/admin/mail', access: 'mail:read' },
  { file: 'admin/mail/[id].get.ts', method: 'GET', path: '/api/admin/mail/does-not-exist', access: 'mail:read' },
  { file: 'settings/locale.put.ts', method: 'PUT', path: '/api/settings/locale', access: 'signed-in', body: { locale: 'xx-XX' } },
  { file: 'tokens.get.ts', method: 'GET', path: '/api/tokens', access: 'tokens:own' },
  { file: 'tokens.post.ts', method: 'POST', path: '/api/tokens', access: 'tokens:own', body: { name: '' } },
  { file: 'tokens/[id].delete.ts', method: 'DELETE', path: '/api/tokens/999999', access: 'tokens:own' },
  { file: 'v1/stress.post.ts', method: 'POST', path: '/api/v1/stress', access: 'stress:evaluate', body: {} },
  { file: 'v1/evaluate.post.ts', method: 'POST', path: '/api/v1/evaluate', access: 'stress:evaluate', body: {} },
  { file: 'v1/openapi.json.get.ts', method: 'GET', path: '/api/v1/openapi.json', access: 'public' },
  { file: 'designs.get.ts', method: 'GET', path: '/api/designs', access: 'designs:read' },
  { file: 'designs.post.ts', method: 'POST', path: '/api/designs', access: 'designs:write', body: {} },
  { file: 'designs/preview.post.ts', method: 'POST', path: '/api/designs/preview', access: 'designs:read', body: {} },
  { file: 'designs/[id].get.ts', method: 'GET', path: '/api/designs/1', access: 'designs:read' },
  { file: 'designs/[id].put.ts', method: 'PUT', path: '/api/designs/1', access: 'designs:write', body: {} },
  { file: 'designs/[id].patch.ts', method: 'PATCH', path: '/api/designs/1', access: 'designs:write', body: {} },
  { file: 'designs/[id]/copy.post.ts', method: 'POST', path: '/api/designs/999999/copy', access: 'designs:write' },
  { file: 'designs/[id]/results.get.ts', method: 'GET', path: '/api/designs/1/results', access: 'designs:read' },
  { file: 'designs/[id]/parts.get.ts', method: 'GET', path: '/api/designs/1/parts', access: 'designs:read' },
  { file: 'designs/[id]/parts.put.ts', method: 'PUT', path: '/api/designs/1/parts', access: 'parts:assign', body: {} },
  { file: 'designs/[id]/parts.delete.ts', method: 'DELETE', path: '/api/designs/1/parts', access: 'parts:assign', body: {} },
  { file: 'catalog/template.csv.get.ts', method: 'GET', path: '/api/catalog/template.csv', access: 'catalog:read' },
  { file: 'catalog/template.xlsx.get.ts', method: 'GET', path: '/api/catalog/template.xlsx', access: 'catalog:read' },
  { file: 'catalog/imports.get.ts', method: 'GET', path: '/api/catalog/imports', access: 'catalog:read' },
  { file: 'catalog/imports.post.ts', method: 'POST', path: '/api/catalog/imports', access: 'catalog:write', body: {} },
  { file: 'catalog/imports/[id].get.ts', method: 'GET', path: '/api/catalog/imports/999999', access: 'catalog:read' },
  { file: 'catalog/imports/[id]/preview.post.ts', method: 'POST', path: '/api/catalog/imports/999999/preview', access: 'catalog:write', body: {} },
  { file: 'catalog/imports/[id]/commit.post.ts', method: 'POST', path: '/api/catalog/imports/999999/commit', access: 'catalog:write', body: {} },
  { file: 'catalog/imports/[id]/file.get.ts', method: 'GET', path: '/api/catalog/imports/999999/file', access: 'catalog:read' },
  { file: 'catalog/imports/[id]/refused.xlsx.get.ts', method: 'GET', path: '/api/catalog/imports/999999/refused.xlsx', access: 'catalog:read' },
  { file: 'catalog/imports/[id].delete.ts', method: 'DELETE', path: '/api/catalog/imports/999999', access: 'catalog:write' },
  { file: 'catalog/parts/bulk.post.ts', method: 'POST', path: '/api/catalog/parts/bulk', access: 'catalog:write', body: {} },
  { file: 'catalog/parts.get.ts', method: 'GET', path: '/api/catalog/parts', access: 'catalog:read' },
  { file: 'catalog/parts/[id].get.ts', method: 'GET', path: '/api/catalog/parts/1', access: 'catalog:read' },
  { file: 'catalog/parts/[id].patch.ts', method: 'PATCH', path: '/api/catalog/parts/1', access: 'catalog:write', body: {} },
  { file: 'catalog/versions.get.ts', method: 'GET', path: '/api/catalog/versions', access: 'catalog:read' },
  { file: 'trade-study.post.ts', method: 'POST', path: '/api/trade-study', access: 'designs:read', body: {} },
  { file: 'designs/[id]/report.pdf.get.ts', method: 'GET', path: '/api/designs/1/report.pdf', access: 'designs:read' },
  { file: 'designs/[id]/bom.get.ts', method: 'GET', path: '/api/designs/1/bom', access: 'bom:draft' },
  { file: 'designs/[id]/bom/settings.put.ts', method: 'PUT', path: '/api/designs/1/bom/settings', access: 'bom:release', body: {} },
  { file: 'designs/[id]/bom/release.post.ts', method: 'POST', path: '/api/designs/999999/bom/release', access: 'bom:release' },
  { file: 'designs/[id]/bom/acknowledgements.put.ts', method: 'PUT', path: '/api/designs/1/bom/acknowledgements', access: 'bom:release', body: {} },
  { file: 'designs/[id]/parts/summary.get.ts', method: 'GET', path: '/api/designs/1/parts/summary', access: 'designs:read' },
  { file: 'designs/[id]/parts/confirm.post.ts', method: 'POST', path: '/api/designs/1/parts/confirm', access: 'parts:assign', body: {} },
  { file: 'catalog/parts/[id]/usage.get.ts', method: 'GET', path: '/api/catalog/parts/1/usage', access: 'catalog:read' },
  { file: 'admin/outbox.get.ts', method: 'GET', path: '/api/admin/outbox', access: 'mail:read' },
  { file: 'boms.get.ts', method: 'GET', path: '/api/boms', access: 'bom:read' },
  { file: 'boms/[id].get.ts', method: 'GET', path: '/api/boms/999999', access: 'bom:read' },
  { file: 'boms/[id].patch.ts', method: 'PATCH', path: '/api/boms/999999', access: 'bom:purchase', body: {} },
  { file: 'boms/[id]/lines/[key].put.ts', method: 'PUT', path: '/api/boms/999999/lines/x', access: 'bom:purchase', body: {} },
  { file: 'boms/[id]/export.xlsx.get.ts', method: 'GET', path: '/api/boms/999999/export.xlsx', access: 'bom:read' },
  { file: 'boms/[id]/export.pdf.get.ts', method: 'GET', path: '/api/boms/999999/export.pdf', access: 'bom:read' },
]
