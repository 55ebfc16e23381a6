// Text written into spreadsheet cells must never be read as a formula (a part description such as
// "=HYPERLINK(…)" from an uploaded catalogue would otherwise run when purchasing opens the file).
// Rule from the OWASP "CSV Injection" guidance: a cell that begins with =, +, -, @, tab (0x09) or
// carriage return (0x0D) gets a leading single quote, so every spreadsheet shows it as plain text.

/** Characters that make a spreadsheet read a cell as a formula (OWASP list plus the full-width forms some spreadsheets also accept). */
const TRIGGERS = new Set(['=', '+', '-', '@', '\t', '\r', '＝', '＋', '－', '＠'])

/**
 * The text, prefixed with "'" when it could start a formula. Leading blanks and line feeds are
 * looked through because some importers trim them before deciding.
 */
export function neutraliseFormula(text: string): string {
  const first = text.replace(/^[ \n\u00a0]+/, '').charAt(0)
  if (TRIGGERS.has(text.charAt(0)) || TRIGGERS.has(first)) return `'${text}`
  return text
}
