// Outgoing mail for a running app: SMTP_URL's provider when configured, else a local sink on loopback that keeps what is sent.
import type { Config } from '../config'
import { Mailer } from './mailer'
import { MailSink } from './sink'

export async function startMail(config: Pick<Config, 'smtpUrl' | 'mailFrom'>, sinkPort = 0): Promise<{ mailer: Mailer; sink: MailSink | null }> {
  if (config.smtpUrl) return { mailer: new Mailer({ url: config.smtpUrl }, config.mailFrom), sink: null }
  const sink = new MailSink()
  const port = await sink.listen(sinkPort)
  return { mailer: new Mailer({ sinkPort: port }, config.mailFrom), sink }
}
