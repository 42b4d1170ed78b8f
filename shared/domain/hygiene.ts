// Input hygiene for chemical text: formulas and structures are plain ASCII after Unicode NFKC normalisation.

export interface TextProblem {
  /** The offending character as typed (after normalisation). */
  character: string
  /** 1-based position in the normalised text. */
  position: number
  message: string
}

/**
 * NFKC-normalises a formula or SMILES (Unicode Standard Annex #15): full-width letters and subscript digits
 * become their ASCII forms, so "C₇H₆O₂" reads as "C7H6O2". Look-alike letters of other scripts are not mapped.
 */
export function normaliseChemicalText(text: string): string {
  return text.normalize('NFKC')
}

function codePoint(ch: string): string {
  return `U+${(ch.codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, '0')}`
}

/**
 * The first character outside printable ASCII in the NFKC form of `text`, with its 1-based position; undefined
 * when the text is clean. A look-alike letter (Cyrillic С for Latin C) is refused here, never silently dropped.
 */
export function chemicalTextProblem(text: string, what: 'formula' | 'structure'): TextProblem | undefined {
  // Surrounding white space (a pasted line end) is trimmed, as the field is; positions count in the trimmed text.
  const normal = normaliseChemicalText(text).trim()
  let position = 0
  for (const ch of normal) {
    position++
    const code = ch.codePointAt(0) ?? 0
    if (code < 0x20 || code > 0x7e) {
      const shown = code < 0x20 ? codePoint(ch) : `"${ch}" (${codePoint(ch)})`
      return {
        character: ch,
        position,
        message: `character ${shown} at position ${position} is not plain ASCII: type the ${what} in Latin letters, digits and ASCII symbols only`,
      }
    }
  }
  return undefined
}
