// gzip for API answers and server-rendered pages (zlib runs on libuv's thread pool, off the event loop).
// Static files are compressed once at build time (nitro.compressPublicAssets). Bodies under 1 KiB are
// sent as they are: compressing them makes them larger. Answers computed on the worker threads come
// encoded from there (server/workers/encode.ts, gzipped from 8 KiB): left alone here.
import { compress } from 'h3-compression'
import { COMPRESS_MIN_BYTES as MIN_BYTES } from '../workers/encode'

export default defineNitroPlugin((nitro) => {
  const apply = async (event: Parameters<typeof compress>[0], response: Parameters<typeof compress>[1]) => {
    if (event.path.startsWith('/_nuxt') || event.path.startsWith('/__nuxt')) return
    if (getResponseHeader(event, 'content-encoding') || event.context.encodedOnThread) return
    const type = String(getResponseHeader(event, 'content-type') ?? '')
    // PDFs, workbooks and other binaries are compressed already or gain little
    if (type && !/^(text\/|application\/(json|javascript|xml)|image\/svg)/.test(type)) return
    appendResponseHeader(event, 'Vary', 'Accept-Encoding')
    await compress(event, response, 'gzip', { minSize: MIN_BYTES })
  }
  nitro.hooks.hook('beforeResponse', apply)
  nitro.hooks.hook('render:response', (response, { event }) => apply(event, response as Parameters<typeof compress>[1]))
})
