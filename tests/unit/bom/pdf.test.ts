// The BOM PDF and the design report PDF, read back with pdftotext (poppler) where it is installed.

import { execFileSync } from 'node:child_process'
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { createServer } from 'node:http'
import type { AddressInfo } from 'node:net'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { bomToPdf, loadFonts, loadFontsFromNodeModules, type PdfFonts } from '../../../server/exports/bom-pdf'
import { designReportPdf, DesignReportError, type DesignReport } from '../../../server/exports/design-pdf'
import { formatMoney } from '../../../shared/utils/format'
import { selfContainedSvg } from '../../../server/exports/pdf'
import { demoSnapshot, largeSnapshot, SAFETY_NOTE } from './fixtures'

const PDFTOTEXT = '/usr/bin/pdftotext'
const hasPdfToText = existsSync(PDFTOTEXT)

/** Text of the PDF (or of pages first…last), as poppler extracts it. */
function pdfText(pdf: Buffer, first?: number, last?: number): string {
  const dir = mkdtempSync(join(tmpdir(), 'bom-pdf-'))
  try {
    const file = join(dir, 'doc.pdf')
    writeFileSync(file, pdf)
    const range = first ? ['-f', String(first), '-l', String(last ?? first)] : []
    return execFileSync(PDFTOTEXT, [...range, '-enc', 'UTF-8', file, '-'], { encoding: 'utf8' })
  }
  finally {
    rmSync(dir, { recursive: true, force: true })
  }
}

/** Page count from the PDF's page tree (no tool needed). */
function pageCount(pdf: Buffer): number {
  const counts = [...pdf.toString('latin1').matchAll(/\/Type\s*\/Pages\b[^>]*?\/Count\s+(\d+)/g)].map(m => Number(m[1]))
  return Math.max(0, ...counts)
}

/** pdftotext breaks lines where the table wraps; compare text with all whitespace collapsed. */
const flat = (text: string) => text.replace(/\s+/g, ' ')

let fonts: PdfFonts

beforeAll(async () => {
  fonts = await loadFontsFromNodeModules()
})

describe('fonts', () => {
  it('loads the four Roboto TTFs (TrueType magic 0x00010000)', () => {
    for (const style of ['normal', 'bold', 'italics', 'bolditalics'] as const) {
      expect(fonts[style].readUInt32BE(0), style).toBe(0x00010000)
    }
  })

  it('names the missing file when an asset is absent', async () => {
    await expect(loadFonts(async name => (name === 'Roboto-Medium.ttf' ? null : Buffer.from('x')))).rejects.toThrow(/Roboto-Medium\.ttf is missing/)
  })

  it('accepts the Uint8Array a built server\'s asset storage returns', async () => {
    const loaded = await loadFonts(async name => new Uint8Array(fonts[name === 'Roboto-Regular.ttf' ? 'normal' : name === 'Roboto-Medium.ttf' ? 'bold' : name === 'Roboto-Italic.ttf' ? 'italics' : 'bolditalics']))
    expect(Buffer.isBuffer(loaded.bold)).toBe(true)
    expect(loaded.bold.equals(fonts.bold)).toBe(true)
  })

  it('refuses to render without font bytes, naming the style', async () => {
    await expect(bomToPdf(demoSnapshot(), { ...fonts, italics: Buffer.alloc(0) })).rejects.toThrow(/fonts\.italics/)
  })
})

