/** The office details in force (null before any are set). */
export default defineEventHandler(async (event) => {
  await authorize(event)
  return currentOfficeDetails()
})
