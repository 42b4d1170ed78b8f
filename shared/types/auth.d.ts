// What the sealed session cookie holds (nuxt-auth-utils).
declare module '#auth-utils' {
  interface User {
    id: string
    email: string
    name: string
    roles: Role[]
  }
  interface UserSession {
    epoch: number
    loggedInAt: number
    lastSeenAt: number
  }
}

export {}
