/**
 * The locale numbers are typed and shown in (decimal mark of quantity fields): the user's chosen locale, else the
 * company default, as the session answer names it (composables/useLocale.ts), the same on the server and in the browser.
 */
export function useInputLocale() {
  return useLocale()
}

/** Where a form collects its fields' refusals, so results from input that is now refused can be marked. */
export const quantityRefusalsKey = Symbol('quantity-refusals') as InjectionKey<(fieldId: string, refused: boolean) => void>
