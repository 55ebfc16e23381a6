// Limits of a catalogue upload, one source for the server and the tests that measure them.
export const UPLOAD_LIMITS = { maxBytes: 10 * 1024 * 1024, maxRows: 20_000 }
