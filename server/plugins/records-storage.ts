import fsDriver from 'unstorage/drivers/fs'
import s3Driver from 'unstorage/drivers/s3'

/**
 * Mounts the 'records' storage: the fs driver under runtimeConfig.storage.base (.data/files
 * locally), or S3 when runtimeConfig.storage.driver is 's3' (endpoint, bucket, region and keys
 * from runtimeConfig.storage, so production needs only settings).
 */
export default defineNitroPlugin(() => {
  const config = useRuntimeConfig().storage as Record<string, string>
  const driver = config.driver === 's3'
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
