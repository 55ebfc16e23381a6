import type { z } from 'zod'
import { plainIssues } from '#shared/schemas/messages'

/** Field errors from the shared zod schema (before sending) and from the server's 4xx answer (after). */
export function useFormErrors() {
  const errors = ref<Record<string, string>>({})
  const message = ref('')

  function clear() {
    errors.value = {}
    message.value = ''
  }

  function setIssues(issues: { path: string, message: string }[]) {
    for (const i of issues) if (!errors.value[i.path]) errors.value[i.path] = i.message
  }

  function validate<T extends z.ZodType>(schema: T, value: unknown): value is z.infer<T> {
    const r = schema.safeParse(value)
    if (r.success) return true
    setIssues(plainIssues(r.error.issues.map(i => ({ path: i.path.join('.'), message: i.message }))))
    return false
  }

  function fromResponse(err: unknown) {
    const e = err as { data?: { message?: string, statusMessage?: string, data?: { issues?: { path: string, message: string }[] } } }
    const issues = e.data?.data?.issues
    if (issues?.length) setIssues(issues)
    message.value = e.data?.message ?? e.data?.statusMessage ?? 'Something went wrong. Please try again.'
  }

  return { errors, message, clear, validate, fromResponse }
}

/**
 * The submit handling forms share: clear the old errors, check the value with the shared zod schema, send it once
 * at a time (`busy` while sending) and show the server's answer beside the fields or above the button.
 */
export function useFormSubmit<T extends z.ZodType>(schema: T, value: () => unknown, send: (valid: z.infer<T>) => Promise<void>) {
  const { errors, message, clear, validate, fromResponse } = useFormErrors()
  const busy = ref(false)

  async function submit() {
    if (busy.value) return
    clear()
    const current = value()
    if (!validate(schema, current)) return
    busy.value = true
    try {
      await send(current)
    }
    catch (err) {
      fromResponse(err)
    }
    finally {
      busy.value = false
    }
  }

  return { errors, message, busy, submit, clear }
}
