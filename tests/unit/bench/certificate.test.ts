import { describe, expect, it } from 'vitest'
import { renderCertificatePdf } from '../../../server/utils/certificate'
import type { CertificateContent } from '../../../server/utils/certificate'
import { pdfText } from './pdf-text'

// The certificate PDF and the test reader of its text. Content items follow ISO/IEC 17025:2017 §7.8.2.1 (title,
// laboratory, unique identification, page x of y, sample, method, dates, results with units, authorisation, end).
const content = (over: Partial<CertificateContent> = {}): CertificateContent => ({
  labName: 'Kestrel Ridge Fuels Laboratory',
  sampleCode: 'KRC-2611-A',
  sampleDescription: 'Client coal KRC-2611 (bituminous blend)',
  method: ['Gross calorific value at constant volume (ISO 1928; ASTM D5865).'],
  unit: 'MJ/kg',
  rows: [
    { quantity: 'Gross calorific value at constant volume', basis: 'as determined', valueJPerG: 27_909.5, expandedUncertaintyJPerG: 34 },
    { quantity: 'Net calorific value at constant pressure', basis: 'as received', valueJPerG: 25_012, expandedUncertaintyJPerG: null },
  ],
  duplicate: { status: 'accepted', message: 'The two results differ by 51 J/g, within 120 J/g (r); the mean is reported.', n: 2, rangeJPerG: 51, limitJPerG: 120, reportedAs: 'the mean of 2 determinations' },
  determinations: [
    { resultId: 'a', revision: 1, firedAt: '2026-11-28T09:00:00.000Z', vesselName: 'KR-1 Aster', sampleMassG: 0.9512, temperatureRiseK: 2.6602, grossAdJPerG: 27_884, expandedUncertaintyJPerG: 34, signedBy: 'Helena Ruiz', signedAt: '2026-11-29T10:00:00.000Z' },
  ],
  analysis: [{ label: 'moisture of the analysis sample', value: '1.8 %' }],
  testedFrom: '2026-11-28T09:00:00.000Z',
  testedTo: '2026-11-28T10:00:00.000Z',
  signers: [{ name: 'Helena Ruiz', signedAt: '2026-11-29T10:00:00.000Z' }],
  issuedBy: 'Helena Ruiz',
  replaces: 1004,
  statements: ['The results relate only to the sample as tested.'],
  ...over,
})

describe('certificate of analysis PDF', () => {
  it('embeds the shipped Inter font and says every required item, readable compressed or not', async () => {
    for (const compress of [true, false]) {
      const pdf = await renderCertificatePdf(content(), { reportNumber: 1007, issuedAt: new Date('2026-11-30T08:15:00Z') }, { compress })
      expect(pdf.subarray(0, 5).toString()).toBe('%PDF-')
      expect(pdf.toString('latin1')).toMatch(/\/BaseFont \/[A-Z]{6}\+Inter/)
      const text = pdfText(pdf)
      for (const s of [
        'Kestrel Ridge Fuels Laboratory', 'Certificate of analysis — calorific value', 'Report No. 1007', 'Issued 2026-11-30', 'KRC-2611-A',
        'Client coal KRC-2611 (bituminous blend)', 'This report replaces report No. 1004.', 'Value (MJ/kg)', 'Value (J/g)', '27.910', '27,910', '± 34',
        'within 120 J/g (r); the mean is reported.', 'Helena Ruiz', 'End of report', 'Page 1 of 1', '1 MJ/kg = 1,000.0000 J/g (NIST SP 811, Appendix B).',
      ]) expect(text, s).toContain(s)
    }
  })

  it('embeds a real bold weight (static Inter 700), no synthetic stroking, and shows the notices prominently', async () => {
    const pdf = await renderCertificatePdf(content({ notices: ['SINGLE DETERMINATION: one determination without a duplicate.', 'PROVISIONAL: a typical value was used.'] }), { reportNumber: 1009, issuedAt: new Date('2026-11-30T08:15:00Z') }, { compress: false })
    const raw = pdf.toString('latin1')
    expect(raw).toMatch(/\/BaseFont \/[A-Z]{6}\+Inter-Regular/)
    expect(raw).toMatch(/\/BaseFont \/[A-Z]{6}\+Inter-Bold/)
    // Fill-and-stroke text rendering (mode 2) was the old fake bold.
    expect(raw).not.toMatch(/\b2 Tr\b/)
    const text = pdfText(pdf)
    expect(text).toContain('SINGLE DETERMINATION')
    expect(text).toContain('PROVISIONAL')
  })

  it('numbers every page when the determinations run over one page', async () => {
    const many = Array.from({ length: 60 }, (_, i) => ({ ...content().determinations[0]!, resultId: String(i) }))
    const text = pdfText(await renderCertificatePdf(content({ determinations: many }), { reportNumber: 1008, issuedAt: new Date() }))
    const pages = Number(/Page 1 of (\d+)/.exec(text)?.[1])
    expect(pages).toBeGreaterThanOrEqual(2)
    for (let i = 2; i <= pages; i++) expect(text).toContain(`Page ${i} of ${pages}`)
    expect(text.trim().split('\n').filter(l => l.includes('End of report'))).toHaveLength(1)
  })
})