describe('bomToPdf', () => {
  it('is a PDF with the fonts embedded', async () => {
    const pdf = await bomToPdf(demoSnapshot(), fonts)
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-')
    expect(pdf.toString('latin1')).toMatch(/\/FontFile2/)
    expect(pdf.toString('latin1')).toMatch(/Roboto-Regular/)
  })

  it.skipIf(!hasPdfToText)('shows design, revisions, a part number, the total, page numbers and the safety note [skipped when /usr/bin/pdftotext is missing]', async () => {
    const snapshot = demoSnapshot()
    const text = flat(pdfText(await bomToPdf(snapshot, fonts, { [snapshot.lines[0]!.key]: { supplier: 'Brightwater Components', quotedUnitPrice: 77.25, orderReference: 'PO-2026-0142' } })))
    expect(text).toContain('Harbour crane hoist 400 kW')
    expect(text).toContain('design rev 3')
    expect(text).toContain('BOM rev 2')
    expect(text).toContain('Brennholm Drives AB')
    expect(text).toContain('Emil Sandberg')
    expect(text).toContain('released 14 Mar 2026, 09:30 UTC by')
    expect(text).toContain('ORS-IG12-150')
    // 28443.70 EUR, worked by hand in build.test.ts
    expect(formatMoney(snapshot.totals.extendedPrice, null)).toBe('28,443.70')
    expect(text).toContain('28,443.70 EUR')
    expect(text).toContain('page 1 of')
    expect(text).toContain('PO-2026-0142')
    expect(text).toContain('IEC 61800-5-1')
    expect(text).toContain(flat(SAFETY_NOTE))
    // characters outside Latin-1 survive (µ in a description, × in references)
    expect(text).toContain('500 µF')
    expect(text).toContain('machine S1 (×3)')
  })

  it.skipIf(!hasPdfToText)('writes dates, pieces and money in the requesting user\'s locale (de-DE: "14.03.2026, 09:30 UTC", "28.443,70 EUR") [skipped when /usr/bin/pdftotext is missing]', async () => {
    const snapshot = demoSnapshot()
    const text = flat(pdfText(await bomToPdf(snapshot, fonts, {}, { locale: 'de-DE' })))
    expect(text).toContain('released 14.03.2026, 09:30 UTC by')
    expect(text).toContain('28.443,70 EUR')
    expect(text).not.toContain('28,443.70')
    const us = flat(pdfText(await bomToPdf(snapshot, fonts, {}, { locale: 'en-US' })))
    expect(us).toContain('released Mar 14, 2026, 09:30 UTC by')
    expect(us).toContain('28,443.70 EUR')
  })

  it('an empty BOM still renders (header, totals row, safety note)', async () => {
    const empty = { ...demoSnapshot(), lines: [], positions: [], totals: { lines: 0, pieces: 0, extendedPrice: 0, unpricedLines: 0 } }
    const pdf = await bomToPdf(empty, fonts)
    expect(pageCount(pdf)).toBe(1)
    if (hasPdfToText) expect(flat(pdfText(pdf))).toContain('Total, 0 lines')
  })

  it.skipIf(!hasPdfToText)('a 500-line BOM spans many pages and repeats the table header on page 2 [skipped when /usr/bin/pdftotext is missing]', async () => {
    const snapshot = largeSnapshot(500)
    expect(snapshot.lines).toHaveLength(500)
    const pdf = await bomToPdf(snapshot, fonts)
    const pages = pageCount(pdf)
    expect(pages).toBeGreaterThan(5)
    const page2 = flat(pdfText(pdf, 2))
    expect(page2).toContain('Extended [EUR]')
    expect(page2).toContain('Part number')
    expect(page2).toContain(`page 2 of ${pages}`)
    expect(page2).toContain('Large test BOM')
    const last = flat(pdfText(pdf, pages))
    expect(last).toContain('IEC 61800-5-1')
    expect(flat(pdfText(pdf))).toContain(`${formatMoney(snapshot.totals.extendedPrice, null)} EUR`)
  }, 60_000)
})

