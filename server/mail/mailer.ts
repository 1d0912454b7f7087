import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** A fixed Message-ID, so a mail sent twice can be told for the same one. */
  messageId?: string;
}

export interface Mailer {
  /** Resolves to the Message-ID the server accepted. */
  send(mail: OutgoingMail): Promise<string>;
  close(): void;
}

/** nodemailer over the SMTP URL of the configuration (the local mail catcher by default). */
export function createMailer(smtpUrl: string, from: string): Mailer {
  const transport = nodemailer.createTransport(smtpUrl);
  return {
    async send(mail) {
      const info = await transport.sendMail({ from, ...mail });
      return info.messageId;
    },
    close: () => transport.close(),
  };
}
