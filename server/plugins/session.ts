// The session endpoint of nuxt-auth-utils answers only for users who are still active and signed in.
export default defineNitroPlugin(() => {
  sessionHooks.hook('fetch', async (_session, event) => {
    if (!await loadSessionUser(event)) throw createError({ statusCode: 401, message: 'Session ended.' })
  })
})
