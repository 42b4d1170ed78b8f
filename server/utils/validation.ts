import type { H3Event } from 'h3'
import type { z } from 'zod'
import { pathWords } from '#shared/field-labels'

/** A 422 that names every failing field: `data.fields = [{ path, message }]`. */
export function invalidInput(issues: readonly z.core.$ZodIssue[] | { path: string, message: string }[]): never {
  const fields = issues.map(i => ({
    path: Array.isArray(i.path) ? i.path.map(String).join('.') || '(body)' : String(i.path),
    message: i.message,
  }))
  throw createError({
    statusCode: 422,
    message: `Please correct ${fields.length === 1 ? 'this field' : 'these fields'} — ${fields.map(f => `${pathWords(f.path)}: ${f.message}`).join('; ')}`.slice(0, 2000),
    data: { fields },
  })
}

function parseWith<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const result = schema.safeParse(value)
  if (!result.success) invalidInput(result.error.issues)
  return result.data
}

/** Reads the JSON body and validates it; a body that is not JSON is a 400. */
export async function parseBody<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.output<S>> {
  const type = getRequestHeader(event, 'content-type') ?? ''
  if (!type.includes('application/json')) {
    throw createError({ statusCode: 415, message: 'Send the body as JSON (Content-Type: application/json).' })
  }
  let body: unknown
  try {
    body = await readBody(event)
  }
  catch {
    throw createError({ statusCode: 400, message: 'The request body is not valid JSON.' })
  }
  return parseWith(schema, body)
}

export function parseQuery<S extends z.ZodType>(event: H3Event, schema: S): z.output<S> {
  return parseWith(schema, getQuery(event))
}

export function parseParams<S extends z.ZodType>(event: H3Event, schema: S): z.output<S> {
  return parseWith(schema, getRouterParams(event, { decode: true }))
}
