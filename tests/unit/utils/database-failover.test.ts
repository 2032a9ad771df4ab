import { describe, expect, it, vi } from 'vitest'

// withRetry answers in the user's words through h3's createError, a Nitro auto-import
vi.stubGlobal('createError', (input: { statusCode: number, message: string }) => Object.assign(new Error(input.message), input))
const { databaseHosts, isConnectionLost, isWriteConflict, withRetry } = await import('../../../server/utils/db')

const wrapped = (cause: object) => Object.assign(new Error('Failed query: commit'), { cause })

describe('the database host list', () => {
  it('reads "host:port,host:port" in order of preference, else the single host and port', () => {
    expect(databaseHosts({ host: '127.0.0.1', port: 3406, hosts: ' 127.0.0.1:7602, 127.0.0.1:7603,127.0.0.1:7601 ' }))
      .toEqual([{ host: '127.0.0.1', port: 7602 }, { host: '127.0.0.1', port: 7603 }, { host: '127.0.0.1', port: 7601 }])
    expect(databaseHosts({ host: 'db.local', port: '3406', hosts: '' })).toEqual([{ host: 'db.local', port: 3406 }])
    expect(databaseHosts({ host: 'x', port: 3406, hosts: 'db2' })).toEqual([{ host: 'db2', port: 3406 }])
    expect(() => databaseHosts({ host: 'x', port: 3406, hosts: 'db2:port' })).toThrow('database.hosts: "db2:port" is not host:port')
  })

  it('tells a lost write conflict (1213, also wrapped by Drizzle) from a lost connection', () => {
    expect(isWriteConflict(wrapped({ code: 'ER_LOCK_DEADLOCK', errno: 1213 }))).toBe(true)
    expect(isWriteConflict(wrapped({ code: 'ER_DUP_ENTRY', errno: 1062 }))).toBe(false)
    expect(isConnectionLost(wrapped({ code: 'ECONNREFUSED' }))).toBe(true)
    expect(isConnectionLost(wrapped({ code: 'ER_UNKNOWN_COM_ERROR', errno: 1047 }))).toBe(true)
    expect(isConnectionLost(wrapped({ code: 'PROTOCOL_CONNECTION_LOST' }))).toBe(true)
    expect(isConnectionLost(wrapped({ code: 'ER_LOCK_DEADLOCK', errno: 1213 }))).toBe(false)
  })
})

describe('withRetry', () => {
  it('runs the work again after a write conflict and returns its result', async () => {
    let calls = 0
    const result = await withRetry(async () => {
      calls += 1
      if (calls < 3) throw wrapped({ code: 'ER_LOCK_DEADLOCK', errno: 1213 })
      return 'P02'
    }, 'try again')
    expect(result).toBe('P02')
    expect(calls).toBe(3)
  })

  it('answers 409 in the given words when the conflicts go on, and passes any other error through at once', async () => {
    let calls = 0
    const lost = await withRetry(async () => {
      calls += 1
      throw wrapped({ code: 'ER_LOCK_DEADLOCK', errno: 1213 })
    }, 'Someone else issued this sheet a moment ago', 3).catch((e: unknown) => e as { statusCode: number, message: string })
    expect(calls).toBe(3)
    expect(lost).toMatchObject({ statusCode: 409, message: 'Someone else issued this sheet a moment ago' })

    calls = 0
    const other = await withRetry(async () => {
      calls += 1
      throw wrapped({ code: 'ER_DUP_ENTRY', errno: 1062 })
    }, 'x').catch((e: unknown) => e as Error)
    expect(calls).toBe(1)
    expect(other.message).toBe('Failed query: commit')
  })
})
