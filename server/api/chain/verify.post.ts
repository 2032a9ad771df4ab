/** Walks the hash chains of revisions, reviews, audit events and sealed PDFs; reports the first broken link. */
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'records', 'admin')
  const report = await verifyChains()
  await recordAudit(event, { action: 'chain.verified', subject: report.ok ? 'intact' : 'broken', actorId: user.id, detail: { checked: report.checked, firstBreak: report.firstBreak } })
  return report
})
