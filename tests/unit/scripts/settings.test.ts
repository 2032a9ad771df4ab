import { resolve } from 'node:path'
import { describe, expect, it } from 'vitest'
// @ts-expect-error plain ES module without types
import { settings } from '../../../scripts/db.mjs'

const root = resolve(import.meta.dirname, '..', '..', '..')

describe('run settings from the environment', () => {
  it('keeps the documented defaults when nothing is set', () => {
    expect(settings(false, {})).toEqual({ base: resolve(root, '.data'), dbPort: 3406, mailPort: 2526, appPort: 3000 })
    expect(settings(true, {})).toEqual({ base: resolve(root, '.data-test'), dbPort: 3407, mailPort: 2527, appPort: 3100 })
  })

  it('takes every port and folder from its variable, so two runs can share a machine', () => {
    const env = { TENDONBOOK_TEST_DATA_DIR: '/tmp/tb-a', TENDONBOOK_TEST_DB_PORT: '4407', TENDONBOOK_TEST_MAIL_PORT: '4527', TENDONBOOK_TEST_APP_PORT: '4100' }
    expect(settings(true, env)).toEqual({ base: '/tmp/tb-a', dbPort: 4407, mailPort: 4527, appPort: 4100 })
    expect(settings(false, { PORT: '8080', TENDONBOOK_DB_PORT: '5406' })).toMatchObject({ appPort: 8080, dbPort: 5406 })
  })

  it('names the variable when a port is not a port', () => {
    expect(() => settings(true, { TENDONBOOK_TEST_DB_PORT: 'abc' })).toThrow('TENDONBOOK_TEST_DB_PORT must be a port number')
    expect(() => settings(false, { PORT: '70000' })).toThrow('PORT must be a port number')
  })
})
