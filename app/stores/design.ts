// The design being edited: its inputs, the live results for them, and saving with conflict detection.
import { defineStore } from 'pinia'
import type { DesignInput, DesignResult, OperatingPoint } from '#shared/engine/types'
import type { DesignPreview } from '#shared/types/design'

export const operatingPointPresets: Record<string, (rated: OperatingPoint) => OperatingPoint> = {
  'Rated motoring': r => ({ ...r, name: 'Rated motoring' }),
  'Regenerative braking': r => ({ ...r, name: 'Regenerative braking', powerFactor: -Math.abs(r.powerFactor) }),
  'Low-frequency start': r => ({ ...r, name: 'Low-frequency start', lineVoltageRms: Math.round(r.lineVoltageRms * 0.1), fundamentalHz: Math.max(1, r.fundamentalHz * 0.1), phaseCurrentRms: Math.round(r.phaseCurrentRms * 1.5), powerFactor: 0.3 }),
}

export interface DesignDraft {
  name: string
  description: string
  input: DesignInput
}

export function blankDesign(): DesignDraft {
  return {
    name: '',
    description: '',
    input: {
      machineSide: {
        topology: 'diode-clamped',
        levels: 3,
        dcVoltage: 1100,
        dcVoltageMax: 1250,
        switchingHz: 4000,
        modulation: 'space-vector',
        overshootVoltage: 100,
        operatingPoints: [{ name: 'Rated motoring', lineVoltageRms: 690, phaseCurrentRms: 400, powerFactor: 0.86, fundamentalHz: 50 }],
      },
    },
  }
}

interface FieldIssue { path: string, message: string }

export const useDesignStore = defineStore('design', () => {
  const id = ref<number | null>(null)
  const revision = ref(0)
  const name = ref('')
  const description = ref('')
  const input = ref<DesignInput>(blankDesign().input)
  // Replaced whole by every answer, never changed inside: shallow, so the browser does not wrap the answer's
  // thousands of figures in reactive proxies while the page hydrates and on every edit.
  const preview = shallowRef<DesignPreview | null>(null)
  const evaluating = ref(false)
  const evaluationError = ref('')
  const fieldErrors = ref<Record<string, string>>({})
  // Fields whose typed text was refused in the browser (the model keeps the last good value).
  const refusedFields = ref<string[]>([])
  const saving = ref(false)
  const saveError = ref('')
  const conflict = ref<{ currentRevision: number } | null>(null)
  // Unsaved = differs from what was last loaded or saved (a reload after saving is not an edit).
  const baseline = ref('')
  const snapshot = () => JSON.stringify({ n: name.value, d: description.value, i: input.value })
  const dirty = computed(() => snapshot() !== baseline.value)
  let sequence = 0
  /** The operating point whose waveform and spectrum the results show, per side, and whether at every sample. */
  const shownPoint = ref<Record<'machine' | 'grid', number>>({ machine: 0, grid: 0 })
  const fullResolution = ref(false)

  const result = computed<DesignResult | null>(() => preview.value?.result ?? null)
  /** The results on screen belong to input that is now refused (by a field or by the server). */
  const outOfDate = computed(() => !!preview.value && (refusedFields.value.length > 0 || !!evaluationError.value))

  function setRefused(fieldId: string, refused: boolean) {
    const has = refusedFields.value.includes(fieldId)
    if (refused && !has) refusedFields.value = [...refusedFields.value, fieldId]
    else if (!refused && has) refusedFields.value = refusedFields.value.filter(f => f !== fieldId)
  }

  function reset(from = blankDesign(), designId: number | null = null, designRevision = 0) {
    id.value = designId
    revision.value = designRevision
    name.value = from.name
    description.value = from.description
    input.value = structuredClone(toRaw(from.input))
    preview.value = null
    shownPoint.value = { machine: 0, grid: 0 }
    fullResolution.value = false
    fieldErrors.value = {}
    refusedFields.value = []
    evaluationError.value = ''
    saveError.value = ''
    conflict.value = null
    baseline.value = snapshot()
  }

  function issuesToFields(issues: FieldIssue[] | undefined) {
    const map: Record<string, string> = {}
    for (const i of issues ?? []) map[i.path.replace(/^input\./, '')] ??= i.message
    fieldErrors.value = map
  }

  /** The results query: the chosen points (kept within the points the form has now) and the resolution. */
  function view() {
    const within = (i: number, count = 1) => Math.min(Math.max(0, i), Math.max(0, count - 1))
    shownPoint.value = {
      machine: within(shownPoint.value.machine, input.value.machineSide.operatingPoints.length),
      grid: within(shownPoint.value.grid, input.value.gridSide?.operatingPoints.length),
    }
    return { machinePoint: shownPoint.value.machine, gridPoint: shownPoint.value.grid, ...(fullResolution.value ? { resolution: 'full' } : {}) }
  }

  /** Shows another operating point's waveform and spectrum (or every sample of them) and asks the server for it. */
  function showPoint(side: 'machine' | 'grid', index: number) {
    shownPoint.value = { ...shownPoint.value, [side]: index }
    return evaluate()
  }
  function showFullResolution(full: boolean) {
    fullResolution.value = full
    return evaluate()
  }

  /** Evaluates the current inputs on the server; a newer request wins over an older answer. */
  async function evaluate() {
    const mine = ++sequence
    evaluating.value = true
    try {
      const r = await $fetch<DesignPreview>('/api/designs/preview', { method: 'POST', body: toRaw(input.value), query: view() })
      if (mine !== sequence) return
      preview.value = r
      evaluationError.value = ''
      fieldErrors.value = {}
    }
    catch (err) {
      if (mine !== sequence) return
      const e = err as { data?: { message?: string, data?: { issues?: FieldIssue[] } } }
      evaluationError.value = e.data?.message ?? 'The results could not be computed.'
      issuesToFields(e.data?.data?.issues)
    }
    finally {
      if (mine === sequence) evaluating.value = false
    }
  }

  async function save(): Promise<number | null> {
    saving.value = true
    saveError.value = ''
    conflict.value = null
    try {
      const body = { name: name.value, description: description.value, input: toRaw(input.value) }
      const saved = id.value
        ? await $fetch<{ id: number, revision: number }>(`/api/designs/${id.value}`, { method: 'PUT', body: { ...body, revision: revision.value } })
        : await $fetch<{ id: number, revision: number }>('/api/designs', { method: 'POST', body })
      id.value = saved.id
      revision.value = saved.revision
      baseline.value = snapshot()
      return saved.id
    }
    catch (err) {
      const e = err as { statusCode?: number, data?: { message?: string, data?: { issues?: FieldIssue[], currentRevision?: number } } }
      saveError.value = e.data?.message ?? 'Saving failed.'
      if (e.statusCode === 409 && e.data?.data?.currentRevision) conflict.value = { currentRevision: e.data.data.currentRevision }
      const issues = e.data?.data?.issues
      if (issues) {
        issuesToFields(issues)
        if (issues.some(i => i.path === 'name')) fieldErrors.value.name = issues.find(i => i.path === 'name')!.message
      }
      return null
    }
    finally {
      saving.value = false
    }
  }

  return { id, revision, name, description, input, preview, result, outOfDate, shownPoint, fullResolution, showPoint, showFullResolution, refusedFields, setRefused, evaluating, evaluationError, fieldErrors, saving, saveError, conflict, dirty, reset, evaluate, save }
})
