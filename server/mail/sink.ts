// A local SMTP sink on loopback (smtp-server): stands in for a real provider in development and tests, keeping messages in memory.
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'
import type { AddressInfo } from 'node:net'

export type SinkMessage = {
  id: number
  to: string[]
  from: string
  subject: string
  text: string
  html: string | null
  receivedAt: string
  attachments: { filename: string; contentType: string; size: number }[]
}

export class MailSink {
  private server: SMTPServer
  readonly messages: SinkMessage[] = []
  private nextId = 1
  private waiters: Array<() => void> = []
  port = 0

  constructor(private maxMessages = 500) {
    this.server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS', 'AUTH'],
      logger: false,
      size: 25 * 1024 * 1024,
      onData: (stream, session, callback) => {
        simpleParser(stream)
          .then((parsed) => {
            const to = session.envelope.rcptTo.map((r) => r.address)
            this.messages.push({
              id: this.nextId++,
              to,
              from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
              subject: parsed.subject ?? '',
              text: parsed.text ?? '',
              html: typeof parsed.html === 'string' ? parsed.html : null,
              receivedAt: new Date().toISOString(),
              attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? 'attachment', contentType: a.contentType, size: a.size })),
            })
            if (this.messages.length > this.maxMessages) this.messages.shift()
            for (const w of this.waiters.splice(0)) w()
            callback()
          })
          .catch((err: Error) => callback(err))
      },
    })
  }

  listen(port = 0): Promise<number> {
    return new Promise((resolve, reject) => {
      this.server.once('error', reject)
      this.server.listen(port, '127.0.0.1', () => {
        this.port = (this.server.server.address() as AddressInfo).port
        resolve(this.port)
      })
    })
  }

  close(): Promise<void> {
    return new Promise((resolve) => this.server.close(() => resolve()))
  }

  /** Resolves with the newest message to `address` that matches, waiting up to `timeoutMs`. */
  async waitFor(address: string, match: (m: SinkMessage) => boolean = () => true, timeoutMs = 5000): Promise<SinkMessage> {
    const deadline = Date.now() + timeoutMs
    for (;;) {
      const found = [...this.messages].reverse().find((m) => m.to.includes(address.toLowerCase()) && match(m))
      if (found) return found
      const left = deadline - Date.now()
      if (left <= 0) throw new Error(`no mail to ${address} within ${timeoutMs} ms`)
      await new Promise<void>((resolve) => {
        const t = setTimeout(resolve, Math.min(left, 250))
        this.waiters.push(() => {
          clearTimeout(t)
          resolve()
        })
      })
    }
  }
}
