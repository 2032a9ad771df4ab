/** The four roles of the product (design.md §2). */
export const ROLES = ['engineer', 'checker', 'records', 'admin'] as const
export type Role = (typeof ROLES)[number]

export const ROLE_LABELS: Record<Role, string> = {
  engineer: 'Engineer',
  checker: 'Checker',
  records: 'Records',
  admin: 'Administrator',
}
