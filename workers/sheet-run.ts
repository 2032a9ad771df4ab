/**
 * The editor's engine and report renderer, off the page's main thread: a request per change of the
 * inputs or the sheet's text, answered in order (shared/sheet/live-run.ts does the work).
 */
import { seedTypesetCache } from '../shared/report/typeset'
import { createLiveRunner, type LiveRequest } from '../shared/sheet/live-run'

const runner = createLiveRunner()

/**
 * A sheet (re)loaded: forget the last, take the page's typeset formulas (the first render here is
 * then warm), and run its inputs once so an invalid field next still shows its report.
 */
interface Reset { reset: LiveRequest, formulas: Array<[string, string]> }

self.onmessage = (event: MessageEvent<LiveRequest | Reset>) => {
  if ('reset' in event.data) {
    runner.reset()
    seedTypesetCache(event.data.formulas)
    runner.run(event.data.reset)
    return
  }
  self.postMessage(runner.run(event.data))
}
