// One source of truth: outside shared/engine/topologies no code compares against or switches on a topology id.
import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { describe, expect, it } from 'vitest'
import { topologies } from '../../../shared/engine/topologies'

const root = join(__dirname, '../../..')
const ALLOWED = join(root, 'shared/engine/topologies')

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name)
    if (path === ALLOWED) return []
    if (statSync(path).isDirectory()) return files(path)
    return /\.(ts|vue|mjs)$/.test(name) ? [path] : []
  })
}

/** Lines of `source` that compare with (===, !==, ==, !=) or `case` on one of the ids (quoted either way). */
export function idSwitches(source: string, ids: string[]): string[] {
  const alt = ids.map(id => id.replace(/[-/\\^$*+?.()|[\]{}]/g, '\\$&')).join('|')
  const q = `['"\`](?:${alt})['"\`]`
  const pattern = new RegExp(`(?:[!=]==?\\s*${q})|(?:${q}\\s*[!=]==?)|(?:\\bcase\\s+${q}\\s*:)`)
  return source.split('\n').filter(line => pattern.test(line))
}

// 'npc' is the trade name of the three-level diode-clamped leg; it must not be compared against either.
const ids = [...topologies.map(t => t.id), 'npc']

describe('no topology id switches outside shared/engine/topologies', () => {
  it('finds the kinds of code it forbids', () => {
    expect(idSwitches(`if (t === 'npc') x()`, ids)).toHaveLength(1)
    expect(idSwitches(`  case 'two-level':`, ids)).toHaveLength(1)
    expect(idSwitches(`<x v-if="model.topology !== &quot;x&quot; && model.topology === 'matrix'">`, ids)).toHaveLength(1)
    expect(idSwitches(`'flying-capacitor' == kind`, ids)).toHaveLength(1)
    expect(idSwitches(`const d = { topology: 'diode-clamped', levels: 3 }`, ids)).toHaveLength(0)
  })

  it('app/, server/ and shared/ hold none', () => {
    const hits = ['app', 'server', 'shared'].flatMap(dir => files(join(root, dir)))
      .flatMap(path => idSwitches(readFileSync(path, 'utf8'), ids).map(line => `${relative(root, path)}: ${line.trim()}`))
    expect(hits).toEqual([])
  })
})
