// A revision's status is never stored: it follows from the rows written after it (reviews, seal,
// later revisions of the same sheet). Pure, so the rules are unit-tested on their own.

export type RevisionStatus = 'issued' | 'returned' | 'approved' | 'sealed' | 'superseded'

export interface StatusFacts {
  /** decisions on this revision, oldest first (comments excluded) */
  decisions: Array<{ decision: 'return' | 'approve', contractCode: string | null }>
  sealed: boolean
  /** a later revision of the same sheet exists */
  laterIssued: boolean
  /** a later revision of the same sheet has been approved */
  laterApproved: boolean
}

export interface DerivedStatus {
  status: RevisionStatus
  label: string
  /** ISO 19650-2 (UK NA) suitability code shown beside the status */
  suitability: string
  /** C01, C02… when approved */
  contractCode: string | null
  superseded: boolean
}

const LABELS: Record<RevisionStatus, string> = {
  issued: 'Issued for check',
  returned: 'Returned with comments',
  approved: 'Approved',
  sealed: 'Sealed',
  superseded: 'Superseded',
}

export function deriveStatus(f: StatusFacts): DerivedStatus {
  const approval = f.decisions.find(d => d.decision === 'approve')
  const returned = f.decisions.some(d => d.decision === 'return')
  let status: RevisionStatus
  let superseded: boolean
  if (approval) {
    superseded = f.laterApproved
    status = superseded ? 'superseded' : f.sealed ? 'sealed' : 'approved'
  }
  else {
    superseded = f.laterIssued
    status = superseded ? 'superseded' : returned ? 'returned' : 'issued'
  }
  // S3: shared for review and comment; S0: back to work in progress; A1: authorised
  const suitability = status === 'issued' ? 'S3' : status === 'returned' ? 'S0' : status === 'superseded' ? '—' : 'A1'
  return { status, label: LABELS[status], suitability, contractCode: approval?.contractCode ?? null, superseded }
}

/** P01, P02… from a sheet's revision number; C01, C02… from its approval count. */
export function revisionCode(prefix: 'P' | 'C', n: number): string {
  return `${prefix}${String(n).padStart(2, '0')}`
}
