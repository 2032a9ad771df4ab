import { request } from 'node:http'
import { describe, expect, inject, it } from 'vitest'
import { ApiClient, DEMO, signedIn, unique } from '../helpers/client'
import { countRows } from '../helpers/db'

describe('sign-in and roles', () => {
  it('signs in a demo user and reports who is signed in', async () => {
    const client = await signedIn('engineer')
    const me = await client.get('/api/auth/me')
    expect(me.status).toBe(200)
    expect(me.body).toMatchObject({ email: DEMO.engineer.email, role: 'engineer' })
  })

  it('refuses a wrong password without saying which part was wrong', async () => {
    const client = new ApiClient()
    const res = await client.post('/api/auth/signin', { email: DEMO.checker.email, password: 'not-the-password' })
    expect(res.status).toBe(401)
    expect(res.body.message).toMatch(/e-mail or password/i)
  })

  it('names the field when the sign-in body is bad', async () => {
    const res = await new ApiClient().post('/api/auth/signin', { email: 'not-an-address', password: '' })
    expect(res.status).toBe(400)
    expect(res.body.data.fields).toHaveProperty('email')
    expect(res.body.data.fields).toHaveProperty('password')
  })

  it('refuses protected data without a session', async () => {
    const res = await new ApiClient().get('/api/projects')
    expect(res.status).toBe(401)
  })

  it('refuses an admin route to an engineer with 403', async () => {
    const client = await signedIn('engineer')
    const res = await client.get('/api/admin/users')
    expect(res.status).toBe(403)
    expect(res.body.message).toMatch(/administrator role; you are signed in as an engineer/)
  })

  it('lets an admin create a user who can then sign in; short passwords are refused', async () => {
    const admin = await signedIn('admin')
    const email = `${unique('person')}@example.test`
    const short = await admin.post('/api/admin/users', { email, name: 'Short Password', role: 'checker', password: 'elevenchars' })
    expect(short.status).toBe(400)
    expect(short.body.data.fields.password).toMatch(/12 characters/)
    expect(await countRows('users', 'email = ?', [email])).toBe(0)

    const created = await admin.post('/api/admin/users', { email, name: 'New Checker', role: 'checker', password: 'a-long-enough-password' })
    expect(created.status).toBe(201)
    const person = new ApiClient()
    await person.signIn(email, 'a-long-enough-password')
    expect((await person.get('/api/auth/me')).body.role).toBe('checker')
  })

  it('ends open sessions at once when a role changes or the user is disabled', async () => {
    const admin = await signedIn('admin')
    const email = `${unique('revoke')}@example.test`
    const created = await admin.post('/api/admin/users', { email, name: 'Soon Revoked', role: 'engineer', password: 'a-long-enough-password' })
    const person = new ApiClient()
    await person.signIn(email, 'a-long-enough-password')
    expect((await person.get('/api/projects')).status).toBe(200)

    await admin.patch(`/api/admin/users/${created.body.id}`, { role: 'checker' })
    expect((await person.get('/api/projects')).status).toBe(401)

    await person.signIn(email, 'a-long-enough-password')
    expect((await person.get('/api/auth/me')).body.role).toBe('checker')
    await admin.patch(`/api/admin/users/${created.body.id}`, { disabled: true })
    expect((await person.get('/api/projects')).status).toBe(401)
    const again = await person.post('/api/auth/signin', { email, password: 'a-long-enough-password' })
    expect(again.status).toBe(403)
    expect(again.body.message).toMatch(/disabled/)
  })

  it('rate-limits failed sign-ins per account with a clear 429', async () => {
    const admin = await signedIn('admin')
    const email = `${unique('limited')}@example.test`
    await admin.post('/api/admin/users', { email, name: 'Often Mistyped', role: 'engineer', password: 'a-long-enough-password' })
    const client = new ApiClient()
    for (let i = 0; i < 5; i++) {
      expect((await client.post('/api/auth/signin', { email, password: `wrong-${i}` })).status).toBe(401)
    }
    const blocked = await client.post('/api/auth/signin', { email, password: 'a-long-enough-password' })
    expect(blocked.status).toBe(429)
    expect(blocked.body.message).toMatch(/Too many failed sign-in attempts for this account\. Try again in \d+ minutes?/)
    expect(blocked.headers.get('retry-after')).toMatch(/^\d+$/)
  })

  it('refuses a state change from another site', async () => {
    const client = await signedIn('engineer')
    const res = await client.request('POST', '/api/projects', { jobNumber: unique('X'), name: 'Cross site' }, { origin: 'http://evil.example' })
    expect(res.status).toBe(403)
  })
})

/** A JSON request from another loopback address (127.0.0.x): a person elsewhere on the network. */
function fromAddress(localAddress: string, method: string, path: string, body?: unknown, cookie?: string): Promise<{ status: number, body: any, cookie: string }> {
  const url = new URL(inject('baseUrl'))
  const data = body === undefined ? undefined : JSON.stringify(body)
  return new Promise((done, fail) => {
    const req = request({ host: url.hostname, port: url.port, localAddress, method, path, agent: false, headers: { ...(method !== 'GET' ? { origin: url.origin } : {}), ...(data ? { 'content-type': 'application/json', 'content-length': Buffer.byteLength(data) } : {}), ...(cookie ? { cookie } : {}) } }, (res) => {
      let text = ''
      res.on('data', (c: Buffer) => { text += c.toString() })
      res.on('end', () => {
        let parsed: unknown = text
        try {
          parsed = JSON.parse(text)
        }
        catch {}
        done({ status: res.statusCode ?? 0, body: parsed, cookie: (res.headers['set-cookie'] ?? []).map(l => l.split(';')[0]!).join('; ') })
      })
    })
    req.on('error', fail)
    req.end(data)
  })
}

