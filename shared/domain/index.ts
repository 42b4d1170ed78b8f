// Public API of the charge-assessment core. Not re-exported, so pages never load them by accident:
// units.ts (mathjs; import '#shared/domain/units' on the server) and structure.ts (openchemlib; loaded lazily by resolveComponents).
export * from './assessment'
export * from './composition'
export * from './elements'
export * from './formula-groups'
export * from './heating-value'
export * from './hygiene'
export * from './oxygen'
export * from './peak-pressure'
export * from './policy'
export * from './screening'
export * from './specific-energy'
