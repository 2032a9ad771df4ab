/**
 * Headers for one user action that changes history (issue, decide, seal): a fresh Idempotency-Key,
 * so a retry of the same request is answered with the first result instead of acting twice.
 * getRandomValues, not randomUUID: the latter exists only in secure contexts.
 */
export function actionKeyHeaders() {
  const bytes = crypto.getRandomValues(new Uint8Array(16))
  return { 'Idempotency-Key': Array.from(bytes, b => b.toString(16).padStart(2, '0')).join('') }
}
