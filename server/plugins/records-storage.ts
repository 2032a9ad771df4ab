import fsDriver from 'unstorage/drivers/fs'

/**
 * Mounts the 'records' storage: the fs driver under runtimeConfig.storage.base (.data/files
 * locally), or S3 when runtimeConfig.storage.driver is 's3' (endpoint, bucket, region and keys
 * from runtimeConfig.storage, so production needs only settings).
 */
export default defineNitroPlugin(async () => {
  const config = useRuntimeConfig().storage as Record<string, string>
  // loaded only when chosen: the S3 driver needs the aws4fetch package, which local installs lack
  const s3Driver = config.driver === 's3' ? (await import('unstorage/drivers/s3')).default : null
  const driver = s3Driver
    ? s3Driver({
        endpoint: config.endpoint ?? '',
        bucket: config.bucket ?? '',
        region: config.region ?? 'auto',
        accessKeyId: config.accessKeyId ?? '',
        secretAccessKey: config.secretAccessKey ?? '',
      })
    : fsDriver({ base: config.base || '.data/files' })
  useStorage().mount('records', driver)
})
