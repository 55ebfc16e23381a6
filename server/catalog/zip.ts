// A small reader of a zip archive's central directory, so an .xlsx upload's uncompressed size is known
// (and checked) before the spreadsheet library inflates it. Guards against zip bombs.

import { inflateRawSync } from 'node:zlib'

export interface ZipEntry {
  name: string
  /** 0 stored, 8 deflated */
  method: number
  compressedSize: number
  uncompressedSize: number
  localHeaderOffset: number
}

export interface ZipLimits {
  /** bytes, total uncompressed size allowed (default 100 MB) */
  maxUncompressedBytes?: number
  /** total uncompressed / compressed allowed once the archive inflates past 10 MB (default 200) */
  maxCompressionRatio?: number
  /** entries allowed (default 10 000) */
  maxEntries?: number
}

export type ZipInspection
  = | { ok: true, entries: ZipEntry[], totalUncompressedBytes: number, totalCompressedBytes: number }
    | { ok: false, reason: string, bomb?: boolean }

const EOCD = 0x06054b50
const EOCD64_LOCATOR = 0x07064b50
const EOCD64 = 0x06064b50
const CENTRAL = 0x02014b50
const LOCAL = 0x04034b50
const RATIO_APPLIES_ABOVE_BYTES = 10 * 1024 * 1024

