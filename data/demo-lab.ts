// The demo lab: invented people, vessels and samples for trying Emberline. Not reference data.
import type { Role } from '../shared/types/roles'
import type { SeedMaterial } from './reference-materials'

export const DEMO_PASSWORD = 'ember-demo-2026'
export const DEMO_LAB_NAME = 'Kestrel Ridge Fuels Laboratory'

export const DEMO_USERS: { email: string, name: string, roles: Role[] }[] = [
  { email: 'analyst@emberline.test', name: 'Mira Okafor', roles: ['analyst'] },
  { email: 'analyst2@emberline.test', name: 'Tomasz Wren', roles: ['analyst'] },
  { email: 'supervisor@emberline.test', name: 'Helena Ruiz', roles: ['supervisor'] },
  { email: 'technician@emberline.test', name: 'Sam Adeyemi', roles: ['technician'] },
  { email: 'admin@emberline.test', name: 'Priya Natarajan', roles: ['admin'] },
]

const DAY = 86_400_000

/** Demo vessels (invented), in different states; dates are relative to the day the demo lab is loaded. */
export function demoVessels(now = Date.now()) {
  return [
    {
      name: 'KR-1 Aster', serialNumber: 'KRF-19-0113', class: 'standard' as const, ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300,
      location: 'Bench A', notes: 'Main vessel for coal and coke.', condition: 'normal' as const,
      firingsSinceService: 212, firingsSinceRequalification: 1840, firingsTotal: 4310, lastServicedAt: new Date(now - 61 * DAY), lastRequalifiedAt: new Date(now - 700 * DAY),
    },
    {
      name: 'KR-2 Birch', serialNumber: 'KRF-19-0114', class: 'standard' as const, ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300,
      location: 'Bench A', notes: 'Biofuels and food.', condition: 'normal' as const,
      firingsSinceService: 468, firingsSinceRequalification: 2470, firingsTotal: 2470, lastServicedAt: new Date(now - 120 * DAY), lastRequalifiedAt: null,
    },
    {
      name: 'KR-3 Cedar', serialNumber: 'KRH-21-0007', class: 'high-strength' as const, ratedEnergyJ: 40000, maxChargeMassG: 2.0, maxFillPressureMPa: 4.05, volumeMl: 340,
      location: 'Blast cell', notes: 'High-strength vessel for samples the screen flags; seals renewed this week.', condition: 'awaiting-verification' as const,
      firingsSinceService: 0, firingsSinceRequalification: 390, firingsTotal: 1260, lastServicedAt: new Date(now - 2 * DAY), lastRequalifiedAt: new Date(now - 300 * DAY),
    },
    {
      name: 'KR-4 Damson', serialNumber: 'KRF-17-0458', class: 'standard' as const, ratedEnergyJ: 30000, maxChargeMassG: 1.2, maxFillPressureMPa: 3.5, volumeMl: 250,
      location: 'Bench B', notes: 'Small vessel for oils and plastics; halogen-resistant alloy.', condition: 'normal' as const, halogenResistant: true,
      firingsSinceService: 141, firingsSinceRequalification: 3120, firingsTotal: 4980, lastServicedAt: new Date(now - 190 * DAY), lastRequalifiedAt: new Date(now - 900 * DAY),
    },
    {
      name: 'KR-5 Elder', serialNumber: 'KRF-16-0302', class: 'standard' as const, ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300,
      location: 'Bench B', notes: '', condition: 'locked-out' as const, conditionReason: 'Overpressure reported on firing of sample WF-2211; vessel withdrawn for requalification.',
      firingsSinceService: 377, firingsSinceRequalification: 4650, firingsTotal: 9120, lastServicedAt: new Date(now - 95 * DAY), lastRequalifiedAt: new Date(now - 1400 * DAY),
    },
  ]
}

/** The demo lab's own materials (invented clients and lots; figures are invented for the demo). */
export const DEMO_MATERIALS: SeedMaterial[] = [
  { name: 'Client coal KRC-2611 (bituminous blend)', category: 'coal', composition: { C: 72.1, H: 4.8, N: 1.5, S: 0.9, O: 8.2, ash: 12.5, moisture: 6.4 }, compositionBasis: 'dry' as const, notes: 'Monthly contract samples; composition from the client\'s ultimate analysis.' },
  { name: 'Pine pellets lot P-44', category: 'biomass', composition: { C: 50.2, H: 6.1, N: 0.2, O: 43.1, ash: 0.4, moisture: 7.5 }, compositionBasis: 'dry' as const },
  { name: 'Marine gas oil MG-9', category: 'liquid fuel', heatingValueJPerG: 45600, heatingValueUncertaintyJPerG: 120, heatingValueSource: 'Lab result 2026-10, duplicate mean' },
  { name: 'Shredded packaging waste SW-3', category: 'waste fuel', composition: { C: 55.0, H: 7.5, N: 0.6, S: 0.2, O: 20.0, Cl: 1.2, ash: 15.5, moisture: 4.0 }, compositionBasis: 'dry' as const, notes: 'Contains PVC: check the vessel for corrosion after firing.' },
  { name: 'Rolled oat flakes', category: 'food', heatingValueJPerG: 17800, heatingValueSource: 'Declared by the client' },
  { name: 'Recovered propellant fines (client RP-1)', category: 'waste fuel', declaredHazard: 'energetic' as const, notes: 'Declared energetic by the client: high-strength vessel and a signed exception only.' },
]
