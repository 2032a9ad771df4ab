import type { Role } from '../../shared/types/roles'

/** Demo sign-ins for the local demo only (printed by `npm start` and in the README). */
export const DEMO_USERS: Array<{ email: string, name: string, role: Role, password: string }> = [
  { email: 'engineer@tendonbook.local', name: 'Priya Natarajan', role: 'engineer', password: 'engineer-demo-2417' },
  { email: 'checker@tendonbook.local', name: 'Tomasz Wielgosz', role: 'checker', password: 'checker-demo-2417' },
  { email: 'records@tendonbook.local', name: 'Ruth Okafor', role: 'records', password: 'records-demo-2417' },
  { email: 'admin@tendonbook.local', name: 'Sam Keller', role: 'admin', password: 'admin-demo-2417!' },
]

export const DEMO_PROJECT = {
  jobNumber: '2417',
  name: 'Alder Yard podium',
  client: 'Alder Yard Developments (fictional)',
  site: 'Alder Yard, Northgate (fictional)',
}
