// Reads the text of a PDF written by pdfkit, with no PDF package: streams are inflated with zlib, each font's
// ToUnicode map turns the hex glyph strings of the content streams back into characters. Enough for
// checking what a certificate says; not a general PDF reader.
import { inflateSync } from 'node:zlib'

interface PdfObject { dict: string, stream: Buffer | null }

function objects(pdf: Buffer): Map<number, PdfObject> {
  const text = pdf.toString('latin1')
  const out = new Map<number, PdfObject>()
  const re = /(\d+) 0 obj\s*([\s\S]*?)endobj/g
  for (let m = re.exec(text); m; m = re.exec(text)) {
    const body = m[2]!
    const s = body.indexOf('stream')
    if (s < 0) { out.set(Number(m[1]), { dict: body, stream: null }); continue }
    const dict = body.slice(0, s)
    let start = m.index + m[0].indexOf(body) + s + 'stream'.length
    if (text[start] === '\r') start++
    if (text[start] === '\n') start++
    const end = text.indexOf('endstream', start)
    let raw = pdf.subarray(start, end)
    if (/\/FlateDecode/.test(dict)) {
      // pdfkit writes the exact /Length; trailing end-of-line bytes before "endstream" are not part of the data.
      const len = /\/Length (\d+)/.exec(dict)
      if (len) raw = raw.subarray(0, Number(len[1]))
      raw = inflateSync(raw)
    }
    out.set(Number(m[1]), { dict, stream: raw })
  }
  return out
}

/** glyph code (hex) → text, from a ToUnicode CMap's bfchar and bfrange sections. */
function toUnicode(cmap: string): Map<string, string> {
  const map = new Map<string, string>()
  const hexText = (h: string) => {
    let s = ''
    for (let i = 0; i + 4 <= h.length; i += 4) s += String.fromCharCode(Number.parseInt(h.slice(i, i + 4), 16))
    return s
  }
  for (const block of cmap.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
    for (const m of block[1]!.matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>/g)) map.set(m[1]!.toLowerCase(), hexText(m[2]!))
  }
  for (const block of cmap.matchAll(/beginbfrange([\s\S]*?)endbfrange/g)) {
    for (const m of block[1]!.matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>\s*(\[[^\]]*\]|<[0-9a-fA-F]+>)/g)) {
      const lo = Number.parseInt(m[1]!, 16)
      const hi = Number.parseInt(m[2]!, 16)
      const width = m[1]!.length
      const dst = m[3]!
      if (dst.startsWith('[')) {
        const items = [...dst.matchAll(/<([0-9a-fA-F]+)>/g)].map(x => hexText(x[1]!))
        for (let c = lo; c <= hi; c++) map.set(c.toString(16).padStart(width, '0'), items[c - lo] ?? '')
      }
      else {
        const base = Number.parseInt(dst.slice(1, -1), 16)
        for (let c = lo; c <= hi; c++) map.set(c.toString(16).padStart(width, '0'), String.fromCharCode(base + c - lo))
      }
    }
  }
  return map
}

/** The text of every page, in drawing order; runs drawn on separate lines are joined by a newline. */
export function pdfText(pdf: Buffer): string {
  const objs = objects(pdf)
  const fontMaps = new Map<string, { map: Map<string, string>, bytes: number }>()
  const lines: string[] = []
  for (const [, obj] of objs) {
    const resources = /\/Font\s*<<([\s\S]*?)>>/.exec(obj.dict)
    if (!resources) continue
    for (const f of resources[1]!.matchAll(/\/(\w+)\s+(\d+) 0 R/g)) {
      const font = objs.get(Number(f[2]))
      const ref = font && /\/ToUnicode (\d+) 0 R/.exec(font.dict)
      const cmap = ref ? objs.get(Number(ref[1]))?.stream?.toString('latin1') : undefined
      if (cmap) fontMaps.set(f[1]!, { map: toUnicode(cmap), bytes: /begincodespacerange\s*<([0-9a-fA-F]+)>/.exec(cmap)?.[1]?.length ?? 4 })
      else fontMaps.set(f[1]!, { map: new Map(), bytes: 2 })
    }
  }
  for (const [, obj] of objs) {
    if (!obj.stream || !/BT[\s\S]*ET/.test(obj.stream.toString('latin1'))) continue
    const content = obj.stream.toString('latin1')
    let font = { map: new Map<string, string>(), bytes: 2 }
    let line = ''
    let lastY: string | null = null
    for (const t of content.matchAll(/\/(\w+) [\d.]+ Tf|1 0 0 -?1 [-\d.]+ ([-\d.]+) Tm|\[((?:<[0-9a-fA-F]*>|[-\d.\s])*)\] TJ|<([0-9a-fA-F]*)> Tj/g)) {
      if (t[1]) { font = fontMaps.get(t[1]) ?? font; continue }
      if (t[2] !== undefined) {
        if (lastY !== null && t[2] !== lastY && line) { lines.push(line); line = '' }
        lastY = t[2]
        continue
      }
      const hexes = t[3] !== undefined ? [...t[3].matchAll(/<([0-9a-fA-F]*)>|(-?[\d.]+)/g)] : [[`<${t[4]}>`, t[4]] as unknown as RegExpMatchArray]
      for (const h of hexes) {
        if (h[1] === undefined) {
          // A large negative kerning adjustment is a word space pdfkit folded into the positioning.
          if (Number(h[2]) < -200) line += ' '
          continue
        }
        const hex = h[1].toLowerCase()
        const step = font.map.size ? font.bytes : 2
        for (let i = 0; i < hex.length; i += step) {
          const code = hex.slice(i, i + step)
          line += font.map.get(code) ?? (font.map.size ? '' : String.fromCharCode(Number.parseInt(code, 16)))
        }
      }
    }
    if (line) lines.push(line)
  }
  return lines.join('\n')
}
