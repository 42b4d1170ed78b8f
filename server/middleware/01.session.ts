// Opens the session cookie once, from this process's memory when the same value was opened before
// (server/utils/session-cookie.ts); whether the session still holds is decided by 02.auth.ts and loadSessionUser.
export default defineEventHandler(event => openSessionCookie(event))
