import type { AuthedUser } from './utils/auth'

declare module 'h3' {
  interface H3EventContext {
    requestId?: string
    user?: AuthedUser | null
  }
}

export {}
