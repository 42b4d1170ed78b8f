// Certificate of analysis: the content snapshot stored with the report number, and its PDF.
// The items follow ISO/IEC 17025:2017 §7.8.2.1: title, laboratory, unique identification and page x of y, sample,
// method, dates of test and issue, results with units and uncertainty, the person authorising, a clear end.
import { existsSync, readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { join } from 'node:path'
import PDFDocument from 'pdfkit'
import { receiptFields } from './certificate-receipt'
import { formatSpecificEnergy, fromJPerG, type SpecificEnergyUnit } from '../../shared/domain/specific-energy'

export interface CertificateDetermination {
  resultId: string
  revision: number
  firedAt: string | null
  vesselName: string
  sampleMassG: number
  temperatureRiseK: number
  grossAdJPerG: number
  expandedUncertaintyJPerG: number | null
  signedBy: string
  signedAt: string
}

export interface CertificateRow {
  quantity: string
  basis: string
  valueJPerG: number
  expandedUncertaintyJPerG: number | null
}

export interface CertificateContent {
  labName: string
  sampleCode: string
  sampleDescription: string | null
  method: string[]
  unit: SpecificEnergyUnit
  rows: CertificateRow[]
  duplicate: { status: string, message: string, n: number, rangeJPerG: number | null, limitJPerG: number | null, reportedAs: string }
  determinations: CertificateDetermination[]
  analysis: { label: string, value: string }[]
  testedFrom: string | null
  testedTo: string | null
  signers: { name: string, signedAt: string }[]
  issuedBy: string
  replaces: number | null
  statements: string[]
  /** The client and the item as received (added when the certificate is issued; see certificate-items.ts). */
  receipt?: import('./certificate-items').CertificateReceipt
  /** Shown prominently under the sample: provisional values, a single determination. */
  notices?: string[]
  /** The acid correction convention used, in words. */
  acidConvention?: string | null
}

// Static (non-variable) WOFF files of Inter: pdfkit embeds and subsets them as they are, with a real bold.
const FONT_FILES = { regular: '@fontsource/inter/files/inter-latin-400-normal.woff', bold: '@fontsource/inter/files/inter-latin-700-normal.woff' } as const

/** One shipped Inter weight (latin subset), found from the server bundle or the project root; null when absent. */
function interFont(file: string): Buffer | null {
  const candidates: string[] = []
  try {
    candidates.push(createRequire(import.meta.url).resolve(file))
  }
  catch { /* not resolvable from the bundle */ }
  candidates.push(join(process.cwd(), 'node_modules', file))
  for (const f of candidates) if (existsSync(f)) return readFileSync(f)
  return null
}

const INK = '#1f1a17'
const SOFT = '#4a423c'
const MUTE = '#6b625a'
const EMBER = '#b4410f'
const LINE = '#e2d9cb'

const fmt = (v: number, d: number) => v.toLocaleString('en-GB', { minimumFractionDigits: d, maximumFractionDigits: d })
const day = (iso: string | null) => (iso ? iso.slice(0, 10) : '—')

/** Renders the certificate; `compress: false` keeps the text streams readable (tests). */
export async function renderCertificatePdf(content: CertificateContent, report: { reportNumber: number, issuedAt: Date }, options: { compress?: boolean } = {}): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4', margins: { top: 56, bottom: 64, left: 56, right: 56 }, bufferPages: true, compress: options.compress ?? true,
    info: { Title: `Certificate of analysis No. ${report.reportNumber} — ${content.sampleCode}`, Author: content.labName, Subject: 'Calorific value', Creator: 'Emberline' },
  })
  const chunks: Buffer[] = []
  doc.on('data', (c: Buffer) => chunks.push(c))
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)))
    doc.on('error', reject)
  })

  // Inter (regular and bold) when the files are there; otherwise the standard Helvetica (text stays correct).
  let regular = 'Helvetica'
  let bold = 'Helvetica-Bold'
  const interRegular = interFont(FONT_FILES.regular)
  const interBold = interFont(FONT_FILES.bold)
  if (interRegular && interBold) {
    try {
      doc.registerFont('Inter', interRegular)
      doc.registerFont('Inter-Bold', interBold)
      regular = 'Inter'
      bold = 'Inter-Bold'
    }
    catch (err) {
      console.warn('[certificate] Inter could not be embedded, using Helvetica:', (err as Error).message)
    }
  }
  doc.font(regular)
  const strong = (text: string, x: number | undefined, y: number | undefined, opts: PDFKit.Mixins.TextOptions = {}) => {
    doc.fillColor(INK).font(bold).text(text, x, y, opts)
    doc.font(regular)
  }
  const left = doc.page.margins.left
  const width = doc.page.width - left - doc.page.margins.right
  // Start a new page when the next block would not fit above the bottom margin.
  const room = (y: number, needed: number) => {
    if (y + needed <= doc.page.height - doc.page.margins.bottom) return y
    doc.addPage()
    return doc.page.margins.top
  }
  const unit = content.unit
  const showBoth = unit !== 'J/g'

  // Header.
  doc.fillColor(EMBER).rect(left, 40, width, 3).fill()
  doc.fillColor(INK).fontSize(16)
  strong(content.labName, left, 56)
  doc.fontSize(11).fillColor(SOFT).text('Certificate of analysis — calorific value', left, 78)
  doc.fontSize(9).fillColor(INK).text(`Report No. ${report.reportNumber}`, left, 58, { width, align: 'right' })
  doc.fillColor(SOFT).text(`Issued ${report.issuedAt.toISOString().slice(0, 10)}`, left, 71, { width, align: 'right' })
  doc.moveTo(left, 100).lineTo(left + width, 100).strokeColor(LINE).lineWidth(0.75).stroke()

  // Sample and method.
  let y = 112
  const field = (label: string, value: string) => {
    doc.fontSize(8).fillColor(MUTE).text(label, left, y, { width: 130 })
    doc.fontSize(9.5).fillColor(INK).text(value, left + 135, y, { width: width - 135 })
    y = doc.y + 5
  }
  field('Sample', content.sampleCode)
  if (content.receipt) receiptFields(content.receipt, field)
  if (content.sampleDescription) field('Description', content.sampleDescription)
  field('Determinations', `${content.determinations.length}, tested ${day(content.testedFrom)}${content.testedTo && day(content.testedTo) !== day(content.testedFrom) ? ` to ${day(content.testedTo)}` : ''}`)
  field('Method', content.method.join(' '))
  if (content.replaces) field('Amendment', `This report replaces report No. ${content.replaces}.`)

  // What a reader must not miss: provisional values, a single determination.
  const notices = content.notices ?? []
  if (notices.length) {
    y += 4
    doc.fontSize(9.5)
    const text = notices.join('\n')
    const h = doc.heightOfString(text, { width: width - 16 }) + 12
    doc.rect(left, y, width, h).fill('#fdecd8')
    doc.rect(left, y, 3, h).fill(EMBER)
    doc.fillColor(INK).font(bold).text(text, left + 10, y + 6, { width: width - 16 })
    doc.font(regular)
    y += h + 4
  }

  // Results table.
  y += 6
  doc.fontSize(11).fillColor(INK)
  strong('Results', left, y)
  y = doc.y + 4
  const cols = showBoth
    ? [{ t: 'Quantity', w: 0.36 }, { t: 'Basis', w: 0.17 }, { t: `Value (${unit})`, w: 0.16, r: true }, { t: 'Value (J/g)', w: 0.15, r: true }, { t: 'U, k = 2 (J/g)', w: 0.16, r: true }]
    : [{ t: 'Quantity', w: 0.44 }, { t: 'Basis', w: 0.2 }, { t: 'Value (J/g)', w: 0.18, r: true }, { t: 'U, k = 2 (J/g)', w: 0.18, r: true }]
  const row = (cells: string[], opts: { head?: boolean } = {}) => {
    let x = left
    doc.fontSize(opts.head ? 7.5 : 9)
    // A long label wraps: the row grows to its tallest cell.
    const h = Math.max(16, ...cells.map((c, i) => doc.heightOfString(c, { width: cols[i]!.w * width - 6 }) + 6))
    y = room(y, h)
    if (opts.head) doc.rect(left, y - 3, width, h).fill('#f1ebe1')
    doc.fillColor(opts.head ? SOFT : INK)
    cells.forEach((c, i) => {
      const col = cols[i]!
      doc.text(c, x + 3, y, { width: col.w * width - 6, align: col.r ? 'right' : 'left' })
      x += col.w * width
    })
    y += h
    doc.moveTo(left, y - 3).lineTo(left + width, y - 3).strokeColor(LINE).lineWidth(0.5).stroke()
  }
  row(cols.map(c => c.t), { head: true })
  for (const r of content.rows) {
    const value = formatSpecificEnergy(r.valueJPerG, unit).replace(` ${unit}`, '')
    const u = r.expandedUncertaintyJPerG === null ? '—' : `± ${fmt(r.expandedUncertaintyJPerG, 0)}`
    row(showBoth ? [r.quantity, r.basis, value, fmt(r.valueJPerG, 0), u] : [r.quantity, r.basis, value, u])
  }
  if (showBoth) {
    const factor = fmt(fromJPerG(1, unit) === 0 ? 0 : 1 / fromJPerG(1, unit), 4)
    doc.fontSize(7.5).fillColor(MUTE).text(`1 ${unit} = ${factor} J/g (NIST SP 811, Appendix B).`, left, y + 1)
    y = doc.y + 2
  }

  // Duplicate agreement.
  y += 8
  doc.fontSize(11).fillColor(INK)
  strong('Agreement of determinations', left, y)
  doc.fontSize(9).fillColor(INK).text(`${content.duplicate.message} Reported value: ${content.duplicate.reportedAs}.`, left, doc.y + 3, { width })
  y = doc.y + 8

  // Determinations.
  doc.fontSize(11).fillColor(INK)
  strong('Determinations', left, y)
  y = doc.y + 4
  doc.fontSize(8.5).fillColor(INK)
  for (const d of content.determinations) {
    const u = d.expandedUncertaintyJPerG === null ? '' : ` ± ${fmt(d.expandedUncertaintyJPerG, 0)} J/g (k = 2)`
    y = room(y, 26)
    doc.text(
      `${day(d.firedAt)} · vessel ${d.vesselName} · sample ${fmt(d.sampleMassG, 4)} g · temperature rise ${fmt(d.temperatureRiseK, 4)} K · gross as determined ${fmt(d.grossAdJPerG, 0)} J/g${u} · revision ${d.revision}, signed off by ${d.signedBy} on ${day(d.signedAt)}`,
      left, y, { width },
    )
    y = doc.y + 3
  }
  if (content.analysis.length) {
    y += 4
    doc.fontSize(8.5).fillColor(SOFT).text(`Analysis figures used: ${content.analysis.map(a => `${a.label} ${a.value}`).join('; ')}.`, left, y, { width })
    y = doc.y + 6
  }

  // Statements and authorisation, kept together with the end of the report.
  y = room(y + 4, 150)
  doc.fontSize(8.5).fillColor(SOFT)
  for (const s of content.statements) {
    doc.text(`• ${s}`, left, y, { width })
    y = doc.y + 2
  }
  y += 10
  doc.fontSize(9).fillColor(INK)
  doc.text(`Results signed off (electronic signature): ${content.signers.map(s => `${s.name}, ${day(s.signedAt)}`).join('; ')}`, left, y, { width })
  doc.text(`Report issued by: ${content.issuedBy}, ${report.issuedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC`, left, doc.y + 2, { width })
  y = doc.y + 18
  doc.moveTo(left, y).lineTo(left + width, y).strokeColor(INK).lineWidth(0.75).stroke()
  doc.fontSize(10).fillColor(INK)
  strong('End of report', left, y + 8, { width, align: 'center' })

  // Page x of y on every page.
  const range = doc.bufferedPageRange()
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i)
    // Below the bottom margin pdfkit would start a new page: lift the margin while the footer is written.
    doc.page.margins.bottom = 0
    const bottom = doc.page.height - 40
    doc.fontSize(7.5).fillColor(MUTE)
      .text(`${content.labName} · Report No. ${report.reportNumber} · ${content.sampleCode}`, left, bottom, { width: width / 2, lineBreak: false })
      .text(`Page ${i - range.start + 1} of ${range.count}`, left + width / 2, bottom, { width: width / 2, align: 'right', lineBreak: false })
  }
  doc.end()
  return done
}
