import nodemailer, { type Transporter } from 'nodemailer';

/** One plain-text message Rampart sends. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

/** Sends Rampart's mail. Routes and use cases depend on this, not on nodemailer. */
export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

/** Thrown when the mail server refuses or cannot be reached. */
export class MailDeliveryError extends Error {
  override readonly name = 'MailDeliveryError';
}

/**
 * nodemailer over plain SMTP to `host:port` — the local fake SMTP server in development and
 * tests. The fake has no TLS, hence `ignoreTLS`.
 */
export class SmtpMailer implements Mailer {
  private readonly _transport: Transporter;

  constructor(
    options: { host: string; port: number },
    private readonly _from: string,
  ) {
    this._transport = nodemailer.createTransport({
      host: options.host,
      port: options.port,
      secure: false,
      ignoreTLS: true,
    });
  }

  async send(mail: OutgoingMail): Promise<void> {
    try {
      await this._transport.sendMail({ from: this._from, ...mail });
    } catch (err) {
      throw new MailDeliveryError(`mail to ${mail.to} was not accepted`, { cause: err });
    }
  }

  close(): void {
    this._transport.close();
  }
}

/** Drops every message (production until a real mail server is configured). */
export class DiscardingMailer implements Mailer {
  constructor(private readonly _onDiscard: (mail: OutgoingMail) => void = () => {}) {}

  async send(mail: OutgoingMail): Promise<void> {
    this._onDiscard(mail);
  }
}
