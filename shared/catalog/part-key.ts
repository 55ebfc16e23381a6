// A part's identity: the one normalisation of manufacturer + part number that import, validation, the
// catalogue service, the BOM and the database index (parts.key, migration 0008) all use.
//
// Rules: Unicode NFKC (full-width letters, ligatures and no-break spaces become their plain forms); every run of
// white space in the manufacturer becomes one space and the ends are trimmed ("Delta  Power " = "Delta Power");
// white space in the part number is dropped ("FF 450 R12" = "FF450R12"); letters are upper-cased one code point
// at a time (a letter whose capital is two letters, such as "ß", is kept); "\" and "|" are escaped so that the
// "|" between the two halves is never ambiguous. An ordinary key reads "DELTA POWER|FF450R12", the form BOM line
// keys always had, so keys of earlier BOM releases still match.
//
// The migration that re-keys stored parts spells the same rules in SQL (stratavolt_part_key() in
// drizzle/0008_part_key_and_money.sql); tests/api/part-key.test.ts checks the two agree on awkward input.

/** White space as the key sees it; the SQL function lists the very same code points. */
export const PART_KEY_SPACE = '\\t\\n\\v\\f\\r \\u0085\\u00a0\\u1680\\u2000-\\u200a\\u2028\\u2029\\u202f\\u205f\\u3000\\ufeff'
const SPACE_RUN = new RegExp(`[${PART_KEY_SPACE}]+`, 'g')

function upperByCodePoint(text: string): string {
  // toUpperCase maps 'ß' to 'SS'; PostgreSQL's upper() maps one code point to one. Keep the two alike.
  let out = ''
  for (const ch of text) {
    const up = ch.toUpperCase()
    out += [...up].length === 1 ? up : ch
  }
  return out
}

const escape = (text: string) => text.replace(/[\\|]/g, '\\$&')

/** The manufacturer's half of the key. */
export function manufacturerKey(manufacturer: string): string {
  return escape(upperByCodePoint(manufacturer.normalize('NFKC').replace(SPACE_RUN, ' ').trim()))
}

/** The part number's half of the key. */
export function partNumberKey(partNumber: string): string {
  return escape(upperByCodePoint(partNumber.normalize('NFKC').replace(SPACE_RUN, '')))
}

/** "DELTA POWER|FF450R12": equal for every spelling of one part, different for different parts. */
export function partKey(manufacturer: string, partNumber: string): string {
  return `${manufacturerKey(manufacturer)}|${partNumberKey(partNumber)}`
}
