// PDF rendering with pdfmake 0.3 on the server: fonts handed in as bytes (a Nitro server asset in
// production, node_modules in tests), no network and no file access while rendering.

import { readFile } from 'node:fs/promises'
import { createRequire } from 'node:module'
import { dirname, join } from 'node:path'
import pdfmake from 'pdfmake'
import type { Content, TDocumentDefinitions } from 'pdfmake/interfaces'

/** Roboto TTFs as bytes; Medium serves as bold. */
export interface PdfFonts {
  normal: Buffer
  bold: Buffer
  italics: Buffer
  bolditalics: Buffer
}

/** File names in pdfmake/fonts/Roboto (and in the `fonts` server asset that mirrors it). */
export const ROBOTO_FILES: Record<keyof PdfFonts, string> = {
  normal: 'Roboto-Regular.ttf',
  bold: 'Roboto-Medium.ttf',
  italics: 'Roboto-Italic.ttf',
  bolditalics: 'Roboto-MediumItalic.ttf',
}

const STYLES = Object.keys(ROBOTO_FILES) as (keyof PdfFonts)[]

function asBuffer(raw: unknown, file: string): Buffer {
  if (Buffer.isBuffer(raw)) return raw
  if (raw instanceof Uint8Array) return Buffer.from(raw)
  if (raw instanceof ArrayBuffer) return Buffer.from(raw)
  throw new Error(`font file ${file} is missing from the fonts asset (got ${raw === null || raw === undefined ? 'nothing' : typeof raw})`)
}

/**
 * Fonts from any byte source, e.g. in a Nitro route:
 * `loadFonts(name => useStorage('assets:fonts').getItemRaw(name))`.
 */
export async function loadFonts(read: (fileName: string) => Promise<unknown>): Promise<PdfFonts> {
  const entries = await Promise.all(STYLES.map(async style => [style, asBuffer(await read(ROBOTO_FILES[style]), ROBOTO_FILES[style])] as const))
  return Object.fromEntries(entries) as unknown as PdfFonts
}

/** Fonts straight from node_modules/pdfmake/fonts/Roboto (tests, benchmark, scripts; not the built server). */
export async function loadFontsFromNodeModules(): Promise<PdfFonts> {
  let dir: string
  try {
    dir = join(dirname(createRequire(import.meta.url).resolve('pdfmake/package.json')), 'fonts', 'Roboto')
  }
  catch {
    dir = join(process.cwd(), 'node_modules', 'pdfmake', 'fonts', 'Roboto')
  }
  return loadFonts(name => readFile(join(dir, name)))
}

interface VirtualFs { writeFileSync(name: string, content: Buffer): void }

/** Folder name of the fonts inside pdfmake's in-memory file system. */
const VFS_DIR = 'stratavolt-fonts'

/** Renders a document definition; the default font family is 'Roboto'. */
export async function renderPdf(doc: TDocumentDefinitions, fonts: PdfFonts): Promise<Buffer> {
  for (const style of STYLES) {
    if (!Buffer.isBuffer(fonts?.[style]) || fonts[style].length === 0) throw new Error(`fonts.${style}: the ${ROBOTO_FILES[style]} bytes are missing`)
  }
  // pdfmake 0.3 is one shared instance; fonts go into its in-memory file system, so nothing is read from disk.
  const vfs = (pdfmake as unknown as { virtualfs: VirtualFs }).virtualfs
  const descriptor: Record<string, string> = {}
  for (const style of STYLES) {
    const name = `${VFS_DIR}/${ROBOTO_FILES[style]}`
    vfs.writeFileSync(name, fonts[style])
    descriptor[style] = name
  }
  pdfmake.setFonts({ Roboto: descriptor as unknown as { normal: string, bold: string, italics: string, bolditalics: string } })
  // No downloads and no local files: everything the document needs is in the definition.
  pdfmake.setUrlAccessPolicy(() => false)
  pdfmake.setLocalAccessPolicy(() => false)
  return pdfmake.createPdf(doc).getBuffer()
}

/**
 * An SVG made safe to embed: no scripts, no foreign objects, no images and no links to anything
 * outside the drawing itself (the renderer must never fetch or read a file).
 */
export function selfContainedSvg(svg: string): string {
  return svg
    .replace(/<script\b[\s\S]*?<\/script\s*>/gi, '')
    .replace(/<foreignObject\b[\s\S]*?<\/foreignObject\s*>/gi, '')
    .replace(/<image\b[^>]*\/>/gi, '')
    .replace(/<image\b[\s\S]*?<\/image\s*>/gi, '')
    .replace(/\s(?:xlink:)?href\s*=\s*("(?!#)[^"]*"|'(?!#)[^']*')/gi, '')
}

// Layout shared by the printed exports.

const GREY = '#e5e7eb'

/** Thin horizontal rules, header shaded: readable when printed in black and white. */
export const TABLE_LAYOUT = {
  hLineWidth: (i: number, node: { table: { body: unknown[], headerRows?: number } }) => (i === 0 || i === (node.table.headerRows ?? 0) || i === node.table.body.length ? 0.8 : 0.3),
  vLineWidth: () => 0,
  hLineColor: () => '#6b7280',
  fillColor: (row: number, node: { table: { headerRows?: number } }) => (row < (node.table.headerRows ?? 0) ? GREY : null),
  paddingLeft: () => 3,
  paddingRight: () => 3,
  paddingTop: () => 2,
  paddingBottom: () => 2,
}

/** The safety note in a ruled box (also used by the design report). */
export function safetyBox(note: string): Content {
  return {
    table: { widths: ['*'], body: [[{ stack: [{ text: 'Safety note', bold: true, margin: [0, 0, 0, 2] }, { text: note }] }]] },
    layout: { hLineWidth: () => 0.8, vLineWidth: () => 0.8, hLineColor: () => '#92400e', vLineColor: () => '#92400e', paddingLeft: () => 6, paddingRight: () => 6, paddingTop: () => 4, paddingBottom: () => 4 },
    margin: [0, 10, 0, 0],
    unbreakable: true,
  }
}

/** Page header and footer shared by the printed exports: who, what, which revision, page X of Y. */
export function pageFrame(left: string, centre: string, right: string, footerLeft: string): Pick<TDocumentDefinitions, 'header' | 'footer'> {
  return {
    header: () => ({
      margin: [30, 18, 30, 0],
      columns: [
        { text: left, bold: true, width: '*' },
        { text: centre, alignment: 'center', width: 'auto' },
        { text: right, alignment: 'right', width: '*' },
      ],
      fontSize: 8,
    }),
    footer: (currentPage: number, pageCount: number) => ({
      margin: [30, 8, 30, 0],
      columns: [
        { text: footerLeft, width: '*' },
        { text: `page ${currentPage} of ${pageCount}`, alignment: 'right', width: 'auto' },
      ],
      fontSize: 7,
      color: '#374151',
    }),
  }
}

export const PDF_STYLES = {
  h1: { fontSize: 14, bold: true, margin: [0, 0, 0, 4] },
  h2: { fontSize: 10.5, bold: true, margin: [0, 12, 0, 4] },
  small: { fontSize: 7 },
} as const

/** A section heading; with `keepHeadingsWithContent` it never ends a page on its own. */
export function heading(text: string): Content {
  return { text, style: 'h2', headlineLevel: 1 }
}

/** pdfmake page-break hook: move a heading to the next page when nothing follows it on this one. */
export function keepHeadingsWithContent(node: { headlineLevel?: number }, queries: { getFollowingNodesOnPage(): unknown[] }): boolean {
  return node.headlineLevel === 1 && queries.getFollowingNodesOnPage().length === 0
}
