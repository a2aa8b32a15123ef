// Reads the text of a PDF made by pdfkit with its standard fonts: inflates each content stream and decodes the hex strings of its TJ operators.
import { inflateSync } from 'node:zlib'

export function pdfText(pdf: Buffer): string {
  const s = pdf.toString('latin1')
  const out: string[] = []
  const re = /stream\r?\n/g
  let m: RegExpExecArray | null
  while ((m = re.exec(s))) {
    const start = m.index + m[0].length
    const end = s.indexOf('endstream', start)
    if (end < 0) break
    const raw = Buffer.from(s.slice(start, end), 'latin1')
    let body: string
    try {
      body = inflateSync(raw).toString('latin1')
    } catch {
      body = raw.toString('latin1')
    }
    for (const tj of body.match(/\[([^\]]*)\]\s*TJ/g) ?? []) {
      const parts = [...tj.matchAll(/<([0-9a-fA-F]*)>/g)].map((h) => Buffer.from(h[1], 'hex').toString('latin1'))
      out.push(parts.join(''))
    }
    re.lastIndex = end
  }
  return out.join(' ').replace(/\s+/g, ' ')
}
