import { describe, expect, it } from 'vitest'
import { PdfBusyError, RenderGate } from '../../../server/utils/pdf'

/** A job that finishes when its `finish` is called, recording how many jobs ran at once. */
function controlledJobs() {
  let now = 0
  let peak = 0
  const finishers: Array<() => void> = []
  const job = (name: string, order: string[]) => async () => {
    now += 1
    peak = Math.max(peak, now)
    order.push(name)
    await new Promise<void>(resolve => finishers.push(resolve))
    now -= 1
    return name
  }
  return { job, finishNext: () => finishers.shift()?.(), peak: () => peak }
}

const tick = () => new Promise(r => setTimeout(r, 0))

describe('the per-server PDF render gate', () => {
  it('runs at most `slots` renders, queues `queue` more in order, and refuses the next with a wait to retry after', async () => {
    const gate = new RenderGate(2, 2, 7)
    const { job, finishNext, peak } = controlledJobs()
    const order: string[] = []
    const accepted = ['a', 'b', 'c', 'd'].map(n => gate.run(job(n, order)))
    await tick()
    expect(gate.load).toEqual({ running: 2, waiting: 2, background: 0 })
    const refused = await gate.run(job('e', order)).catch((e: unknown) => e)
    expect(refused).toBeInstanceOf(PdfBusyError)
    expect((refused as PdfBusyError).retryAfterSeconds).toBe(7)
    expect((refused as Error).message).toContain('busy')

    for (let i = 0; i < 4; i++) {
      finishNext()
      await tick()
      await tick()
    }
    expect(await Promise.all(accepted)).toEqual(['a', 'b', 'c', 'd'])
    expect(order).toEqual(['a', 'b', 'c', 'd'])
    expect(peak()).toBe(2)
    expect(gate.load).toEqual({ running: 0, waiting: 0, background: 0 })
  })

  it('runs background work only when no one waits, after everyone who came before or while it waited', async () => {
    const gate = new RenderGate(1, 4, 10, 1)
    const { job, finishNext } = controlledJobs()
    const order: string[] = []
    const first = gate.run(job('person 1', order))
    const later = gate.runInBackground(job('background', order))
    await tick()
    const second = gate.run(job('person 2', order))
    await tick()
    expect(gate.load).toEqual({ running: 1, waiting: 1, background: 1 })
    // its own queue is bounded too
    await expect(gate.runInBackground(job('one too many', order))).rejects.toBeInstanceOf(PdfBusyError)
    for (let i = 0; i < 3; i++) {
      finishNext()
      await tick()
      await tick()
    }
    expect(await Promise.all([first, second, later])).toEqual(['person 1', 'person 2', 'background'])
    expect(order).toEqual(['person 1', 'person 2', 'background'])
    expect(gate.load).toEqual({ running: 0, waiting: 0, background: 0 })
    // on an idle gate it runs at once
    const alone = gate.runInBackground(job('alone', order))
    await tick()
    expect(gate.load.running).toBe(1)
    finishNext()
    expect(await alone).toBe('alone')
  })

  it('gives the slot back when a render fails, so a failure never shrinks the gate', async () => {
    const gate = new RenderGate(1, 0)
    await expect(gate.run(async () => { throw new Error('page answered 500') })).rejects.toThrow('page answered 500')
    expect(gate.load).toEqual({ running: 0, waiting: 0, background: 0 })
    expect(await gate.run(async () => 'next')).toBe('next')
  })
})
