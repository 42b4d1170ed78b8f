// The demo lab: invented people, vessels and samples for trying Emberline. Not reference data.
import type { Role } from '../shared/types/roles'

export const DEMO_PASSWORD = 'ember-demo-2026'
export const DEMO_LAB_NAME = 'Kestrel Ridge Fuels Laboratory'

export const DEMO_USERS: { email: string, name: string, roles: Role[] }[] = [
  { email: 'analyst@emberline.test', name: 'Mira Okafor', roles: ['analyst'] },
  { email: 'analyst2@emberline.test', name: 'Tomasz Wren', roles: ['analyst'] },
  { email: 'supervisor@emberline.test', name: 'Helena Ruiz', roles: ['supervisor'] },
  { email: 'technician@emberline.test', name: 'Sam Adeyemi', roles: ['technician'] },
  { email: 'admin@emberline.test', name: 'Priya Natarajan', roles: ['admin'] },
]
