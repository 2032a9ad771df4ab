// A small HTTP client for integration tests that keeps the session cookie like a browser would.
import { inject } from 'vitest'

export interface ApiResponse<T = unknown> {
  status: number
  body: T
  headers: Headers
}

export class ApiClient {
  private cookies = new Map<string, string>()
  constructor(readonly baseUrl: string = inject('baseUrl')) {}

  /** Issues a revision of the sheet as it is saved now, naming its current draft version as the editor does; answers with the revision issued. */
  async issue<T = any>(sheetId: number, body: Record<string, unknown> = {}): Promise<ApiResponse<T>> {
    const sheet = await this.request<{ draftVersion: number }>('GET', `/api/sheets/${sheetId}`)
    const issued = await this.request('POST', `/api/sheets/${sheetId}/revisions`, { draftVersion: sheet.body.draftVersion, ...body })
    if (issued.status !== 201) return issued as ApiResponse<T>
    // the issue answers { id, code, contentHash }; the revision itself reads from its own route
    const { id, code, contentHash } = issued.body as { id: number, code: string, contentHash: string }
    if (Object.keys(issued.body as object).length !== 3 || !id || !code || !contentHash) throw new Error(`an issue answered ${JSON.stringify(issued.body).slice(0, 200)}, not { id, code, contentHash }`)
    return { ...(await this.request<T>('GET', `/api/revisions/${id}`)), status: 201 }
  }

  async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<ApiResponse<T>> {
    const res = await fetch(`${this.baseUrl}${path}`, {
      method,
      headers: {
        // the browser sends its page's origin with every request that changes something
        ...(method !== 'GET' && method !== 'HEAD' ? { origin: this.baseUrl } : {}),
        ...(body !== undefined ? { 'content-type': 'application/json' } : {}),
        ...(this.cookies.size ? { cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ') } : {}),
        ...headers,
      },
      body: body !== undefined ? JSON.stringify(body) : undefined,
      redirect: 'manual',
    })
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';')
      const [name, ...rest] = pair!.split('=')
      const value = rest.join('=')
      if (value === '' || /max-age=0/i.test(line) || /expires=thu, 01 jan 1970/i.test(line)) this.cookies.delete(name!.trim())
      else this.cookies.set(name!.trim(), value)
    }
    const text = await res.text()
    let parsed: unknown = text
    try {
      parsed = JSON.parse(text)
    }
    catch {}
    return { status: res.status, body: parsed as T, headers: res.headers }
  }

  get<T = any>(path: string) { return this.request<T>('GET', path) }
  post<T = any>(path: string, body?: unknown) { return this.request<T>('POST', path, body ?? {}) }
  patch<T = any>(path: string, body?: unknown) { return this.request<T>('PATCH', path, body ?? {}) }

  async signIn(email: string, password: string) {
    const res = await this.post('/api/auth/signin', { email, password })
    if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`)
    return res.body as { id: number, role: string }
  }
}

export const DEMO = {
  engineer: { email: 'engineer@tendonbook.local', password: 'engineer-demo-2417' },
  checker: { email: 'checker@tendonbook.local', password: 'checker-demo-2417' },
  records: { email: 'records@tendonbook.local', password: 'records-demo-2417' },
  admin: { email: 'admin@tendonbook.local', password: 'admin-demo-2417!' },
} as const

export async function signedIn(role: keyof typeof DEMO) {
  const client = new ApiClient()
  await client.signIn(DEMO[role].email, DEMO[role].password)
  return client
}

let seq = 0
/** A unique suffix per test run, so tests can share one database without colliding. */
export function unique(prefix: string) {
  seq += 1
  return `${prefix}${Date.now().toString(36)}${seq}`
}
