/** Checks every record of every chain and the history log against its signed heads; lists every break. */
export default defineEventHandler(async (event) => {
  const user = await authorize(event)
  const report = await verifyChains()
  await recordAudit(event, { action: 'chain.verified', subject: report.ok ? 'intact' : 'broken', actorId: user.id, detail: { checked: report.checked, breaks: report.breaks.length, firstBreak: report.firstBreak } })
  return report
})
