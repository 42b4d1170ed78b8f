// Factories for clients and received samples, through the API as the lab would do it.
import { expect } from 'vitest'
import { as, call, unique } from './api'

export async function newClient(over: Record<string, unknown> = {}) {
  const res = await call('POST', '/api/clients', { cookie: await as('supervisor'), body: { name: unique('Client'), contactName: 'R. Ashdown', contactEmail: 'lab@client.test', ...over } })
  expect(res.status).toBe(201)
  return res.body as { id: string, name: string }
}

export async function receive(clientId: string, over: Record<string, unknown> = {}, role: 'analyst' | 'supervisor' = 'analyst') {
  const res = await call('POST', '/api/samples', {
    cookie: await as(role),
    body: { clientId, clientReference: unique('REF'), description: 'Sealed jar of ground coal, about 200 g', receivedAt: new Date(Date.now() - 3_600_000).toISOString(), condition: 'sealed, dry', receivedMassG: 200, ...over },
  })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body as { id: string, labCode: string, status: string }
}
