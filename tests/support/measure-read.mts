// Child process for the memory tests: reads one upload as the server does and prints the peak RSS.
// Run as `node --import tsx tests/support/measure-read.mts <file>`; prints one JSON line.
import { readFileSync } from 'node:fs'
import { readCatalogFile } from '../../server/catalog/read'
import { UPLOAD_LIMITS } from '../../server/catalog/limits'

const buffer = readFileSync(process.argv[2]!)
let peak = process.memoryUsage().rss
const timer = setInterval(() => { peak = Math.max(peak, process.memoryUsage().rss) }, 2)
const table = await readCatalogFile(buffer, 'upload.xlsx', UPLOAD_LIMITS)
clearInterval(timer)
peak = Math.max(peak, process.memoryUsage().rss)
console.log(JSON.stringify({ bytes: buffer.length, rows: table.rows.length, errors: table.errors.map(e => e.message), peakRssMB: Math.round(peak / 1048576) }))
