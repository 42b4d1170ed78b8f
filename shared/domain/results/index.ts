// Public surface of the results domain: one import for pages, server routes and tests.
export * from './statistics'
export * from './energy-equivalent'
export * from './calorific-value'
export * from './bases'
export * from './duplicates'
export * from './thermogram'
export * from './uncertainty'
export * from './control-chart'
