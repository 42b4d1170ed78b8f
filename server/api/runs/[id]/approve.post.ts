// Approve an exception: run → ready; the signature stays with the run.
export default runDecisionHandler('approve')
