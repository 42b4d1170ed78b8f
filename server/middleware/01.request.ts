import { randomUUID } from 'node:crypto'

// Every request gets an id that appears in its audit rows and error answers.
export default defineEventHandler((event) => {
  event.context.requestId = randomUUID()
  setResponseHeader(event, 'X-Request-Id', event.context.requestId)
})
