// First-principles checks of the topology data and the integrator: every state physically consistent,
// clamp blocking by enumeration, leg currents adding up to the phase current, symmetry, convergence.
import { describe, expect, it } from 'vitest'
import { blockingFromStates, evaluateStress, legFor, topologies, type Modulation, type TopologyId } from '../../../shared/engine'
import { expectClose, inputAt } from './helpers'

const cases = topologies.flatMap(t => (t.allowedLevels === 'ignored' ? [3] : t.allowedLevels).map(N => ({ id: t.id, N })))
const withStates = cases.filter(c => c.id !== 'matrix')

describe('switching-state tables (enumeration of the leg, first principles)', () => {
  it.each(withStates)('$id N=$N: every state is physically consistent', ({ id, N }) => {
    const leg = legFor(topologies.find(t => t.id === id)!, N)
    const def = leg.def
    const cell = id === 'cascaded-h-bridge'
    const rails = def.capacitors.filter(c => c.kind === 'dc-link').flatMap(c => c.nodes)
    for (const s of def.states) {
      const v = s.nodeVoltages!
      const across = (name: string) => {
        const p = def.positions.find(x => x.name === name)!
        return v[p.nodes[0]]! - v[p.nodes[1]]!
      }
      // Output potential equals the state's level (cell: A − B = level − 1).
      expect(cell ? v.A! - v.B! : v[def.outputNode]!, `${s.name} output`).toBe(cell ? s.level - 1 : s.level)
      // Gated switches have no voltage across; no device is reverse-biased for its kind (no off diode forward-biased).
      for (const name of s.on) expect(across(name), `${s.name} ${name} on`).toBe(0)
      for (const p of def.positions) expect(across(p.name), `${s.name} ${p.name}`).toBeGreaterThanOrEqual(0)
      for (const [sign, path] of [[1, s.positive], [-1, s.negative]] as const) {
        // Conducting IGBTs are gated on; conducting devices form one path from a DC node (or through a
        // capacitor) to the output: the net current into every other node is zero.
        const div = new Map<string, number>()
        const add = (n: string, x: number) => div.set(n, (div.get(n) ?? 0) + x)
        for (const name of path) {
          const p = def.positions.find(x => x.name === name)!
          if (p.kind === 'switch') expect(s.on, `${s.name} ${name} conducts but is off`).toContain(name)
          const [from, to] = p.kind === 'switch' ? p.nodes : [p.nodes[1], p.nodes[0]]
          add(from, -1)
          add(to, 1)
        }
        for (const c of def.capacitors) {
          const a = div.get(c.nodes[0]) ?? 0
          const b = div.get(c.nodes[1]) ?? 0
          if (a !== 0 && a + b === 0) { div.set(c.nodes[0], 0); div.set(c.nodes[1], 0) }
        }
        const open = [...div.entries()].filter(([, x]) => x !== 0)
        const terminal = cell ? 'A' : def.outputNode
        expect(div.get(terminal), `${s.name} ${sign > 0 ? '+' : '−'} reaches the output`).toBe(sign)
        if (cell) expect(div.get('B')).toBe(-sign)
        else if (id === 'flying-capacitor') expect(open.filter(([n]) => n !== terminal).every(([n, x]) => rails.includes(n) && x === -sign)).toBe(true)
        else expect(div.get(`dc${s.level}`), `${s.name} draws from DC node ${s.level}`).toBe(-sign)
        expect(open, `${s.name}: one path only`).toHaveLength(2)
      }
    }
  })

  it.each([3, 4, 5, 6, 7, 8, 9])('diode-clamped N=%i: enumerated clamp blocking = k·V_dc/(N−1) (Rodriguez, Lai, Peng, IEEE TIE 2002)', (N) => {
    const def = legFor(topologies.find(t => t.id === 'diode-clamped')!, N).def
    for (let l = 1; l <= N - 2; l++) {
      const upper = def.positions.find(p => p.name === `Dc${l}+`)!
      const lower = def.positions.find(p => p.name === `Dc${l}-`)!
      // The upper clamp diode at DC node l sees the rail above (N−1−l steps), the lower one the rail below (l steps).
      expect(blockingFromStates(def, upper)).toBe(N - 1 - l)
      expect(blockingFromStates(def, lower)).toBe(l)
    }
  })
})

