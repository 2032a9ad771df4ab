import { randomBytes } from 'node:crypto'
import type { H3Error, H3Event } from 'h3'
import { isConnectionLost } from './utils/db'

/**
 * Runs before Nuxt's own error handler and puts an error nobody answered for into words, so no
 * answer is a bare "Server Error": the database gone away is a 503 that says so; anything else
 * unexpected is a 500 with a reference to the line the server logs about it (never its details).
 * Errors the routes throw with createError keep their own status and message.
 */
export default function errorInWords(error: H3Error, event: H3Event) {
  const cause = error.cause ?? error
  if (isConnectionLost(cause) || isConnectionLost(error)) {
    error.statusCode = 503
    error.statusMessage = 'Database not answering'
    if (error.unhandled || !error.message || error.message === 'Server Error') {
      error.message = 'The database is not answering, so nothing was read or saved: try again in a moment'
    }
    error.unhandled = false
    return
  }
  if (error.statusCode === 404 && event.path.startsWith('/api/') && (error.fatal || error.unhandled || !error.message || error.message === 'Server Error')) {
    error.message = `There is no ${event.method} ${event.path.split('?')[0]} in Tendonbook's API`
    error.fatal = false
    error.unhandled = false
    return
  }
  if (error.unhandled) {
    const reference = randomBytes(4).toString('hex')
    console.error(`[error ${reference}] ${event.method} ${event.path}`, cause)
    error.message = `Something unexpected stopped this request on the server (reference ${reference}); the server's log has the details`
    error.unhandled = false
  }
}
