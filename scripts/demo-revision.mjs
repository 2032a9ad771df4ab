// Once the demo server answers: if the demo sheet PS-2 has never been issued, the demo engineer
// issues P01 for check through the product's own API, so the checker's queue has work in it.
export async function issueDemoRevision(base) {
  let cookie = ''
  const call = async (method, path, body) => {
    const res = await fetch(`${base}${path}`, {
      method,
      headers: { 'content-type': 'application/json', origin: base, ...(cookie ? { cookie } : {}) },
      body: body ? JSON.stringify(body) : undefined,
    })
    const set = res.headers.getSetCookie()[0]
    if (set) cookie = set.split(';')[0]
    return { status: res.status, body: await res.json().catch(() => null) }
  }
  const signin = await call('POST', '/api/auth/signin', { email: 'engineer@tendonbook.local', password: 'engineer-demo-2417' })
  if (signin.status !== 200) return
  const projects = await call('GET', '/api/projects')
  const demo = projects.body?.find?.(p => p.jobNumber === '2417')
  if (!demo) return
  const project = await call('GET', `/api/projects/${demo.id}`)
  const sheet = project.body?.sheets?.find(s => s.reference === 'PS-2')
  if (!sheet) return
  const revisions = await call('GET', `/api/sheets/${sheet.id}/revisions`)
  if (!Array.isArray(revisions.body) || revisions.body.length > 0) return
  const draft = await call('GET', `/api/sheets/${sheet.id}`)
  const body = { note: 'First issue for check: spans, loads and tendon layout as agreed with the architect.', draftVersion: draft.body?.draftVersion }
  let issued = await call('POST', `/api/sheets/${sheet.id}/revisions`, body)
  // a demo sheet with failing checks is issued the way an engineer would: with the reason given
  if (issued.status === 400 && issued.body?.data?.fields?.failingChecksReason) {
    issued = await call('POST', `/api/sheets/${sheet.id}/revisions`, { ...body, failingChecksReason: 'Preliminary issue for the layout meeting: the failing checks are to be resolved in P02.' })
  }
  if (issued.status < 300) process.stdout.write(`[demo] PS-2 ${issued.body.code} issued for check by the demo engineer\n`)
  await call('POST', '/api/auth/signout')
}
