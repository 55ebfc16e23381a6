/**
 * The locale numbers are typed and shown in (decimal mark of quantity fields). The server renders with
 * en-GB; once the page is live in the browser it follows the browser's language (plugins/input-locale.client.ts).
 */
export function useInputLocale() {
  return useState<string>('input-locale', () => 'en-GB')
}

/** Where a form collects its fields' refusals, so results from input that is now refused can be marked. */
export const quantityRefusalsKey = Symbol('quantity-refusals') as InjectionKey<(fieldId: string, refused: boolean) => void>
