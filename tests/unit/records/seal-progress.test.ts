import { describe, expect, it } from 'vitest'
import { SEAL_STEPS, sealProgressOf, withSealProgress } from '../../../server/utils/seal-progress'

describe('the steps a seal shows while it runs', () => {
  it('lists the first render as a step to do, and as found at approval once the seal says so', async () => {
    const seen: Array<ReturnType<typeof sealProgressOf>> = []
    await withSealProgress(901, 'seal', async (step) => {
      step('numbering')
      seen.push(sealProgressOf(901))
      step('numbered')
      seen.push(sealProgressOf(901))
      step('printing')
      seen.push(sealProgressOf(901))
    })
    expect(seen[0]).toMatchObject({ index: 1, steps: 4, label: SEAL_STEPS.numbering })
    expect(seen[0]!.plan[0]).toBe(SEAL_STEPS.numbering)
    expect(seen[1]).toMatchObject({ index: 1, label: SEAL_STEPS.numbered })
    expect(seen[2]).toMatchObject({ index: 2, label: SEAL_STEPS.printing })
    // the plan keeps saying where the numbers came from, to the end
    expect(seen[2]!.plan).toEqual([SEAL_STEPS.numbered, SEAL_STEPS.printing, SEAL_STEPS.comparing, SEAL_STEPS.storing])
    expect(sealProgressOf(901)).toBeNull()
  })

  it('plans the first render when the seal has to make it', async () => {
    let plan: string[] = []
    await withSealProgress(902, 'seal', async (step) => {
      step('numbering')
      step('printing')
      plan = sealProgressOf(902)!.plan
    })
    expect(plan[0]).toBe(SEAL_STEPS.numbering)
  })
})