const modulations: Modulation[] = ['sine', 'third-harmonic', 'space-vector']
const currentCases = cases.flatMap(c => modulations.map(modulation => [0.85, -0.6].map(pf => ({ ...c, modulation, pf })))).flat()

describe('leg currents (first principles)', () => {
  it.each(currentCases)('$id N=$N $modulation pf=$pf: output-adjacent positions carry the phase current; symmetric positions equal', ({ id, N, modulation, pf }) => {
    const input = id === 'matrix'
      ? { topology: 'matrix' as TopologyId, inputLineVoltageRms: 690, lineVoltageRms: 500, phaseCurrentRms: 100, powerFactor: pf, fundamentalHz: 50, switchingHz: 5000, modulation }
      : inputAt(id, 0.85, pf, { levels: N, modulation })
    const r = evaluateStress(input)
    const leg = legFor(topologies.find(t => t.id === id)!, N)
    const terminal = leg.def.outputNode
    const Ih = Math.SQRT2 * 100
    const adjacent = r.devices.filter((_, k) => leg.positions[k]!.nodes.includes(terminal))
    // At every instant exactly one output-adjacent device carries i: Σ avg = mean|i| = 2Î/π, Σ rms² = Î²/2.
    expectClose(adjacent.reduce((a, d) => a + d.currentAvg, 0), (2 * Ih) / Math.PI, 1e-6, 'Σ avg')
    expectClose(adjacent.reduce((a, d) => a + d.currentRms ** 2, 0), (Ih * Ih) / 2, 1e-6, 'Σ rms²')
    for (const [k, pos] of leg.positions.entries()) {
      const d = r.devices[k]!
      expect(d.currentRms).toBeGreaterThanOrEqual(d.currentAvg)
      if (!pos.mirror) continue
      const m = r.devices.find(x => x.name === pos.mirror)!
      expectClose(d.currentAvg, m.currentAvg, 1e-9, `${d.name} avg = ${m.name}`)
      expectClose(d.currentRms, m.currentRms, 1e-9, `${d.name} rms = ${m.name}`)
      expectClose(d.currentPeak, m.currentPeak, 1e-9, `${d.name} peak = ${m.name}`)
      expect(d.blockingVoltage).toBe(m.blockingVoltage)
    }
  })

  it.each(cases)('$id N=$N: integration converges (default 2046 vs 4096 points within 1e-5)', ({ id, N }) => {
    const input = id === 'matrix'
      ? { topology: 'matrix' as TopologyId, inputLineVoltageRms: 690, lineVoltageRms: 500, phaseCurrentRms: 100, powerFactor: 0.8, fundamentalHz: 50, switchingHz: 5000, modulation: 'space-vector' as Modulation }
      : inputAt(id, 0.9, 0.8, { levels: N, modulation: 'space-vector' })
    const coarse = evaluateStress(input, { integrationPoints: 512 })
    const normal = evaluateStress(input)
    const fine = evaluateStress(input, { integrationPoints: 4096 })
    const Ih = Math.SQRT2 * 100
    let errNormal = 0
    let errCoarse = 0
    for (const [k, d] of fine.devices.entries()) {
      errNormal = Math.max(errNormal, Math.abs(normal.devices[k]!.currentAvg - d.currentAvg), Math.abs(normal.devices[k]!.currentRms - d.currentRms))
      errCoarse = Math.max(errCoarse, Math.abs(coarse.devices[k]!.currentAvg - d.currentAvg), Math.abs(coarse.devices[k]!.currentRms - d.currentRms))
    }
    for (const [k, c] of fine.capacitors.entries()) errNormal = Math.max(errNormal, Math.abs(normal.capacitors[k]!.rippleCurrentRms - c.rippleCurrentRms))
    expect(errNormal / Ih).toBeLessThan(1e-5)
    // And the error shrinks with the point count (a converging rule, not a constant answer).
    expect(errNormal).toBeLessThanOrEqual(errCoarse + 1e-12)
  })
})
