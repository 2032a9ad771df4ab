import { eq } from 'drizzle-orm'
import { signinSchema } from '../../../shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const { email, password } = await validBody(event, signinSchema)
  const address = clientAddress(event)
  await assertSigninAllowed(event, email, address)

  const [user] = await useDb().select().from(tables.users).where(eq(tables.users.email, email)).limit(1)
  const ok = user ? await verifyPassword(user.passwordHash, password) : false
  await recordSigninAttempt(email, address, ok && !user?.disabled)
  if (!user || !ok) {
    await recordAudit(event, { action: 'signin.failed', subject: email, actorId: user?.id ?? null })
    throw createError({ statusCode: 401, message: 'E-mail or password is not right' })
  }
  if (user.disabled) {
    await recordAudit(event, { action: 'signin.refused', subject: email, actorId: user.id })
    throw createError({ statusCode: 403, message: 'This account is disabled; ask an administrator' })
  }
  // ASVS 7.2.4: a new session on every sign-in
  await clearUserSession(event)
  await setUserSession(event, {
    user: { id: user.id, email: user.email, name: user.name, role: user.role },
    sv: user.sessionVersion,
    signedInAt: new Date().toISOString(),
  })
  await recordAudit(event, { action: 'signin', subject: email, actorId: user.id })
  return { id: user.id, email: user.email, name: user.name, role: user.role }
})
