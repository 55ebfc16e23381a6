import { evaluateStress, topologies } from '../../shared/engine/index'
const cases: [string, number | undefined][] = process.argv[2] ? [[process.argv[2], Number(process.argv[3]) || undefined]] : [['two-level', 2], ['diode-clamped', 3], ['diode-clamped', 5], ['diode-clamped', 9], ['t-type', 3], ['anpc', 3], ['flying-capacitor', 3], ['flying-capacitor', 5], ['flying-capacitor', 9], ['cascaded-h-bridge', 5], ['cascaded-h-bridge', 9], ['cascaded-h-bridge', 15], ['matrix', undefined]]
for (const [which, N0] of cases) {
  const N = N0 ?? 3
  const t = topologies.find(x => x.id === which)!
  const dcVoltage = t.supply === 'cell' ? 700 : 1100
  const halfLink = t.supply === 'cell' ? ((N - 1) / 2) * dcVoltage : dcVoltage / 2
  const input: any = { topology: t.id, levels: N0, dcVoltage, dcVoltageMax: dcVoltage * 1.1, inputLineVoltageRms: 400,
    lineVoltageRms: t.supply === 'ac-input' ? 320 : (0.9 * halfLink * Math.sqrt(3)) / Math.SQRT2, phaseCurrentRms: 300, powerFactor: 0.86, fundamentalHz: 50, switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 80 }
  for (let k = 0; k < 100; k++) evaluateStress(input, { includeSpectrum: true })
  const runs = 400
  const c0 = process.cpuUsage()
  for (let k = 0; k < runs; k++) evaluateStress(input, { includeSpectrum: true })
  const c = process.cpuUsage(c0)
  console.log(`${which} ${N0 ?? ''}`.padEnd(24), ((c.user + c.system) / 1000 / runs).toFixed(3), 'ms CPU')
}
