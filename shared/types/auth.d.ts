// What the sealed session cookie holds (nuxt-auth-utils).
declare module '#auth-utils' {
  interface User {
    id: string
    email: string
    name: string
    roles: Role[]
  }
  interface UserSession {
    loggedInAt: number
  }
  // Never sent to the browser's script: the server-side session row the cookie stands for.
  interface SecureSessionData {
    sessionId: string
  }
}

export {}
