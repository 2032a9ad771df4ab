/**
 * The server listens on loopback (127.0.0.1) unless told otherwise: Nitro would take every
 * interface when neither HOST nor NITRO_HOST is set. Plugins run while the server entry loads,
 * before it reads these variables and listens, so setting the default here is enough.
 * An office that serves other machines sets HOST (e.g. 0.0.0.0) explicitly.
 */
export default defineNitroPlugin(() => {
  if (!process.env.NITRO_HOST && !process.env.HOST) process.env.NITRO_HOST = '127.0.0.1'
})
