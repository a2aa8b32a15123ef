// Outgoing mail through nodemailer: SMTP_URL when set, else the local sink on loopback.
import nodemailer, { type Transporter } from 'nodemailer'

export type OutgoingMail = {
  to: string | string[]
  subject: string
  text: string
  html?: string
  attachments?: { filename: string; content: Buffer; contentType?: string }[]
}

export class Mailer {
  private transport: Transporter
  constructor(
    target: { url: string } | { sinkPort: number },
    private from: string,
  ) {
    this.transport =
      'url' in target
        ? nodemailer.createTransport(target.url)
        : nodemailer.createTransport({ host: '127.0.0.1', port: target.sinkPort, secure: false, ignoreTLS: true })
  }

  async send(mail: OutgoingMail) {
    const info = await this.transport.sendMail({ from: this.from, ...mail })
    return { messageId: info.messageId, accepted: (info.accepted ?? []).map(String) }
  }

  close() {
    this.transport.close()
  }
}
