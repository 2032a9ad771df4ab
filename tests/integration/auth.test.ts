import { describe, expect, it } from 'vitest'
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
    expect(res.body.message).toMatch(/admin role/)
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
