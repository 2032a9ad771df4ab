// Bundles the PDF rewrite's worker thread (worker.ts, with pdf-lib) into one file: at build time
// beside the built server (nuxt.config.ts), and in the unit tests that run it.
import { fileURLToPath } from 'node:url'

export async function buildRewriteWorker(outfile: string) {
  const { build } = await import('esbuild')
  await build({
    entryPoints: [fileURLToPath(new URL('./worker.ts', import.meta.url))],
    outfile,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    logLevel: 'warning',
  })
}
