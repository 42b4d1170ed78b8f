import bwipjs from 'bwip-js/node'

// The sample's lab code as a Code 128 barcode (ISO/IEC 15417), drawn on the server so the label page stays light.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = parseParams(event, idParam)
  const sample = await findSampleOr404(useDb(), id)
  const svg = bwipjs.toSVG({ bcid: 'code128', text: sample.labCode, scale: 2, height: 10, paddingwidth: 6, paddingheight: 2, includetext: false })
  setResponseHeaders(event, { 'Content-Type': 'image/svg+xml; charset=utf-8', 'Cache-Control': 'private, max-age=86400', 'X-Content-Type-Options': 'nosniff' })
  return svg
})
