import type { H3Event } from 'h3'
import { LifecycleRefusal } from '#shared/domain/vessel-lifecycle'
import type { AuthedUser } from './auth'

// Services speak of refusals in domain terms; the HTTP layer turns them into status codes in one place.
export type RefusalKind = 'invalid' | 'forbidden' | 'not-found' | 'conflict'
const STATUS: Record<RefusalKind, number> = { 'invalid': 422, 'forbidden': 403, 'not-found': 404, 'conflict': 409 }

/** A service's "no": what was refused and why, with optional details for the page. */
export class Refusal extends Error {
  constructor(readonly kind: RefusalKind, message: string, readonly data?: Record<string, unknown>) {
    super(message)
    this.name = 'Refusal'
  }
}

/** Runs a service and answers its refusals (and the domain's lifecycle refusals) with their HTTP status (422, 403, 404, 409). */
export async function answering<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work()
  }
  catch (err) {
    if (err instanceof Refusal) throw createError({ statusCode: STATUS[err.kind], message: err.message, data: err.data })
    if (err instanceof LifecycleRefusal) throw createError({ statusCode: 409, message: err.message })
    throw err
  }
}

/** Who acts, for the services: the signed-in user and the request, without the HTTP event itself. */
export interface Act {
  user: AuthedUser
  /** Read by `audit()`: the actor and the request id of the audit row. */
  context: { user: AuthedUser, requestId?: string }
}

export function actOf(event: H3Event, user: AuthedUser): Act {
  return { user, context: { user, requestId: event.context.requestId } }
}
