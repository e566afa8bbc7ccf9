/** The administrators' mailbox: outgoing mail the local catcher kept, newest first. */
export { countMail, getMail, listMail, type MailMessage, type MailSummary } from '@/db/repo/mail';
