// The quote check: a quoted unit price far from the catalogue's is saved only once the user confirms it. Prices are
// typed in the shared quantity field (shared/utils/quantity.ts), which reads "12,50" in a decimal-comma locale as 12.5.

/** A quote this far from the catalogue price (either way) asks for confirmation. */
export const QUOTE_CONFIRM_FACTOR = 3

/** True when a quoted unit price is more than 3× above or below the catalogue price break (same currency only). */
export function quoteNeedsConfirmation(quoted: number, catalogue: number | null | undefined): boolean {
  if (catalogue == null || !(catalogue > 0) || !(quoted > 0)) return false
  return quoted > catalogue * QUOTE_CONFIRM_FACTOR || quoted < catalogue / QUOTE_CONFIRM_FACTOR
}
