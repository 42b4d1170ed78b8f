// The access map: every page file is covered, the longest prefix decides, and the navigation follows it.
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { allows, API_ACCESS, PAGE_ACCESS, pageAccess } from '#shared/access'

const root = fileURLToPath(new URL('../..', import.meta.url))
function files(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f)
    return statSync(p).isDirectory() ? files(p) : [p]
  })
}
// pages/plans/[id]/index.vue → /plans/x
const pagePath = (file: string) => `/${relative(join(root, 'pages'), file).replace(/\.vue$/, '').replace(/(^|\/)index$/, '').replace(/\[[^\]]+\]/g, 'x')}`.replace(/\/$/, '') || '/'

describe('access map', () => {
  it('names the roles of every page folder explicitly (no page falls through to the default)', () => {
    const uncovered = files(join(root, 'pages')).map(pagePath).filter(p => !Object.keys(PAGE_ACCESS).some(prefix => prefix === '/' ? p === '/' : p === prefix || p.startsWith(`${prefix}/`)))
    expect(uncovered).toEqual([])
  })

  it('lets the longest prefix decide', () => {
    expect(pageAccess('/admin/policy')).toEqual(['admin', 'supervisor'])
    expect(pageAccess('/admin/users')).toEqual(['admin'])
    expect(pageAccess('/plans/42/print')).toEqual(['analyst', 'supervisor'])
    expect(pageAccess('/')).toBe('all')
    expect(pageAccess('/login')).toBe('public')
    expect(pageAccess('/planstuff')).toBe('all')
  })

  it('allows by role, and nothing but public pages without a session', () => {
    expect(allows(['supervisor'], ['analyst', 'supervisor'])).toBe(true)
    expect(allows(['supervisor'], ['analyst'])).toBe(false)
    expect(allows('all', ['technician'])).toBe(true)
    expect(allows('all', null)).toBe(false)
    expect(allows('public', null)).toBe(true)
  })

  it('lists every API route file', () => {
    const routes = files(join(root, 'server/api')).map((f) => {
      const m = /^(.*?)(?:\/index)?\.(get|post|patch|put|delete)\.ts$/.exec(relative(join(root, 'server'), f))
      return m ? `${m[2]!.toUpperCase()} /${m[1]}` : null
    }).filter(Boolean)
    expect(routes.filter(r => !(r! in API_ACCESS))).toEqual([])
  })
})
