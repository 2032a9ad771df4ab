// What the server's thread asks of a PDF rewrite worker (server/pdf-rewrite/worker.ts).
import type { FixedMetadata } from './rewrite'

/** The worker's file name, beside the built server's entry (written at build time, see nuxt.config.ts). */
export const PDF_REWRITE_WORKER = 'pdf-rewrite-worker.mjs'

export type RewriteTask =
  | { kind: 'reproducible', bytes: Uint8Array, meta: FixedMetadata }
  | { kind: 'destinations', bytes: Uint8Array }