/** Illustrative numbers for the layout only (not engineering results). */
function report(overrides: Partial<DesignReport> = {}): DesignReport {
  const time = Array.from({ length: 401 }, (_, i) => (i / 400) * 0.02)
  return {
    company: 'Brennholm Drives AB',
    designName: 'Harbour crane hoist 400 kW',
    revision: 3,
    author: 'Emil Sandberg',
    date: '2026-03-14T09:30:00.000Z',
    topologySummary: 'Three-level NPC, back-to-back',
    inputs: [['DC link nominal', 1100, 'V'], ['DC link worst case', 1200, 'V'], ['Switching frequency', 2500, 'Hz'], ['Modulation', 'third-harmonic', '']],
    operatingPoints: [
      { name: 'Rated motoring', lineVoltageRms: 690, phaseCurrentRms: 360, powerFactor: 0.86, fundamentalHz: 50, modulationIndex: 0.94, lineVoltageThd: 0.31 },
      { name: 'Regenerative braking', lineVoltageRms: 690, phaseCurrentRms: 300, powerFactor: -0.8, fundamentalHz: 50 },
    ],
    devices: [
      { converter: 'machine', name: 'S1', kind: 'switch', countPerPhase: 1, blockingVoltage: 600, blockingVoltageWithOvershoot: 700, currentAvg: 120.4, currentRms: 210.7, currentPeak: 509.1, requiredVoltageRating: 1200, requiredCurrentRating: 600 },
      { converter: 'machine', name: 'Dc1+', kind: 'clamp-diode', countPerPhase: 1, blockingVoltage: 600, blockingVoltageWithOvershoot: 600, currentAvg: 60.2, currentRms: 120.3, currentPeak: 509.1, requiredVoltageRating: 1200, requiredCurrentRating: 600 },
    ],
    capacitors: [{ converter: 'machine', name: 'C1', kind: 'dc-link', count: 2, voltage: 600, rippleCurrentRms: 150.2, capacitanceRequired: 4.7e-3, requiredVoltageRating: 700, requiredRippleRating: 170 }],
    warnings: ['Regenerative braking raises the DC link: check the brake chopper threshold.'],
    schematicSvg: '<svg xmlns="http://www.w3.org/2000/svg" width="300" height="120" viewBox="0 0 300 120"><rect x="10" y="10" width="280" height="100" fill="none" stroke="#000"/><text x="30" y="60" font-size="12">LEGLABEL-S1</text></svg>',
    waveform: { title: 'Rated motoring', time, lineVoltage: time.map(t => 976 * Math.sin(2 * Math.PI * 50 * t)), phaseCurrent: time.map(t => 509 * Math.sin(2 * Math.PI * 50 * t - 0.54)) },
    spectrum: [{ order: 1, frequency: 50, amplitude: 976 }, { order: 5, frequency: 250, amplitude: 12.3 }, { order: 49, frequency: 2450, amplitude: 210.5 }],
    lineVoltageThd: 0.31,
    safetyNote: SAFETY_NOTE,
    ...overrides,
  }
}

