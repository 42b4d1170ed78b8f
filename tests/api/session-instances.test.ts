import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { as, baseURL, signIn, unique } from '../support/api'
import { startServer } from '../support/server-process'
import type { ServerProcess } from '../support/server-process'

// Each process remembers what a sealed session cookie opened to, and a server render resolves the signed-in user once
// for all its internal fetches; neither may let an ended session through. Two instances share one database: a change
// made through one is refused by the other at the very next request, however warm its memory of the cookie.

let second: ServerProcess
beforeAll(async () => {
  second = await startServer()
})
afterAll(async () => {
  await second?.stop()
})

async function newUser(name: string, roles: string[] = ['analyst']) {
  const admin = await as('admin')
  const email = `${unique('inst')}@emberline.test`
  const password = 'correct horse battery'
  const res = await fetch(`${baseURL()}/api/admin/users`, {
    method: 'POST', headers: { 'content-type': 'application/json', cookie: admin }, body: JSON.stringify({ email, name, roles, password }),
  })
  expect(res.status).toBe(201)
  const { id } = await res.json() as { id: string }
  return { id, cookie: await signIn(email, password), admin }
}

async function statusAt(base: string, cookie: string, path = '/api/settings') {
  const res = await fetch(`${base}${path}`, { headers: { cookie }, redirect: 'manual' })
  await res.arrayBuffer()
  return res.status
}

async function changeUser(base: string, admin: string, id: string, body: object) {
  const res = await fetch(`${base}/api/admin/users/${id}`, { method: 'PATCH', headers: { 'content-type': 'application/json', cookie: admin }, body: JSON.stringify(body) })
  expect(res.status, await res.text()).toBe(200)
}

describe('a session on two instances', () => {
  it('is refused on the other instance at its very next request once the user is disabled', async () => {
    const u = await newUser('Disabled On One')
    // Both instances have opened (and remembered) the cookie several times.
    for (let i = 0; i < 3; i++) {
      expect(await statusAt(baseURL(), u.cookie)).toBe(200)
      expect(await statusAt(second.baseURL, u.cookie)).toBe(200)
    }
    await changeUser(baseURL(), u.admin, u.id, { active: false })
    expect(await statusAt(second.baseURL, u.cookie)).toBe(401)
    expect(await statusAt(baseURL(), u.cookie)).toBe(401)
  })

  it('is refused on the first instance at its very next request after a role change made on the second', async () => {
    const u = await newUser('Role Changed On Two')
    expect(await statusAt(baseURL(), u.cookie, '/api/plans')).toBe(200)
    expect(await statusAt(second.baseURL, u.cookie, '/api/plans')).toBe(200)
    await changeUser(second.baseURL, u.admin, u.id, { roles: ['technician'] })
    expect(await statusAt(baseURL(), u.cookie, '/api/plans')).toBe(401)
    expect(await statusAt(second.baseURL, u.cookie, '/api/plans')).toBe(401)
  })

  it('renders Today for the signed-in user, and sends a disabled user to sign in on the next page', async () => {
    const u = await newUser('Rendered Person')
    for (const base of [baseURL(), second.baseURL]) {
      const page = await fetch(`${base}/`, { headers: { cookie: u.cookie, accept: 'text/html' } })
      expect(page.status).toBe(200)
      const html = await page.text()
      expect(html).toContain('signed in as Rendered Person')
      // The fleet came through the same render (its own internal fetch, with the user resolved once).
      expect(html).toContain('The fleet')
    }
    await changeUser(second.baseURL, u.admin, u.id, { active: false })
    const after = await fetch(`${baseURL()}/`, { headers: { cookie: u.cookie, accept: 'text/html' }, redirect: 'manual' })
    expect(after.status).toBe(302)
    expect(after.headers.get('location')).toMatch(/^\/login/)
  })
})
