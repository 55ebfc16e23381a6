import * as now from '../../shared/engine/index'
// @ts-expect-error old copy outside the project
import * as old from '/tmp/old/shared/engine/index.ts'
const cases: [string, number | undefined][] = [['two-level', 2], ['diode-clamped', 3], ['diode-clamped', 5], ['diode-clamped', 9], ['t-type', 3], ['anpc', 3], ['flying-capacitor', 3], ['flying-capacitor', 5], ['flying-capacitor', 9], ['cascaded-h-bridge', 3], ['cascaded-h-bridge', 5], ['cascaded-h-bridge', 9], ['cascaded-h-bridge', 15], ['matrix', undefined]]
for (const [which, N0] of cases) {
  const N = N0 ?? 3
  const t = now.topologies.find(x => x.id === which)!
  const dcVoltage = t.supply === 'cell' ? 700 : 1100
  const halfLink = t.supply === 'cell' ? ((N - 1) / 2) * dcVoltage : dcVoltage / 2
  const input: any = { topology: t.id, levels: N0, dcVoltage, dcVoltageMax: dcVoltage * 1.1, inputLineVoltageRms: 400,
    lineVoltageRms: t.supply === 'ac-input' ? 320 : (0.9 * halfLink * Math.sqrt(3)) / Math.SQRT2, phaseCurrentRms: 300, powerFactor: 0.86, fundamentalHz: 50, switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 80 }
  const tn: number[] = []; const to: number[] = []
  for (let r = 0; r < 300; r++) {
    let a = performance.now(); now.evaluateStress(input, { includeSpectrum: true }); tn.push(performance.now() - a)
    a = performance.now(); old.evaluateStress(input, { includeSpectrum: true }); to.push(performance.now() - a)
  }
  const med = (x: number[]) => x.sort((p, q) => p - q)[Math.floor(x.length / 2)]!
  const rn = now.evaluateStress(input, { includeSpectrum: true }); const ro = old.evaluateStress(input, { includeSpectrum: true })
  console.log(`${which} ${N0 ?? ''}`.padEnd(22), 'now', med(tn).toFixed(3), 'old', med(to).toFixed(3), 'ratio', (med(to) / med(tn)).toFixed(2), 'THD', rn.lineVoltageThd.toFixed(5), ro.lineVoltageThd.toFixed(5), 'toOrder', rn.lineVoltageThdToOrder.toFixed(5), ro.lineVoltageThdToOrder.toFixed(5))
}
