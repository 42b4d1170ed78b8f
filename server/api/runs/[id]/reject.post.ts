// Reject an exception: run → rejected.
export default runDecisionHandler('reject')
