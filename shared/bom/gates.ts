// Release gates of a BOM line: parts that component engineering has not approved, or whose lifecycle is
// not-recommended or obsolete, need a design engineer's recorded reason before the BOM is released.

import type { BomAcknowledgement, BomGateReason, BomLine } from './types'

export const GATE_LABELS: Record<BomGateReason, string> = {
  unapproved: 'not approved by component engineering',
  nrnd: 'not recommended for new designs',
  obsolete: 'obsolete',
}

/** Why a part needs acknowledging (empty when approved and active). */
export function gateReasons(part: { approved?: boolean | null, lifecycle?: string | null }): BomGateReason[] {
  const reasons: BomGateReason[] = []
  if (part.approved === false) reasons.push('unapproved')
  if (part.lifecycle === 'nrnd') reasons.push('nrnd')
  if (part.lifecycle === 'obsolete') reasons.push('obsolete')
  return reasons
}

/** The mark the exports print beside a gated line, e.g. "not approved; acknowledged by A. Engineer: only source". */
export function gateMark(line: Pick<BomLine, 'gate' | 'acknowledgement'>): string {
  if (!line.gate?.length) return ''
  const what = line.gate.map(g => GATE_LABELS[g]).join(', ')
  const ack = line.acknowledgement
  return ack ? `${what}; acknowledged by ${ack.by}: ${ack.reason}` : `${what}; NOT acknowledged`
}

/** Lines that block a release: gated and without an acknowledgement. */
export function unacknowledgedLines(lines: readonly BomLine[]): BomLine[] {
  return lines.filter(l => (l.gate?.length ?? 0) > 0 && !l.acknowledgement)
}

export type { BomAcknowledgement }
