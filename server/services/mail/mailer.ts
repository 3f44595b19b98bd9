/** The SMTP transport (nodemailer). Development and tests talk to the local capture server. */
import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '../../config';

let transport: Transporter | null = null;

/** The shared nodemailer transport, made on first use. */
export function mailTransport(): Transporter {
  if (!transport) {
    transport = nodemailer.createTransport({
      host: config.smtp.host,
      port: config.smtp.port,
      secure: config.smtp.secure,
      auth: config.smtp.user ? { user: config.smtp.user, pass: config.smtp.pass } : undefined,
      // The local capture server speaks plain SMTP on loopback.
      ignoreTLS: !config.smtp.secure && config.smtp.host === '127.0.0.1',
      connectionTimeout: 5000,
      greetingTimeout: 5000,
      socketTimeout: 10000,
    });
  }
  return transport;
}
