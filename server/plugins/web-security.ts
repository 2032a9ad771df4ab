import { randomBytes } from 'node:crypto'

/**
 * Security headers on every response (pages, API, files, assets), and a Content-Security-Policy
 * that runs no inline script: Nuxt's own inline script (the runtime config) gets a nonce that is
 * new for every page, and nothing else inline may run. Styles may be inline (KaTeX's sizes and
 * CodeMirror's injected sheets are inline styles, not code). Nothing may frame the product.
 *
 * nuxt-security does this too, but its current release declares Node 24; this is the same idea in
 * a few lines. `npm run dev` keeps the headers but drops the CSP, which Vite's hot reload breaks.
 */
export function contentSecurityPolicy(nonce: string) {
  return [
    `default-src 'self'`,
    `script-src 'self' 'nonce-${nonce}'`,
    `style-src 'self' 'unsafe-inline'`,
    `img-src 'self' data: blob:`,
    `font-src 'self' data:`,
    `connect-src 'self'`,
    `worker-src 'self' blob:`,
    `object-src 'none'`,
    `base-uri 'none'`,
    `form-action 'self'`,
    `frame-ancestors 'none'`,
  ].join('; ')
}

export const SECURITY_HEADERS = {
  'x-content-type-options': 'nosniff',
  'x-frame-options': 'DENY',
  'referrer-policy': 'same-origin',
  'cross-origin-opener-policy': 'same-origin',
  'cross-origin-resource-policy': 'same-origin',
  'permissions-policy': 'camera=(), microphone=(), geolocation=(), payment=(), usb=()',
} as const

export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('request', (event) => {
    const nonce = randomBytes(16).toString('base64')
    event.context.cspNonce = nonce
    setResponseHeaders(event, SECURITY_HEADERS)
    if (!import.meta.dev) setResponseHeader(event, 'content-security-policy', contentSecurityPolicy(nonce))
  })

  // the inline <script> tags Nuxt itself writes around the page (its config; the payload is JSON, not
  // code) carry the nonce; the rendered page (html.body) never does, so markup that slipped into a
  // report could not run even if it were a script
  nitroApp.hooks.hook('render:html', (html, { event }) => {
    const nonce = event.context.cspNonce
    if (!nonce) return
    const stamp = (parts: string[]) => parts.map(part => part.replace(/<script(?![^>]*\b(?:nonce|src)=)/g, `<script nonce="${nonce}"`))
    html.head = stamp(html.head)
    html.bodyPrepend = stamp(html.bodyPrepend)
    html.bodyAppend = stamp(html.bodyAppend)
  })
})

declare module 'h3' {
  interface H3EventContext {
    cspNonce?: string
  }
}
