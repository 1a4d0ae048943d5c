import nodemailer from 'nodemailer';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
}

export interface Mailer {
  send(message: MailMessage): Promise<{ messageId: string }>;
}

/** SMTP through nodemailer (the bundled fake mail server in development and tests). */
export function createMailer(opts: { host: string; port: number; from: string }): Mailer {
  const transport = nodemailer.createTransport({ host: opts.host, port: opts.port, secure: false, ignoreTLS: true });
  return {
    async send(m) {
      const info = await transport.sendMail({ from: opts.from, ...m });
      return { messageId: info.messageId };
    },
  };
}
