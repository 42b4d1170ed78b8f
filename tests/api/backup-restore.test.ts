// `npm run backup` / `npm run restore`: a backup of the test database and of an uploads folder, restored
// into a new, empty database and another folder, holds every table's rows and every file.
import { spawnSync } from 'node:child_process'
import { mkdtempSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import pg from 'pg'
import { afterAll, describe, expect, it } from 'vitest'
import { as, call, unique } from '../support/api'
import { testDb } from '../support/db'

const root = fileURLToPath(new URL('../..', import.meta.url))
const RESTORE_DB = 'emberline_restore_check'
const scratch = mkdtempSync(join(tmpdir(), 'emberline-backup-test-'))
afterAll(() => rmSync(scratch, { recursive: true, force: true }))

function run(script: string, args: string[], env: Record<string, string> = {}) {
  const res = spawnSync('bash', [script, ...args], { cwd: root, env: { ...process.env, ...env }, encoding: 'utf8', timeout: 120_000, input: '' })
  return { status: res.status, out: `${res.stdout}${res.stderr}` }
}

/** Row counts of every table in every schema the app owns (public, drizzle's migrations, pg-boss). */
async function tableCounts(db: pg.Pool | pg.Client): Promise<Record<string, number>> {
  const { rows } = await db.query<{ t: string }>(`select format('%I.%I', schemaname, tablename) as t from pg_tables where schemaname not in ('pg_catalog', 'information_schema') order by 1`)
  const counts: Record<string, number> = {}
  for (const { t } of rows) counts[t] = Number((await db.query(`select count(*)::int as n from ${t}`)).rows[0].n)
  return counts
}

describe('backup and restore', () => {
  it('restores every record and every uploaded file into an empty database', async () => {
    // A few records made through the API, so that the backup holds this run's own data.
    const vessel = await call('POST', '/api/vessels', { cookie: await as('admin'), body: { name: unique('Bk'), serialNumber: unique('SN'), class: 'standard', ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300 } })
    expect(vessel.status).toBe(201)
    const plan = await call('POST', '/api/plans', { cookie: await as('analyst'), body: { name: unique('Backup plan'), vesselId: vessel.body.id, fillPressureMPa: 3.0 } })
    expect(plan.status).toBe(201)
    const uploads = join(scratch, 'uploads')
    mkdirSync(join(uploads, 'vessel', vessel.body.id), { recursive: true })
    // The fs storage keeps key vessel:<id>:<name> as vessel/<id>/<name>.
    const photo = Buffer.concat([Buffer.from([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]), Buffer.from('backup test image')])
    writeFileSync(join(uploads, 'vessel', vessel.body.id, 'face.png'), photo)

    const out = join(scratch, 'backups')
    const before = await tableCounts(testDb())
    const backup = run('scripts/backup.sh', [], { EMBERLINE_UPLOAD_DIR: uploads, EMBERLINE_BACKUP_DIR: out })
    const after = await tableCounts(testDb())
    expect(backup.status, backup.out).toBe(0)
    const files = readdirSync(out)
    expect(files).toHaveLength(1)
    expect(files[0]).toMatch(/^emberline-\d{8}T\d{6}Z\.tar$/)
    expect(backup.out).toContain(join(out, files[0]!))
    expect(backup.out).not.toMatch(new RegExp(new URL(process.env.NUXT_DATABASE_URL!).password || 'no password given'))

    // A new, empty database in the project's cluster.
    const made = run('scripts/pg.sh', ['reset-db', RESTORE_DB])
    expect(made.status, made.out).toBe(0)
    const target = new URL(process.env.NUXT_DATABASE_URL!)
    target.pathname = `/${RESTORE_DB}`
    const restored = join(scratch, 'restored-uploads')

    // Without a terminal and without --yes it refuses and changes nothing.
    const refused = run('scripts/restore.sh', [join(out, files[0]!), '--into', target.toString()], { EMBERLINE_UPLOAD_DIR: restored })
    expect(refused.status).toBe(1)
    expect(refused.out).toMatch(/without confirmation/)
    const db = new pg.Client({ connectionString: target.toString() })
    await db.connect()
    try {
      expect(await tableCounts(db)).toEqual({})

      const restore = run('scripts/restore.sh', [join(out, files[0]!), '--into', target.toString(), '--yes'], { EMBERLINE_UPLOAD_DIR: restored })
      expect(restore.status, restore.out).toBe(0)
      const got = await tableCounts(db)
      expect(Object.keys(got)).toEqual(Object.keys(after))
      // Each table has the rows the dump saw. A table that background work (mail, reminders) changed while the dump
      // ran may hold any count between the two looks; every other must match exactly.
      for (const [table, n] of Object.entries(got)) {
        if (before[table] === after[table]) expect(n, table).toBe(after[table])
        else expect(n, table).toBeGreaterThanOrEqual(Math.min(before[table]!, after[table]!))
      }
      expect(got['public.vessels']).toBeGreaterThan(0)
      expect(got['public.audit_log']).toBeGreaterThan(0)
      const { rows } = await db.query('select v.name, p.name as plan from vessels v join plans p on p.vessel_id = v.id where v.id = $1', [vessel.body.id])
      expect(rows).toEqual([{ name: vessel.body.name, plan: plan.body.name }])
      // The audit trail is still append-only in the restored database: its triggers came back after the rows.
      await expect(db.query('delete from audit_log')).rejects.toThrow(/append-only/)
      await expect(db.query('truncate audit_log')).rejects.toThrow(/append-only/)
      expect(readFileSync(join(restored, 'vessel', vessel.body.id, 'face.png'))).toEqual(photo)

      // Restoring again over a database that now has the tables replaces them, rather than failing or doubling rows.
      const again = run('scripts/restore.sh', [join(out, files[0]!), '--into', target.toString(), '--yes'], { EMBERLINE_UPLOAD_DIR: restored })
      expect(again.status, again.out).toBe(0)
      expect(await tableCounts(db)).toEqual(got)
    }
    finally {
      await db.end()
    }
  })

  it('refuses a file that is not a backup, or one whose contents were damaged', () => {
    const target = new URL(process.env.NUXT_DATABASE_URL!)
    target.pathname = `/${RESTORE_DB}`
    const junk = join(scratch, 'junk.tar')
    writeFileSync(junk, 'not a tar file')
    const res = run('scripts/restore.sh', [junk, '--into', target.toString(), '--yes'])
    expect(res.status).toBe(1)
    expect(res.out).toMatch(/is not an Emberline backup/)
    // A backup whose dump no longer matches the checksum its manifest recorded.
    const parts = join(scratch, 'damaged')
    mkdirSync(parts, { recursive: true })
    writeFileSync(join(parts, 'MANIFEST'), `database_dump_sha256=${'0'.repeat(64)}\nuploads_tar_sha256=${'0'.repeat(64)}\n`)
    writeFileSync(join(parts, 'database.dump'), 'PGDMP damaged')
    writeFileSync(join(parts, 'uploads.tar'), '')
    const damaged = join(scratch, 'damaged.tar')
    expect(spawnSync('tar', ['-C', parts, '-cf', damaged, 'MANIFEST', 'database.dump', 'uploads.tar']).status).toBe(0)
    const bad = run('scripts/restore.sh', [damaged, '--into', target.toString(), '--yes'])
    expect(bad.status).toBe(1)
    expect(bad.out).toMatch(/is damaged: database.dump does not match its checksum/)
    // No file named: the usage line and exit code 2.
    const none = run('scripts/restore.sh', [])
    expect(none.status).toBe(2)
    expect(none.out).toMatch(/usage: npm run restore -- FILE/)
  })
})