function mb(bytes: number): string {
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`
}

/** Reads the central directory; refuses archives whose declared sizes exceed the limits. */
export function readZipDirectory(buffer: Buffer, limits: ZipLimits = {}): ZipInspection {
  const maxUncompressed = limits.maxUncompressedBytes ?? 100 * 1024 * 1024
  const maxRatio = limits.maxCompressionRatio ?? 200
  const maxEntries = limits.maxEntries ?? 10_000
  // The end-of-central-directory record sits in the last 22 + 65 535 (comment) bytes.
  let eocd = -1
  for (let i = buffer.length - 22; i >= Math.max(0, buffer.length - 22 - 65_535); i--) {
    if (buffer.readUInt32LE(i) === EOCD) {
      eocd = i
      break
    }
  }
  if (eocd < 0) return { ok: false, reason: 'the zip structure of the file is broken (no central directory)' }
  let entryCount = buffer.readUInt16LE(eocd + 10)
  let directorySize = buffer.readUInt32LE(eocd + 12)
  let directoryOffset = buffer.readUInt32LE(eocd + 16)
  if (entryCount === 0xffff || directoryOffset === 0xffffffff || directorySize === 0xffffffff) {
    const locator = eocd - 20
    if (locator < 0 || buffer.readUInt32LE(locator) !== EOCD64_LOCATOR) return { ok: false, reason: 'the zip structure of the file is broken (zip64 locator missing)' }
    const record = Number(buffer.readBigUInt64LE(locator + 8))
    if (record + 56 > buffer.length || buffer.readUInt32LE(record) !== EOCD64) return { ok: false, reason: 'the zip structure of the file is broken (zip64 record missing)' }
    entryCount = Number(buffer.readBigUInt64LE(record + 32))
    directorySize = Number(buffer.readBigUInt64LE(record + 40))
    directoryOffset = Number(buffer.readBigUInt64LE(record + 48))
  }
  if (entryCount > maxEntries) return { ok: false, reason: `the archive holds ${entryCount} files; a workbook has far fewer (limit ${maxEntries})`, bomb: true }
  if (directoryOffset + directorySize > buffer.length) return { ok: false, reason: 'the zip structure of the file is broken (directory outside the file)' }

  const entries: ZipEntry[] = []
  let totalUncompressed = 0
  let totalCompressed = 0
  let at = directoryOffset
  for (let n = 0; n < entryCount; n++) {
    if (at + 46 > buffer.length || buffer.readUInt32LE(at) !== CENTRAL) return { ok: false, reason: 'the zip structure of the file is broken (bad directory entry)' }
    const method = buffer.readUInt16LE(at + 10)
    let compressedSize = buffer.readUInt32LE(at + 20)
    let uncompressedSize = buffer.readUInt32LE(at + 24)
    const nameLength = buffer.readUInt16LE(at + 28)
    const extraLength = buffer.readUInt16LE(at + 30)
    const commentLength = buffer.readUInt16LE(at + 32)
    let localHeaderOffset = buffer.readUInt32LE(at + 42)
    const name = buffer.toString('utf8', at + 46, at + 46 + nameLength)
    // Zip64 extra field (id 1) carries the 64-bit sizes in this order, only for fields set to 0xffffffff.
    let extra = at + 46 + nameLength
    const extraEnd = extra + extraLength
    while (extra + 4 <= extraEnd) {
      const id = buffer.readUInt16LE(extra)
      const size = buffer.readUInt16LE(extra + 2)
      if (id === 1) {
        let p = extra + 4
        if (uncompressedSize === 0xffffffff) { uncompressedSize = Number(buffer.readBigUInt64LE(p)); p += 8 }
        if (compressedSize === 0xffffffff) { compressedSize = Number(buffer.readBigUInt64LE(p)); p += 8 }
        if (localHeaderOffset === 0xffffffff) { localHeaderOffset = Number(buffer.readBigUInt64LE(p)) }
      }
      extra += 4 + size
    }
    entries.push({ name, method, compressedSize, uncompressedSize, localHeaderOffset })
    totalUncompressed += uncompressedSize
    totalCompressed += compressedSize
    if (totalUncompressed > maxUncompressed) {
      return { ok: false, reason: `the workbook would inflate to more than ${mb(maxUncompressed)} (refused as a possible zip bomb)`, bomb: true }
    }
    at = extraEnd + commentLength
  }
  if (totalUncompressed > RATIO_APPLIES_ABOVE_BYTES && totalUncompressed / Math.max(1, totalCompressed) > maxRatio) {
    return { ok: false, reason: `the workbook is compressed ${Math.round(totalUncompressed / Math.max(1, totalCompressed))}:1 (${mb(totalUncompressed)} from ${mb(totalCompressed)}); refused as a possible zip bomb (limit ${maxRatio}:1)`, bomb: true }
  }
  return { ok: true, entries, totalUncompressedBytes: totalUncompressed, totalCompressedBytes: totalCompressed }
}

/**
 * Inflates every entry with its declared size as a hard ceiling, so an archive whose directory
 * understates its sizes is refused here instead of exhausting memory later. Returns null when all is well.
 */
export function verifyZipEntries(buffer: Buffer, entries: readonly ZipEntry[]): string | null {
  for (const entry of entries) {
    const at = entry.localHeaderOffset
    if (at + 30 > buffer.length || buffer.readUInt32LE(at) !== LOCAL) return `the zip structure of the file is broken (entry '${entry.name}')`
    const dataStart = at + 30 + buffer.readUInt16LE(at + 26) + buffer.readUInt16LE(at + 28)
    const data = buffer.subarray(dataStart, dataStart + entry.compressedSize)
    if (entry.method === 0) {
      if (entry.compressedSize !== entry.uncompressedSize) return `entry '${entry.name}' is stored with inconsistent sizes`
      continue
    }
    if (entry.method !== 8) return `entry '${entry.name}' uses compression method ${entry.method}, which workbooks do not use`
    try {
      const out = inflateRawSync(data, { maxOutputLength: Math.max(1, entry.uncompressedSize) })
      if (out.length !== entry.uncompressedSize) return `entry '${entry.name}' inflates to ${out.length} bytes, not the ${entry.uncompressedSize} its directory declares`
    }
    catch (error) {
      const code = (error as { code?: string }).code
      if (code === 'ERR_BUFFER_TOO_LARGE') return `entry '${entry.name}' inflates to more than its declared ${entry.uncompressedSize} bytes (refused as a possible zip bomb)`
      return `entry '${entry.name}' cannot be inflated (${(error as Error).message})`
    }
  }
  return null
}
