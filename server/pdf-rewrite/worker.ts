// A worker thread of the PDF rewrite pool (piscina): one task at a time, the same code the server
// runs inline where there is no built worker. Bundled on its own at build time (nuxt.config.ts).
import { destinationPages, reproducibleBytes } from './rewrite'
import type { RewriteTask } from './task'

/** a thread of its own: pdf-lib need not hand the event loop back while it parses and writes */
const AT_ONCE = Number.POSITIVE_INFINITY

export default async function rewrite(task: RewriteTask) {
  if (task.kind === 'reproducible') return reproducibleBytes(task.bytes, task.meta, AT_ONCE)
  // a Map does not cross threads as one: its entries do
  return [...(await destinationPages(task.bytes, AT_ONCE))]
}
