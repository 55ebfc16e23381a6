// Validation messages in the user's words: the field named by the label the form shows, and what to do.
// The schemas and the engine name fields by their machine keys ("powerFactor must be at most 1"); the API
// keeps those paths in `data.issues[].path` and sends the message rewritten here.

/** The label of each input field as the forms show it, by its key (the last part of the path). */
export const FIELD_LABELS = {
  topology: 'Topology',
  levels: 'Levels (N)',
  dcVoltage: 'DC link, nominal',
  dcVoltageMax: 'DC link, worst case',
  inputLineVoltageRms: 'Input line voltage (RMS)',
  inputDisplacementFactor: 'Input displacement factor',
  inputDisplacementSense: 'Input lagging or leading',
  inputFrequencyHz: 'Input frequency',
  inputFilterResonanceHz: 'Input filter resonance',
  switchingHz: 'Switching frequency',
  modulation: 'Modulation',
  overshootVoltage: 'Overshoot voltage',
  strayInductance: 'Stray inductance',
  currentSlope: 'Turn-off di/dt',
  clampDiodeUnitVoltage: 'Clamp diode unit voltage',
  operatingPoints: 'Operating points',
  lineVoltageRms: 'Line voltage RMS',
  phaseCurrentRms: 'Phase current RMS',
  powerFactor: 'Power factor',
  powerFactorSense: 'Lagging or leading power factor',
  fundamentalHz: 'Fundamental frequency',
  capacitorRippleTarget: 'Capacitor ripple target',
  linkCarriers: 'Carriers of the two converters',
  semiconductorVoltageUtilisation: 'Semiconductor voltage use',
  semiconductorTransientMargin: 'Semiconductor peak (with overshoot) use',
  semiconductorCurrentUtilisation: 'Semiconductor peak-current use',
  capacitorVoltageUtilisation: 'Capacitor voltage use',
  capacitorRippleUtilisation: 'Capacitor ripple use',
  junctionMarginC: 'Junction margin below T_j,max',
  heatsinkTemperatureC: 'Heatsink temperature',
  hoursShare: 'Share of the operating hours',
  startsPerHour: 'Starts per hour',
  ambientTemperatureC: 'Ambient or coolant temperature',
  heatsinkRth: 'Heatsink R_th to ambient',
  heatsinkTimeConstantS: 'Heatsink time constant',
  currentPerBondWireA: 'Current per bond wire',
  bondWireDiameterUm: 'Bond wire diameter',
  derating: 'Derating policy',
  gridSide: 'Grid-side converter',
  machineSide: 'Converter',
  name: 'Name',
  description: 'Notes',
  email: 'E-mail',
  password: 'Password',
  role: 'Role',
  revision: 'Revision',
  machinePoint: 'Operating point shown',
  gridPoint: 'Grid-side operating point shown',
  resolution: 'Waveform resolution',
  locale: 'Language and number format',
} as const satisfies Record<string, string>

/** The same map, looked up by any key (a path's key may have no label). */
const LABELS: Readonly<Record<string, string>> = FIELD_LABELS

/** Utilisations are fractions in the data and percentages on screen. */
const PERCENT_FIELDS = new Set(['semiconductorVoltageUtilisation', 'semiconductorTransientMargin', 'semiconductorCurrentUtilisation', 'capacitorVoltageUtilisation', 'capacitorRippleUtilisation'])

/** "phaseCurrentRms" → "Phase current rms" for a key without a label of its own. */
function humanise(key: string): string {
  const words = key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/[_-]+/g, ' ').toLowerCase()
  return words.charAt(0).toUpperCase() + words.slice(1)
}

/** The last named (non-index) part of a path: "machineSide.operatingPoints.0.powerFactor" → "powerFactor". */
function keyOf(path: string): string {
  const parts = path.split('.').filter(p => p !== '' && !/^\d+$/.test(p))
  return parts[parts.length - 1] ?? ''
}

export function labelOf(path: string): string {
  const key = keyOf(path)
  if (!key) return 'This value'
  return LABELS[key] ?? humanise(key)
}

