import { adoptHistoryBeforeLog } from '../database/history-log'

/**
 * At start-up: history written before the log existed joins it (once, while the log is empty),
 * and a signed head is published for whatever the log holds. Not awaited: the server answers
 * meanwhile, and appends queue behind the log's lock row.
 */
export default defineNitroPlugin(() => {
  void useDb().transaction(tx => adoptHistoryBeforeLog(tx))
    .then((adopted) => {
      if (adopted) console.info(`[history-log] ${adopted} history rows written before the log existed joined it`)
      return publishHead()
    })
    .catch(error => console.error(`[history-log] ${error instanceof Error ? error.message : String(error)}`))
})
