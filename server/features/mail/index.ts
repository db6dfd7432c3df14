/** The mail feature's public surface: queue a mail; the worker sends it. */
export { mailDate, mailDateTime, quoted } from './mail.format';
export { countQueuedSince, enqueueMail, type QueuedMail } from './mail.repository';
export { createMailWorker, type MailWorker } from './mail.worker';
