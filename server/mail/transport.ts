import nodemailer, { type Transporter } from 'nodemailer';

/**
 * nodemailer's pooled SMTP transport to SMTP_URL: a few long-lived connections, many messages each. null when no
 * relay is configured (mail then waits in the outbox).
 */
export function createMailTransport(smtpUrl: string | undefined, maxConnections = 5): Transporter | null {
  if (!smtpUrl) return null;
  return nodemailer.createTransport({
    url: smtpUrl,
    pool: true,
    maxConnections,
    maxMessages: Infinity,
    // A relay that stops answering must not hold a batch for minutes.
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
  });
}