/** Where a field sits, for a message shown away from the field: "grid side, operating point 2". */
export function placeOf(path: string): string {
  const parts: string[] = []
  if (path.startsWith('gridSide.') || path.includes('.gridSide.')) parts.push('grid side')
  const point = /operatingPoints\.(\d+)/.exec(path)
  if (point) parts.push(`operating point ${Number(point[1]) + 1}`)
  return parts.join(', ')
}

function amount(text: string, key: string): string {
  if (Object.hasOwn(LABELS, text)) return `“${LABELS[text]}”`
  const n = Number(text.replace('\u2212', '-'))
  if (PERCENT_FIELDS.has(key) && Number.isFinite(n)) return `${Number((n * 100).toPrecision(6))} %`
  return text
}

/** The unit from a schema's parenthetical "(V, nominal DC link; …)" → "V"; "" for fractions and ranges. */
function unitIn(parenthetical: string | undefined): string {
  const u = (parenthetical ?? '').split(/[,;]/)[0]!.trim()
  return /^(fraction|−1…1|-1…1)$/.test(u) ? '' : u
}

const ZOD_DEFAULTS: [RegExp, (label: string, m: RegExpExecArray, key: string) => string][] = [
  [/^Too small: expected number to be >=(\S+)/, (l, m, k) => `${l} must be at least ${amount(m[1]!, k)}: enter ${amount(m[1]!, k)} or more.`],
  [/^Too small: expected number to be >(\S+)/, (l, m, k) => `${l} must be greater than ${amount(m[1]!, k)}: enter a larger value.`],
  [/^Too big: expected number to be <=(\S+)/, (l, m, k) => `${l} must be at most ${amount(m[1]!, k)}: enter ${amount(m[1]!, k)} or less.`],
  [/^Too big: expected number to be <(\S+)/, (l, m, k) => `${l} must be less than ${amount(m[1]!, k)}: enter a smaller value.`],
  [/^Too small: expected string to have >=1 characters?/, l => `${l} is empty: fill it in.`],
  [/^Too small: expected string to have >=(\d+) characters/, (l, m) => `${l} is too short: use at least ${m[1]} characters.`],
  [/^Too big: expected string to have <=(\d+) characters/, (l, m) => `${l} is too long: use at most ${m[1]} characters.`],
  [/^Too small: expected array to have >=(\d+) items?/, (l, m) => `${l}: give at least ${m[1]}.`],
  [/^Too big: expected array to have <=(\d+) items?/, (l, m) => `${l}: give at most ${m[1]}.`],
  [/^Invalid input: expected number, received undefined/, l => `${l} is required: enter a number.`],
  [/^Invalid input: expected (?:number|int)/, l => `${l} must be a number: enter digits, e.g. 12.5.`],
  [/^Invalid input: expected string, received undefined/, l => `${l} is required: fill it in.`],
  [/^Invalid input: expected string/, l => `${l} must be text.`],
  [/^Invalid input: expected boolean/, l => `${l} must be yes or no.`],
  [/^Invalid (?:email address|input: expected email)/i, l => `${l}: enter an e-mail address such as name@company.example.`],
  [/^Invalid option: expected one of (.*)$/, (l, m) => `${l}: choose one of ${m[1]!.replace(/"/g, '').replace(/\|/g, ', ')}.`],
  [/^Invalid input$/, l => `${l} is not valid: check the value.`],
]

