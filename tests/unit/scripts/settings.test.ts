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

describe('cluster settings from the environment', () => {
  it('keeps the documented loopback ports, takes lists from their variables and names a bad one', async () => {
    // @ts-expect-error plain ES module without types
    const { clusterSettings } = await import('../../../scripts/cluster.mjs')
    expect(clusterSettings({})).toEqual({
      base: resolve(root, '.data-cluster'), dbPorts: [7601, 7602, 7603], galeraPorts: [7611, 7612, 7613], istPorts: [7621, 7622, 7623],
      sstPorts: [7631, 7632, 7633], appPorts: [7701, 7702], s3Port: 7801, mailPort: 7901,
    })
    expect(clusterSettings({ TENDONBOOK_CLUSTER_DB_PORTS: '5601, 5602,5603', TENDONBOOK_CLUSTER_S3_PORT: '5801' })).toMatchObject({ dbPorts: [5601, 5602, 5603], s3Port: 5801 })
    expect(() => clusterSettings({ TENDONBOOK_CLUSTER_DB_PORTS: '5601,5602' })).toThrow('TENDONBOOK_CLUSTER_DB_PORTS must be 3 comma-separated port numbers from 1 to 65535')
  })
})
