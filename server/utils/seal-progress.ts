// Where a seal or a reseal check of a revision stands, for the page that waits on it. Kept in this
// server's memory only: a step of seconds, read by polling while the request that does the work is
// open; another server (or a restart) knows none, and the page then shows the time elapsed alone.

/** The steps of sealing a revision, in order, in the words the page shows. */
export const SEAL_STEPS = {
  numbering: 'Finding the page of every section (a first render)',
  numbered: 'The page of every section, found when the revision was approved',
  printing: 'Printing the numbered copy and a second copy to check it against',
  comparing: 'Making both copies reproducible and comparing their bytes',
  again: 'The two copies differed: printing once more',
  storing: 'Storing the PDF and recording the seal in the history log',
} as const

/** The steps of a reseal check. */
export const CHECK_STEPS = {
  printing: 'Printing the revision again with the page numbers kept with its seal',
  comparing: 'Making the copy reproducible and comparing it with the sealed PDF',
  again: 'Settling the page numbers afresh and printing again',
} as const

export type SealWork = 'seal' | 'check'
export type SealStep = keyof typeof SEAL_STEPS | keyof typeof CHECK_STEPS

export interface SealProgress {
  work: SealWork
  step: SealStep
  label: string
  /** 1-based place of the step among the work's usual steps */
  index: number
  steps: number
  startedAt: number
  /** the job that reported it: of two at once on one revision, the one that ends forgets only its own */
  owner: symbol
  /** the page numbers were found at approval: the plan's first step says so */
  numberedAtApproval: boolean
}

const USUAL: Record<SealWork, SealStep[]> = {
  seal: ['numbering', 'printing', 'comparing', 'storing'],
  check: ['printing', 'comparing'],
}

const current = new Map<number, SealProgress>()

/** Sets the step a revision's seal or check has reached; its first step starts its clock. */
function reportSealStep(revisionId: number, work: SealWork, step: SealStep, owner: symbol) {
  const words: Record<string, string> = work === 'seal' ? SEAL_STEPS : CHECK_STEPS
  const label = words[step]
  if (!label) return
  const usual = USUAL[work]
  const before = current.get(revisionId)
  // found at approval: the numbering step, done already
  const at = usual.indexOf(step === 'numbered' ? 'numbering' : step)
  current.set(revisionId, {
    work,
    step,
    label,
    // a step outside the usual ones (a render again) stands where the work had got to
    index: at >= 0 ? at + 1 : Math.min(before?.index ?? 1, usual.length),
    steps: usual.length,
    startedAt: before?.work === work ? before.startedAt : Date.now(),
    owner,
    numberedAtApproval: step === 'numbered' || (before?.work === work && before.numberedAtApproval),
  })
}

/** Runs a seal or check of a revision with its progress reported, and forgets it when done. */
export async function withSealProgress<T>(revisionId: number, work: SealWork, job: (step: (step: SealStep) => void) => Promise<T>): Promise<T> {
  const owner = Symbol(work)
  try {
    return await job(s => reportSealStep(revisionId, work, s, owner))
  }
  finally {
    if (current.get(revisionId)?.owner === owner) current.delete(revisionId)
  }
}

/** Where the revision's seal or check stands on this server, or null when none is running here. */
export function sealProgressOf(revisionId: number): (Omit<SealProgress, 'owner'> & { elapsedMs: number, plan: string[] }) | null {
  const p = current.get(revisionId)
  if (!p) return null
  const { owner: _owner, numberedAtApproval, ...shown } = p
  const words: Record<string, string> = p.work === 'seal' ? SEAL_STEPS : CHECK_STEPS
  const plan = USUAL[p.work].map(s => words[s === 'numbering' && numberedAtApproval ? 'numbered' : s]!)
  return { ...shown, elapsedMs: Date.now() - p.startedAt, plan }
}
