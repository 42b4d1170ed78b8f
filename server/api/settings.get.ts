// The lab's name and the policy values in force, for every signed-in role (pages show the value in force).
export default defineEventHandler(async (event) => {
  await requireUser(event)
  return await getLabSettings()
})