describe('designReportPdf', () => {
  it.skipIf(!hasPdfToText)('prints inputs, operating points, device and capacitor tables, spectrum, THD, warnings, schematic text and the safety note [skipped when /usr/bin/pdftotext is missing]', async () => {
    const text = flat(pdfText(await designReportPdf(report(), fonts)))
    for (const expected of [
      'Design report: Harbour crane hoist 400 kW', 'Revision 3', 'Emil Sandberg', 'DC link worst case', 'Rated motoring', 'Regenerative braking',
      'Dc1+', 'clamp-diode', '509.1', 'Required V rating [V]', '4,700', 'Amplitude [V peak]', '21.6', '31.0 %', 'brake chopper threshold',
      'LEGLABEL-S1', 'IEC 61800-5-1', 'page 1 of',
    ]) expect(text, expected).toContain(expected)
  })

  it.skipIf(!hasPdfToText)('writes numbers and the date in the report\'s locale (de-DE: "509,1", "4.700", "31,0 %", "14.03.2026, 09:30 UTC") [skipped when /usr/bin/pdftotext is missing]', async () => {
    const text = flat(pdfText(await designReportPdf(report({ locale: 'de-DE' }), fonts)))
    for (const expected of ['509,1', '4.700', '31,0 %', '14.03.2026, 09:30 UTC']) expect(text, expected).toContain(expected)
    expect(text).not.toContain('509.1')
    const gb = flat(pdfText(await designReportPdf(report(), fonts)))
    expect(gb).toContain('14 Mar 2026, 09:30 UTC')
  })

  it('never fetches what an SVG links to', async () => {
    let requests = 0
    const server = createServer((_req, res) => { requests++; res.end('x') })
    await new Promise<void>(resolve => server.listen(0, '127.0.0.1', resolve))
    const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
    try {
      const svg = `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" width="100" height="50"><image href="${url}/a.png" width="10" height="10"/><image xlink:href="${url}/b.png" width="10" height="10"></image><use href="${url}/c.svg#x"/><script>fetch('${url}/d')</script><rect width="5" height="5"/></svg>`
      const pdf = await designReportPdf(report({ schematicSvg: svg }), fonts)
      expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-')
      expect(requests).toBe(0)
    }
    finally {
      server.close()
    }
    expect(selfContainedSvg('<svg><use href="#a"/><image href="http://x/y.png"/><a xlink:href=\'http://x\'>t</a></svg>')).toBe('<svg><use href="#a"/><a>t</a></svg>')
  })

  it.skipIf(!hasPdfToText)('a broken schematic becomes a note instead of an error [skipped when /usr/bin/pdftotext is missing]', async () => {
    const text = flat(pdfText(await designReportPdf(report({ schematicSvg: '<svg><g></svg' }), fonts)))
    expect(text).toContain('The schematic could not be drawn')
    expect(text).toContain('Rated motoring')
  })

  it.skipIf(!hasPdfToText)('starts with a review summary to sign off and carries losses, T_j mean / peak and lifetime per operating point [skipped when /usr/bin/pdftotext is missing]', async () => {
    const evaluation = {
      derating: [['Junction margin below T_j,max', '15 °C']] as [string, string][],
      assumptions: ['Ambient 40 °C; heatsink 0.02 K/W.'],
      parts: [{ side: 'machine', position: 'S1', part: 'Test Devices T-HB12-450F', arrangement: '1 × 1', meanC: 96.4, peakC: 141.7, limitC: 160, peakPoint: 'Start 2 Hz' }],
      points: [
        { side: 'machine', pointName: 'Start 2 Hz', lossW: 2310, efficiency: 0.712, meanC: 96.4, peakC: 141.7, hottest: 'S1' },
        { side: 'machine', pointName: 'Rated motoring', lossW: 5480, efficiency: 0.9863, meanC: 118.2, peakC: 121.9, hottest: 'S1' },
      ],
      headline: [['Highest peak T_j', '141.7 °C at S1, Start 2 Hz (limit 160 °C)']] as [string, string][],
      life: { limiting: 'S1 (machine side), 48,210 h of operation', positions: [{ side: 'machine', position: 'S1', part: 'T-HB12-450F', lifeHours: 48210, method: 'Power cycling, Miner', source: 'Bayerer et al., CIPS 2008' }] },
      gaps: ['Cdc (machine): no part assigned, not in the figures'],
    }
    const pdf = await designReportPdf(report({ evaluation }), fonts)
    const first = flat(pdfText(pdf, 1))
    for (const expected of ['Design review summary', 'Key figures', '141.7', 'Lifetime limited by S1', 'Derating policy', 'Sign-off', 'Reviewed by', 'Approved by', 'no part assigned']) expect(first, expected).toContain(expected)
    expect(first).not.toContain('Line-voltage spectrum')
    const text = flat(pdfText(pdf))
    for (const expected of ['Losses and junction temperature per operating point', 'Start 2 Hz', '2,310', '71.20', '121.9', 'Lifetime from the mission profile', '48,210 h', 'Bayerer']) expect(text, expected).toContain(expected)
  })

  it('names the field of bad report input', async () => {
    await expect(designReportPdf(report({ designName: '' }), fonts)).rejects.toThrow(DesignReportError)
    await expect(designReportPdf(report({ waveform: { time: [0, 1], lineVoltage: [1] } }), fonts)).rejects.toThrow(/waveform\.lineVoltage/)
  })
})
