export const ROLE_NAMES = ['analyst', 'supervisor', 'technician', 'admin'] as const
export type Role = typeof ROLE_NAMES[number]

export const ROLE_LABELS: Record<Role, string> = {
  analyst: 'Analyst',
  supervisor: 'Supervisor',
  technician: 'Technician',
  admin: 'Admin',
}
