// Where uploaded files are kept: a local folder by default, an S3-compatible bucket when configured.
import { join } from 'node:path'
import fsDriver from 'unstorage/drivers/fs'
import s3Driver from 'unstorage/drivers/s3'

export default defineNitroPlugin(() => {
  const c = useRuntimeConfig()
  const storage = useStorage()
  if (c.s3Bucket) {
    storage.mount('uploads', s3Driver({ bucket: c.s3Bucket, endpoint: c.s3Endpoint, region: c.s3Region, accessKeyId: c.s3AccessKeyId, secretAccessKey: c.s3SecretAccessKey }))
  }
  else {
    storage.mount('uploads', fsDriver({ base: c.uploadDir || join(process.cwd(), '.data', 'uploads') }))
  }
})
