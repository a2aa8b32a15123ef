// Real-browser test kit: the built client served by the real server (demo data seeded) and headless Chromium through playwright-core.
import { chromium, type BrowserContext, type Page } from 'playwright-core'
import { mkdtempSync, rmSync, existsSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { createServer, type AddressInfo, type Server } from 'node:net'
import type { Server as HttpServer } from 'node:http'
import { ROOT } from '../../server/config'
import type { MailSink } from '../../server/mail/sink'
import { startTestApp } from './app'
import { seedDemo, DEMO_PASSWORD } from '../../server/seed/demo'
import { seedReference } from '../../server/seed/reference'

export { DEMO_PASSWORD }

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s: Server = createServer()
    s.on('error', reject)
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as AddressInfo
      s.close(() => resolve(port))
    })
  })
}

export type BrowserServer = { url: string; sink: MailSink; close: () => Promise<void> }

export async function startBrowserServer(): Promise<BrowserServer> {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run browser tests through `npm test` or `npm run test:browser`.')
  if (!existsSync(join(ROOT, 'dist', 'index.html'))) throw new Error('The client is not built: `npm test` builds it before the browser tests.')
  const port = await freePort()
  const url = `http://127.0.0.1:${port}`
  // The same app the API tests drive, serving the built client, with the demo seeded.
  const t = await startTestApp({ jwtSecret: 'browser-test-secret-0123456789abcdefghijkl', publicUrl: url, port, serveClient: true })
  await seedReference(t.sequelize)
  await seedDemo(t.sequelize, t.config)
  const server: HttpServer = await new Promise((resolve) => {
    const s = t.app.listen(port, '127.0.0.1', () => resolve(s))
  })
  return {
    url,
    sink: t.sink,
    close: async () => {
      server.closeAllConnections()
      await new Promise((r) => server.close(r))
      await t.close()
    },
  }
}

export type TestBrowser = { context: BrowserContext; page: Page; errors: string[]; close: () => Promise<void> }

/** A fresh Chromium profile; console errors and page errors are collected so tests can assert there are none. */
export async function openBrowser(viewport = { width: 1200, height: 800 }): Promise<TestBrowser> {
  const profile = mkdtempSync(join(tmpdir(), 'standgraze-chromium-'))
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  })
  const page = context.pages()[0] ?? (await context.newPage())
  const errors: string[] = []
  const watch = (p: Page) => {
    p.on('console', (m) => {
      if (m.type() === 'error') errors.push(`${p.url()}: ${m.text()}`)
    })
    p.on('pageerror', (e) => errors.push(`${p.url()}: ${String(e)}`))
  }
  watch(page)
  context.on('page', watch)
  return {
    context,
    page,
    errors,
    close: async () => {
      await context.close()
      rmSync(profile, { recursive: true, force: true })
    },
  }
}

export async function signInAs(page: Page, base: string, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${base}/sign-in`)
  await page.fill('input[name=email]', email)
  await page.fill('input[name=password]', password)
  await page.click('[data-test=sign-in-submit]')
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'))
}
