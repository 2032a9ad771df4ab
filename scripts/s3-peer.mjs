// A local S3-compatible server (@20minutes/s3rver) on loopback for the cluster tests and for trying
// the S3 storage driver: one bucket, objects kept in a private folder. Never a hosted bucket.
import { mkdirSync } from 'node:fs'
import { createRequire } from 'node:module'

const require = createRequire(import.meta.url)

/** The fixed key pair the local server accepts (its built-in test account): loopback use only. */
export const LOCAL_S3_KEYS = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' }

export async function startS3Peer({ port, directory, bucket = 'tendonbook-records' }) {
  const S3rver = require('@20minutes/s3rver')
  mkdirSync(directory, { recursive: true })
  const server = new S3rver({ address: '127.0.0.1', port, directory, silent: true, vhostBuckets: false, configureBuckets: [{ name: bucket }] })
  await server.run()
  const endpoint = `http://127.0.0.1:${port}`
  return {
    endpoint,
    bucket,
    env: {
      NUXT_STORAGE_DRIVER: 's3',
      NUXT_STORAGE_ENDPOINT: endpoint,
      NUXT_STORAGE_BUCKET: bucket,
      NUXT_STORAGE_REGION: 'us-east-1',
      NUXT_STORAGE_ACCESS_KEY_ID: LOCAL_S3_KEYS.accessKeyId,
      NUXT_STORAGE_SECRET_ACCESS_KEY: LOCAL_S3_KEYS.secretAccessKey,
    },
    close: () => server.close(),
  }
}
