// Enumerates every route file under server/api as "METHOD /api/path" with sample ids filled in.
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { fileURLToPath } from 'node:url'

const apiDir = fileURLToPath(new URL('../../server/api', import.meta.url))
const SAMPLE_ID = '00000000-0000-4000-8000-000000000000'

export interface RouteFile { file: string, method: string, path: string, key: string }

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = join(dir, name)
    return statSync(full).isDirectory() ? walk(full) : [full]
  })
}

export function apiRoutes(): RouteFile[] {
  return walk(apiDir).filter(f => f.endsWith('.ts')).map((full) => {
    const rel = relative(apiDir, full).replace(/\\/g, '/')
    const m = rel.match(/^(.*?)(?:\.(get|post|put|patch|delete))?\.ts$/)!
    const method = (m[2] ?? 'get').toUpperCase()
    const route = `/api/${m[1]!}`.replace(/\/index$/, '').replace(/\[\.\.\.[^\]]+\]/g, 'x').replace(/\[[^\]]+\]/g, SAMPLE_ID)
    const key = `${method} /api/${m[1]!}`.replace(/\/index$/, '')
    return { file: rel, method, path: route, key }
  })
}
