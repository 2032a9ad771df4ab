import type { ProjectRole, Role } from '../../shared/types/roles'

/** The kinds of record a route can name by its `:id`, each of which belongs to one project. */
export const RECORD_KINDS = ['project', 'sheet', 'revision', 'review', 'attachment'] as const
export type RecordKind = (typeof RECORD_KINDS)[number]

/**
 * Who may call a route:
 * - `open`: anyone, signed in or not;
 * - `account`: a signed-in account whose office role is listed ('any' for every role); a route that
 *   lists records (`lists`) shows only the projects where the caller holds the project role named,
 *   and is open as well to whoever holds that role on some project (an engineer who checks one job
 *   has that job's check queue);
 * - `record`: the route names a record of one project by its `:id`; the caller must be a member of
 *   that project (else 404, as if there were no such record) in one of the project roles listed
 *   ('any' for every member; else 403). An administrator is never a member: engineering work is done
 *   under a member's own account, so the admin gets 403 here.
 */
export type AccessRule =
  | { who: 'open' }
  | { who: 'account', roles: readonly Role[] | 'any', lists?: ProjectRole | 'any' }
  | { who: 'record', record: RecordKind, roles: readonly ProjectRole[] | 'any' }

const open = (): AccessRule => ({ who: 'open' })
const account = (roles: readonly Role[] | 'any', lists?: ProjectRole | 'any'): AccessRule => ({ who: 'account', roles, lists })
const member = (record: RecordKind, roles: readonly ProjectRole[] | 'any' = 'any'): AccessRule => ({ who: 'record', record, roles })

/**
 * THE permission table: every route under server/api, by method and Nitro path, and who may call
 * it. `authorize()` (server/utils/access.ts) reads it on every request; a route missing here is
 * refused, and tests/integration/access.test.ts drives every row against every kind of caller.
 */
export const ACCESS_RULES = {
  'GET /api/health': open(),
  'POST /api/auth/signin': open(),
  'POST /api/auth/signout': open(),
  'GET /api/auth/me': account('any'),
  'POST /api/auth/signout-everywhere': account('any'),
  // the development mailbox shows the caller's own mail only
  'GET /api/mailbox': account('any'),

  // office-wide: templates and the office's details and logo
  'GET /api/templates': account('any'),
  'GET /api/templates/:id': account('any'),
  'POST /api/templates': account(['admin']),
  'GET /api/office-logo/:id': account('any'),
  'GET /api/admin/office': account(['admin']),
  'POST /api/admin/office': account(['admin']),

  // people and who works on which project
  'GET /api/admin/users': account(['admin']),
  'POST /api/admin/users': account(['admin']),
  'PATCH /api/admin/users/:id': account(['admin']),
  'GET /api/admin/projects': account(['admin']),
  'POST /api/admin/projects/:id/members': account(['admin']),
  'DELETE /api/admin/projects/:id/members/:userId': account(['admin']),

  // projects and calc sheets
  'GET /api/projects': account('any', 'any'),
  'POST /api/projects': account(['engineer']),
  'GET /api/projects/:id': member('project'),
  'POST /api/projects/:id/sheets': member('project', ['engineer']),
  'GET /api/sheets/:id': member('sheet'),
  'PUT /api/sheets/:id/draft': member('sheet', ['engineer']),
  'POST /api/sheets/:id/upgrade-template': member('sheet', ['engineer']),
  'GET /api/sheets/:id/attachments': member('sheet'),
  'POST /api/sheets/:id/attachments': member('sheet', ['engineer', 'checker']),
  'GET /api/attachments/:id': member('attachment'),

  // revisions, check and comments
  'GET /api/sheets/:id/revisions': member('sheet'),
  'POST /api/sheets/:id/revisions': member('sheet', ['engineer']),
  'GET /api/revisions/:id': member('revision'),
  'GET /api/revisions/:id/diff': member('revision'),
  'GET /api/revisions/:id/print': member('revision'),
  // a comment from anyone on the job but the records office; return and approve are the checker's (the service says so)
  'POST /api/revisions/:id/reviews': member('revision', ['engineer', 'checker']),
  'POST /api/reviews/:id/comment-state': member('review', ['checker']),
  'GET /api/checking/queue': account(['checker'], 'checker'),

  // records: seal, archive, verify, the history log
  'POST /api/revisions/:id/seal': member('revision', ['records']),
  'POST /api/revisions/:id/reseal-check': member('revision', ['records']),
  'GET /api/revisions/:id/seal-progress': member('revision', ['records']),
  'GET /api/revisions/:id/pdf': member('revision'),
  'GET /api/archive': account(['records'], 'records'),
  'GET /api/archive/export.csv': account(['records'], 'records'),
  'POST /api/verify': account(['records'], 'records'),
  'POST /api/chain/verify': account(['records']),
  'GET /api/log': account(['records']),
  'GET /api/log/export': account(['records'], 'records'),

  // the site's view of an approved revision, by the verification reference on its PDF: any member of its project
  'GET /api/site/:reference': account('any', 'any'),
} as const satisfies Record<string, AccessRule>

export type RouteKey = keyof typeof ACCESS_RULES
