// Reject an exception: run → rejected.
export default defineEventHandler(event => signRun(event, 'reject'))