async function newPerson(prefix: string) {
  const admin = await signedIn('admin')
  const email = `${unique(prefix)}@example.test`
  await admin.post('/api/admin/users', { email, name: 'Person Under Test', role: 'engineer', password: 'a-long-enough-password' })
  return email
}

describe('signing out', () => {
  it('ends the session on the server: the cookie replayed after sign-out neither reads nor writes', async () => {
    const email = await newPerson('signout')
    const signin = await fromAddress('127.0.0.1', 'POST', '/api/auth/signin', { email, password: 'a-long-enough-password' })
    expect(signin.status).toBe(200)
    const cookie = signin.cookie
    expect((await fromAddress('127.0.0.1', 'GET', '/api/auth/me', undefined, cookie)).status).toBe(200)
    expect((await fromAddress('127.0.0.1', 'POST', '/api/auth/signout', {}, cookie)).status).toBe(200)
    const read = await fromAddress('127.0.0.1', 'GET', '/api/projects', undefined, cookie)
    expect(read.status).toBe(401)
    expect(read.body.message).toMatch(/session has ended/)
    const write = await fromAddress('127.0.0.1', 'POST', '/api/projects', { jobNumber: unique('SO'), name: 'Written after sign-out' }, cookie)
    expect(write.status).toBe(401)
    expect(await countRows('projects', 'name = ?', ['Written after sign-out'])).toBe(0)
    // signing out twice is harmless
    expect((await fromAddress('127.0.0.1', 'POST', '/api/auth/signout', {}, cookie)).status).toBe(200)
  })

  it('signs out everywhere: every session of the user ends, other people\'s do not', async () => {
    const email = await newPerson('everywhere')
    const laptop = new ApiClient()
    const phone = new ApiClient()
    await laptop.signIn(email, 'a-long-enough-password')
    await phone.signIn(email, 'a-long-enough-password')
    const someoneElse = await signedIn('checker')
    expect((await phone.get('/api/projects')).status).toBe(200)
    expect((await laptop.post('/api/auth/signout-everywhere')).status).toBe(200)
    expect((await phone.get('/api/projects')).status).toBe(401)
    expect((await laptop.get('/api/projects')).status).toBe(401)
    expect((await someoneElse.get('/api/projects')).status).toBe(200)
    await phone.signIn(email, 'a-long-enough-password')
    expect((await phone.get('/api/projects')).status).toBe(200)
  })
})

describe('the sign-in limit', () => {
  it('lets 30 concurrent wrong passwords reach the password check only 5 times', async () => {
    const email = await newPerson('race')
    const answers = await Promise.all(Array.from({ length: 30 }, (_, i) => fromAddress('127.0.0.3', 'POST', '/api/auth/signin', { email, password: `wrong-${i}` })))
    const statuses = answers.map(a => a.status)
    expect(statuses.filter(s => s === 401)).toHaveLength(5)
    expect(statuses.filter(s => s === 429)).toHaveLength(25)
    // one failed-sign-in audit event per password actually checked
    expect(await countRows('audit_events', 'action = ? AND subject = ?', ['signin.failed', email])).toBe(5)
  })

  it('lets 40 people sign in at once: each gets in, and the history keeps every sign-in', async () => {
    // every audited action appends to the one history log and publishes a signed head under a lock;
    // the request holding that lock must never wait for a pooled connection held by one waiting for it
    const people = await Promise.all(Array.from({ length: 4 }, (_, i) => newPerson(`crowd${i}`)))
    const answers = await Promise.all(Array.from({ length: 40 }, (_, i) => fromAddress(`127.0.4.${i + 2}`, 'POST', '/api/auth/signin', { email: people[i % 4], password: 'a-long-enough-password' })))
    expect(answers.filter(a => a.status !== 200).map(a => `${a.status} ${JSON.stringify(a.body).slice(0, 120)}`)).toEqual([])
    expect(await countRows('audit_events', 'action = ? AND subject IN (?, ?, ?, ?)', ['signin', ...people])).toBe(40)
  }, 120_000)

  it('counts per account and address: a stranger elsewhere cannot lock the owner out', async () => {
    const email = await newPerson('stranger')
    for (let i = 0; i < 6; i++) await fromAddress('127.0.0.5', 'POST', '/api/auth/signin', { email, password: `guess-${i}` })
    const stranger = await fromAddress('127.0.0.5', 'POST', '/api/auth/signin', { email, password: 'a-long-enough-password' })
    expect(stranger.status).toBe(429)
    const owner = await fromAddress('127.0.0.6', 'POST', '/api/auth/signin', { email, password: 'a-long-enough-password' })
    expect(owner.status).toBe(200)
  })

  it('does the same work for an unknown e-mail as for a known one', async () => {
    const email = await newPerson('timing')
    const time = async (who: string) => {
      const started = performance.now()
      const res = await fromAddress('127.0.0.7', 'POST', '/api/auth/signin', { email: who, password: 'not-the-password' })
      expect(res.status).toBe(401)
      return performance.now() - started
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!
    const known: number[] = []
    const unknown: number[] = []
    for (let i = 0; i < 4; i++) {
      known.push(await time(email))
      unknown.push(await time(`${unique('nobody')}@example.test`))
    }
    // a password hash (scrypt) costs tens of milliseconds; an unknown e-mail without one costs a few
    expect(median(unknown)).toBeGreaterThan(median(known) * 0.4)
  })
})
