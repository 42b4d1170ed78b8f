import { dayPlanRequestSchema } from '#shared/schemas/day-plans'

// Proposes a bench day for the chosen vessels, or re-checks the analyst's edited assignment (a run moved between
// vessels) by the same rules; nothing is saved. POST because the edited assignment travels in the body.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const input = await parseBody(event, dayPlanRequestSchema)
  const { views: _views, ...answer } = await dayPlanAnswer(useDb(), input, await getPolicy())
  return answer
})
