// The session endpoint of nuxt-auth-utils answers only for users who are still active and signed in, and clearing
// the session through it (DELETE /api/_auth/session) ends the server-side session row too.
export default defineNitroPlugin(() => {
  sessionHooks.hook('fetch', async (_session, event) => {
    if (!await loadSessionUser(event)) throw createError({ statusCode: 401, message: 'Session ended.' })
  })
  sessionHooks.hook('clear', async (session) => {
    const id = session.secure?.sessionId
    if (id) await endSession(useDb(), id, 'sign-out')
  })
})
