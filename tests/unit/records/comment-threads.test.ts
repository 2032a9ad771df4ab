import { describe, expect, it } from 'vitest'
import { commentThreads, quotedComments, repliesIn } from '../../../server/utils/comment-threads'

const reviews = [
  { id: 11, revisionId: 1, revisionCode: 'P01', decision: 'return', comments: [{ anchor: 'sec-load-balancing', text: 'Justify the balanced fraction' }, { anchor: '', text: 'Add the site schedule' }], reviewerName: 'Checker', createdAt: '2026-01-05T10:00:00Z' },
  { id: 12, revisionId: 2, revisionCode: 'P02', decision: 'comment', comments: [{ anchor: 'sec-deflection', text: 'State the creep factor' }], reviewerName: 'Checker', createdAt: '2026-01-07T10:00:00Z' },
]
const titles = (_: number, anchor: string) => ({ 'sec-load-balancing': 'Load balancing', 'sec-deflection': 'Deflection (7.4)' })[anchor] ?? anchor

describe('comment threads', () => {
  it('an unanswered comment is open, a replied one answered, the newest closing row closes it', () => {
    const threads = commentThreads(reviews, titles, [
      { reviewId: 11, commentIndex: 1, state: 'closed', actorName: 'Checker', createdAt: '2026-01-06T00:00:00Z' },
      { reviewId: 12, commentIndex: 0, state: 'closed', actorName: 'Checker', createdAt: '2026-01-08T00:00:00Z' },
      { reviewId: 12, commentIndex: 0, state: 'open', actorName: 'Checker', createdAt: '2026-01-09T00:00:00Z' },
    ], [
      { revisionCode: 'P02', authorName: 'Engineer', issuedAt: '2026-01-06T12:00:00Z', replies: [{ reviewId: 11, index: 0, text: '90 % of self-weight, see 5.1' }, { reviewId: 99, text: 'not a reply' }] },
    ])
    expect(threads.map(t => [t.revisionCode, t.section, t.state, t.replies.map(r => r.text)])).toEqual([
      ['P01', 'Load balancing', 'answered', ['90 % of self-weight, see 5.1']],
      ['P01', '', 'closed', []],
      ['P02', 'Deflection (7.4)', 'open', []],
    ])
    expect(threads[1]!.closedBy?.name).toBe('Checker')
    expect(threads[0]!.replies[0]!.revisionCode).toBe('P02')
  })

  it('reads only replies of the shared shape', () => {
    expect(repliesIn(null)).toEqual([])
    expect(repliesIn('not json')).toEqual([])
    expect(repliesIn('[{"reviewId":3,"index":1,"text":"Done"}]')).toEqual([{ reviewId: 3, index: 1, text: 'Done' }])
    expect(repliesIn([{ reviewId: 1, index: 0, text: '  ok ' }, { reviewId: 1, index: -1, text: 'x' }, 'text'])).toEqual([{ reviewId: 1, index: 0, text: 'ok' }])
  })

  it('quotes comments in an e-mail under the section in words', () => {
    expect(quotedComments([{ anchor: 'sec-load-balancing', text: 'Justify\nthe fraction' }, { anchor: '', text: 'Add a schedule' }], a => titles(0, a)))
      .toBe('On "Load balancing":\n> Justify\n> the fraction\n\nOn the whole revision:\n> Add a schedule')
  })
})