// The schemas' and the engine's own phrasing after the machine key: "<key> must be at most 1 (unit)".
const KEY_PHRASES: [RegExp, (label: string, m: RegExpExecArray, key: string) => string][] = [
  [/^ is required(?: \(([^)]*)\))?(.*)$/, (l, m) => `${l} is required: enter a value${unitIn(m[1]) ? ` in ${unitIn(m[1])}` : ''}${m[2] ?? ''}.`],
  [/^ must be a (?:finite )?number(?: \(([^)]*)\))?$/, (l, m) => `${l} must be a number: enter a value${unitIn(m[1]) ? ` in ${unitIn(m[1])}` : ''}.`],
  [/^ must be (?:greater than|above) (\S+)(?: \(([^)]*)\))?$/, (l, m, k) => `${l} must be greater than ${amount(m[1]!, k)}${unitIn(m[2]) && unitIn(m[2]) !== '°C' ? ` ${unitIn(m[2])}` : ''}: enter a larger value.`],
  // the bound may carry its own unit ("at most 100 kV (V, …)"): then the parenthetical's unit is not added
  [/^ must be at least (\S+)(?: ([^\s(]+))?(?: \(([^)]*)\))?$/, (l, m, k) => `${l} must be at least ${amount(m[1]!, k)}${m[2] ? ` ${m[2]}` : unitIn(m[3]) && !Object.hasOwn(LABELS, m[1]!) ? ` ${unitIn(m[3])}` : ''}: enter that or more.`],
  [/^ must be at most (\S+)(?: ([^\s(]+))?(?: \(([^)]*)\))?$/, (l, m, k) => `${l} must be at most ${amount(m[1]!, k)}${m[2] ? ` ${m[2]}` : unitIn(m[3]) ? ` ${unitIn(m[3])}` : ''}: enter that or less.`],
  [/^ must be above (\S+) and at most (\S+)(?: \(([^)]*)\))?$/, (l, m, k) => `${l} must be above ${amount(m[1]!, k)} and at most ${amount(m[2]!, k)}: enter a value in that range.`],
  [/^ must be at least (\S+) and at most (\S+)(?: \(([^)]*)\))?$/, (l, m, k) => `${l} must be from ${amount(m[1]!, k)} to ${amount(m[2]!, k)}: enter a value in that range.`],
]

const KEY_PATTERN = new RegExp(`\\b(?:(?:machineSide|gridSide|derating)\\.)?(${Object.keys(LABELS).filter(k => k.length > 4).sort((a, b) => b.length - a.length).join('|')})\\b`, 'g')

/** One validation message in plain words naming the field by its label (path: the machine path of the field). */
export function plainMessage(path: string, message: string): string {
  const key = keyOf(path)
  const label = labelOf(path)
  for (const [pattern, say] of ZOD_DEFAULTS) {
    const m = pattern.exec(message)
    if (m) return say(label, m, key)
  }
  // "<path or key> must …": the machine key at the start, then the schema's or engine's phrase.
  const lead = new RegExp(`^(?:[\\w.]*\\.)?${key.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}(?=\\s|:)`)
  const at = key ? lead.exec(message) : null
  if (at) {
    const rest = message.slice(at[0].length).replace(/^:/, '')
    for (const [pattern, say] of KEY_PHRASES) {
      const m = pattern.exec(rest)
      if (m) return say(label, m, key)
    }
    return `${label}${rest.startsWith(' ') ? '' : ' '}${rest.replace(KEY_PATTERN, (_, k: string) => `“${LABELS[k]!}”`)}`
  }
  // Any other machine key in the sentence ("… must be at least dcVoltage") becomes its label; a message
  // that does not name its field ("Enter a valid e-mail address") gets the label in front.
  const replaced = message.replace(KEY_PATTERN, (_, k: string) => `“${LABELS[k]!}”`)
  if (!key || replaced.toLowerCase().includes(label.toLowerCase())) return replaced.charAt(0).toUpperCase() + replaced.slice(1)
  return `${label}: ${replaced.charAt(0).toLowerCase()}${replaced.slice(1)}`
}

/** An issue list as the API sends it: machine path kept, message in plain words. */
export function plainIssues(issues: { path: string, message: string }[]): { path: string, message: string }[] {
  return issues.map(i => ({ path: i.path, message: plainMessage(i.path, i.message) }))
}

/** The one-line summary of the first issue, for a message shown away from the field. */
export function plainSummary(issue: { path: string, message: string } | undefined, fallback: string): string {
  if (!issue) return fallback
  const place = placeOf(issue.path)
  const text = plainMessage(issue.path, issue.message)
  return place ? `${place.charAt(0).toUpperCase()}${place.slice(1)}: ${text}` : text
}
