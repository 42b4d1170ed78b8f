import { z } from 'zod'

const param = z.object({ vesselId: z.string().uuid('a vessel id (UUID)') })

// One vessel's standardisation: accepted ε and history, the runs, the candidate series and the control charts (every role reads it).
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { vesselId } = parseParams(event, param)
  return standardisationDetail(useDb(), vesselId, await getPolicy())
})
