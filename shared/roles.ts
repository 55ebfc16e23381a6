// The one role table of the product (PRODUCT.md "Users and roles"). Routes, navigation and tests read it.

export const roles = ['admin', 'design-engineer', 'component-engineer', 'purchasing', 'viewer'] as const
export type Role = (typeof roles)[number]

export const roleLabels: Record<Role, string> = {
  'admin': 'Administrator',
  'design-engineer': 'Design engineer',
  'component-engineer': 'Component engineer',
  'purchasing': 'Purchasing',
  'viewer': 'Viewer',
}

/** What a signed-in person may do. Each server route asks for exactly one of these. */
export const permissions = {
  'users:manage': ['admin'],
  'audit:read': ['admin'],
  'mail:read': ['admin'],
  'designs:read': ['admin', 'design-engineer', 'component-engineer', 'viewer'],
  'designs:write': ['admin', 'design-engineer'],
  'stress:evaluate': ['admin', 'design-engineer', 'component-engineer', 'purchasing', 'viewer'],
  'catalog:read': ['admin', 'design-engineer', 'component-engineer', 'purchasing'],
  'catalog:write': ['admin', 'component-engineer'],
  'parts:assign': ['admin', 'design-engineer'],
  'bom:read': ['admin', 'design-engineer', 'purchasing', 'viewer'],
  'bom:draft': ['admin', 'design-engineer'],
  'bom:release': ['admin', 'design-engineer'],
  'bom:purchase': ['admin', 'purchasing'],
  'tokens:own': ['admin', 'design-engineer', 'component-engineer', 'purchasing', 'viewer'],
} as const satisfies Record<string, readonly Role[]>

export type Permission = keyof typeof permissions

export function can(role: Role | undefined | null, permission: Permission): boolean {
  return !!role && (permissions[permission] as readonly Role[]).includes(role)
}

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (roles as readonly string[]).includes(value)
}

/**
 * Which roles receive which restricted fields, stated once. Routes strip the fields for other roles;
 * the role-matrix test checks what each role receives.
 * - purchase: purchasing's own entries on a released BOM (quotes, quote currency, suppliers, order
 *   references, line status and dates, promised delivery) and the supplier a BOM line was priced from.
 * - catalogue: catalogue data in a design's parts route (candidates, prices, stock, lead times,
 *   suppliers of assigned parts): only roles with catalogue read.
 */
export const restrictedFields = {
  purchase: {
    roles: ['admin', 'design-engineer', 'purchasing'],
    /** keys of BomPurchaseEntry, and of BomLine */
    purchaseEntry: ['supplier', 'quotedUnitPrice', 'quoteCurrency', 'orderReference', 'status', 'statusDates', 'promisedDelivery'],
    bomLine: ['supplier'],
  },
  catalogue: {
    roles: permissions['catalog:read'],
    /** keys of a parts-route position / assignment evaluation */
    position: ['candidates', 'hiddenCandidates', 'fitting', 'nothingFits'],
    evaluation: ['part', 'unitPrice', 'priceBreakQuantity', 'costPerDesign', 'orderQuantity', 'currency', 'stock', 'stockOk', 'leadTimeDays'],
  },
} as const satisfies Record<string, { roles: readonly Role[], [fields: string]: readonly string[] }>

export function sees(role: Role | undefined | null, what: keyof typeof restrictedFields): boolean {
  return !!role && (restrictedFields[what].roles as readonly Role[]).includes(role)
}
