/** The four roles of the product (design.md §2). */
export const ROLES = ['engineer', 'checker', 'records', 'admin'] as const
export type Role = (typeof ROLES)[number]

export const ROLE_LABELS: Record<Role, string> = {
  engineer: 'Engineer',
  checker: 'Checker',
  records: 'Records',
  admin: 'Administrator',
}

/** The roles a person holds on one project (design.md §7 "Access by project"): an administrator is never a member. */
export const PROJECT_ROLES = ['engineer', 'checker', 'records'] as const
export type ProjectRole = (typeof PROJECT_ROLES)[number]
