import { and, eq } from 'drizzle-orm'

// What the result form previews with: the firing's weighed charge, the ε in force with its series, the aid and cotton
// values and the lab's duplicate scatter. The page adds the policy and calls the same computation the server stores.
// A run that has a result keeps the ε of that result, as its revision will.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'analyst', 'supervisor')
  const { id } = parseParams(event, idParam)
  const db = useDb()
  const run = await findRunOr404(db, id)
  if (run.status !== 'fired') throw createError({ statusCode: 409, message: `Run ${run.sampleCode} is ${run.status}: a result needs a recorded firing.` })
  const [current] = await db.select({ energyEquivalentId: schema.results.energyEquivalentId }).from(schema.results)
    .where(and(eq(schema.results.runId, id), eq(schema.results.current, true))).limit(1)
  const { parts } = await resultContextParts(db, run, current?.energyEquivalentId)
  return parts
})
