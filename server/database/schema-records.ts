// Tables of the records side: revisions, reviews, seals, attachments, audit events, outbox.
export {}
