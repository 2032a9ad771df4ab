export default defineTask({
  meta: {
    name: 'outbox:send',
    description: 'Send the e-mail notices waiting in the outbox (retried with growing waits)',
  },
  async run() {
    return { result: await deliverOutbox() }
  },
})
