// The one place that turns an API error into words for the page: a message and, per field, what to fix.
export interface ApiProblem { message: string, fields: Record<string, string>, status: number }

export function toProblem(err: unknown): ApiProblem {
  const e = err as { statusCode?: number, status?: number, data?: { message?: string, data?: { fields?: { path: string, message: string }[] } }, message?: string }
  const status = e?.statusCode ?? e?.status ?? 0
  const fields: Record<string, string> = {}
  for (const f of e?.data?.data?.fields ?? []) fields[f.path] = f.message
  let message = e?.data?.message ?? e?.message ?? 'Something went wrong.'
  if (status === 0) message = 'The server could not be reached. Check the connection and try again.'
  if (status === 503) message = 'The database is not reachable right now; nothing was saved. Try again in a moment.'
  return { message, fields, status }
}

export function useApiError() {
  const problem = ref<ApiProblem | null>(null)
  function capture(err: unknown) {
    problem.value = toProblem(err)
    if (problem.value.status === 401) navigateTo('/login')
    return problem.value
  }
  function clear() { problem.value = null }
  const fieldError = (path: string) => problem.value?.fields[path] ?? null
  return { problem, capture, clear, fieldError }
}
