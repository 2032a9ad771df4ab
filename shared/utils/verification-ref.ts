/**
 * Short reference printed on a sealed PDF and typed back to verify it or to open its site
 * schedules: TB-XXXX-XXXX-XXXX, from the revision's content hash (the PDF's own hash cannot be
 * printed inside it).
 */
export function verificationRef(contentHash: string): string {
  const h = contentHash.slice(0, 12).toUpperCase()
  return `TB-${h.slice(0, 4)}-${h.slice(4, 8)}-${h.slice(8, 12)}`
}
