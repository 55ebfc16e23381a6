import { can, type Permission } from '#shared/roles'

export interface NavItem { to: string, label: string, permission: Permission }

// Navigation by role: an entry shows only when the role has its permission.
const items: NavItem[] = [
  { to: '/designs', label: 'Designs', permission: 'designs:read' },
  { to: '/compare', label: 'Trade study', permission: 'designs:write' },
  { to: '/catalog', label: 'Parts catalogue', permission: 'catalog:read' },
  { to: '/boms', label: 'Bills of materials', permission: 'bom:read' },
  { to: '/admin/users', label: 'People', permission: 'users:manage' },
  { to: '/admin/audit', label: 'Audit log', permission: 'audit:read' },
  { to: '/admin/mail', label: 'Outgoing mail', permission: 'mail:read' },
]

export function useNavigation() {
  const { user } = useUserSession()
  const visible = computed(() => items.filter(i => can(user.value?.role, i.permission)))
  const allowed = (p: Permission) => can(user.value?.role, p)
  return { items: visible, allowed }
}
