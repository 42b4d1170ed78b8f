// Charge assessment: heat, oxygen, peak bound, screening and vessel state turned into findings and a verdict.
export * from './contract'
export * from './schema'
export { resolveComponents, assess } from './resolve'
export { assessCharge } from './assess'
export { suggestSampleMass, suggestAidMass, type SampleMassSuggestion } from './limits'
