// The database schema, split by domain. drizzle-kit reads this file (drizzle.config.ts); migrations are generated from it.
export * from './tables/people'
export * from './tables/vessels'
export * from './tables/runs'
export * from './tables/results'
export * from './tables/samples'
