// Record a firing of a ready run (analyst): Idempotency-Key header required; see server/utils/firing.ts.
export default defineEventHandler(event => recordFiring(event))
