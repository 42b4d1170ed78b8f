// Runs the fleet check now (admin): the same check the scheduled job runs, with the same once-per-change rule.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const report = await runFleetCheck(event)
  return {
    checkedAt: report.checkedAt,
    vessels: report.vessels,
    transitions: report.transitions,
    mailed: report.transitions.filter(t => t.mailed).length,
  }
})
