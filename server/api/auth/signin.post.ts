import { randomBytes } from 'node:crypto'
import { eq } from 'drizzle-orm'
import { SIGNIN_FIELD_LABELS, signinSchema } from '../../../shared/schemas/auth'

// An unknown e-mail costs one password check too, against a hash of a random password, so the
// answer's timing does not tell which e-mails have accounts.
let unknownAccountHash: Promise<string> | undefined

export default defineEventHandler(async (event) => {
  const { email, password } = await validBody(event, signinSchema, SIGNIN_FIELD_LABELS)
  const address = clientAddress(event)
  await countSigninAttempt(event, email, address)

  const [user] = await useDb().select().from(tables.users).where(eq(tables.users.email, email)).limit(1)
  unknownAccountHash ??= hashPassword(randomBytes(24).toString('base64url'))
  const matches = await verifyPassword(user?.passwordHash ?? await unknownAccountHash, password)
  if (!user || !matches) {
    await recordAudit(event, { action: 'signin.failed', subject: email, actorId: user?.id ?? null })
    throw createError({ statusCode: 401, message: 'E-mail or password is not right' })
  }
  await signinSucceeded(email, address)
  if (user.disabled) {
    await recordAudit(event, { action: 'signin.refused', subject: email, actorId: user.id })
    throw createError({ statusCode: 403, message: 'This account is disabled; ask an administrator' })
  }
  await startSession(event, user)
  await recordAudit(event, { action: 'signin', subject: email, actorId: user.id })
  return { id: user.id, email: user.email, name: user.name, role: user.role }
})
