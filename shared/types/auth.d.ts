import type { Role } from './roles'

declare module '#auth-utils' {
  interface User {
    id: number
    email: string
    name: string
    role: Role
  }
  interface UserSession {
    /** the user's session version when the session was made; a mismatch ends the session */
    sv: number
    signedInAt: string
  }
  interface SecureSessionData {
    /** the user_sessions row this cookie stands for (server-side only); signing out closes it */
    sid: string
  }
}

export {}
