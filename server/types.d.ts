import type { AuthedUser } from './utils/auth'

declare module 'h3' {
  interface H3EventContext {
    requestId?: string
    user?: AuthedUser | null
    /** The server-side session row of this request's cookie, once loadSessionUser has checked it. */
    sessionId?: string
  }
}

export {}
