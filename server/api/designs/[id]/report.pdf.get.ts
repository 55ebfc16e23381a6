import { idParam } from '#shared/schemas/auth'
import { legSchematicSvg } from '#shared/drawing/leg-svg'
import { topologyById } from '#shared/engine/topologies'
import type { DesignPreview } from '#shared/types/design'
import { SAFETY_NOTE, topologySummary } from '~~/server/services/bom'
import { loadDesign, loadRevision, revisionQuery } from '~~/server/services/designs'
import { matchDesign, reportEvaluation } from '~~/server/services/parts'
import { renderDesignReport, runInPool } from '~~/server/workers/pool'

// The printable design report: a one-page review summary (current revision), inputs, results, the assigned parts'
// losses, T_j and lifetime per operating point, warnings, waveform and spectrum, safety note.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'designs:read')
  const { id } = paramsValid(event, idParam)
  const { revision } = queryValid(event, revisionQuery)
  const design = await loadDesign(id)
  const rev = revision ?? design.revision
  const row = await loadRevision(id, rev)
  const input = row.input
  const preview = await runInPool<DesignPreview>({ kind: 'preview', input })
  const twoSides = !!input.gridSide
  const inputs: [string, string | number, string][] = []
  for (const [label, c] of [['Machine side', input.machineSide], ['Grid side', input.gridSide]] as const) {
    if (!c) continue
    const p = twoSides ? `${label}: ` : ''
    if (c.levels) inputs.push([`${p}levels`, c.levels, ''])
    if (c.dcVoltage) inputs.push([`${p}DC voltage nominal`, c.dcVoltage, 'V'], [`${p}DC voltage worst case`, c.dcVoltageMax ?? c.dcVoltage, 'V'])
    if (c.inputLineVoltageRms) inputs.push([`${p}input line voltage`, c.inputLineVoltageRms, 'V'])
    if (topologyById[c.topology].presentation.form.inputSide) {
      inputs.push([`${p}input displacement factor`, `${c.inputDisplacementFactor ?? 1} ${c.inputDisplacementSense ?? 'lagging'}`, ''], [`${p}input frequency`, c.inputFrequencyHz ?? 50, 'Hz'])
      if (c.inputFilterResonanceHz) inputs.push([`${p}input filter resonance`, c.inputFilterResonanceHz, 'Hz'])
    }
    inputs.push([`${p}modulation`, c.modulation, ''], [`${p}switching frequency`, c.switchingHz, 'Hz'])
    if (c.overshootVoltage !== undefined) inputs.push([`${p}overshoot`, c.overshootVoltage, 'V'])
  }
  const machine = preview.result.converters[0]!
  // Parts, losses, T_j and lifetime belong to the current revision (the assignments are rated against it).
  const evaluation = rev === design.revision ? reportEvaluation(await matchDesign(id, 0, { summaryOnly: true }), requestLocale(event)) : undefined
  const extras = preview.extras.machine
  const pdf = await renderDesignReport({
    designName: row.name,
    revision: rev,
    author: row.author ?? '—',
    date: new Date(row.createdAt).toISOString(),
    locale: requestLocale(event),
    topologySummary: topologySummary(input),
    inputs,
    operatingPoints: preview.result.converters.flatMap(c => c.points.map((pt) => {
      const conv = c.side === 'grid' ? input.gridSide! : input.machineSide
      const op = conv.operatingPoints.find(o => o.name === pt.pointName)!
      const name = op.name ?? pt.pointName
      return { ...op, name: twoSides ? `${c.side}: ${name}` : name, modulationIndex: pt.modulationIndex, lineVoltageThd: pt.lineVoltageThd }
    })),
    devices: preview.result.converters.flatMap(c => c.envelope.devices.map(d => ({ ...d, ...(twoSides ? { converter: c.side } : {}) }))),
    capacitors: [
      ...preview.result.converters.flatMap(c => c.envelope.capacitors.map(d => ({ ...d, ...(twoSides ? { converter: c.side } : {}) }))),
      // Back-to-back: the one shared DC-link bank, once.
      ...(preview.result.sharedLink?.capacitors ?? []).map(d => ({ ...d, converter: 'shared DC link' })),
    ],
    warnings: [...preview.result.warnings, ...preview.result.converters.flatMap(c => c.warnings)],
    // One drawing, the machine side's leg (its DC-link capacitors labelled with the shared bank); the grid side's figures are in the tables.
    schematicSvg: legSchematicSvg(preview.layouts.machine!, { devices: machine.envelope.devices, capacitors: [...machine.envelope.capacitors, ...(preview.result.sharedLink?.capacitors ?? [])] }, twoSides ? { title: 'Machine side' } : {}),
    waveform: extras?.waveform ? { title: extras.pointName, time: extras.waveform.time, lineVoltage: extras.waveform.lineVoltage, phaseCurrent: extras.waveform.phaseCurrent } : undefined,
    spectrum: extras?.spectrum,
    lineVoltageThd: extras?.thd ?? machine.points[0]?.lineVoltageThd,
    ...(evaluation ? { evaluation } : {}),
    safetyNote: SAFETY_NOTE,
  })
  setResponseHeaders(event, {
    'Content-Type': 'application/pdf',
    'Content-Disposition': `attachment; filename="Design-${row.name.replace(/[^\w-]+/g, '_').slice(0, 40)}-rev${rev}.pdf"`,
  })
  return pdf
})
