// Browser: each demo member sees what their role allows; phone width keeps the shell usable; no console errors.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openBrowser, signInAs, startBrowserServer, type BrowserServer, type TestBrowser } from '../helpers/browser'
import { DEMO_OPERATIONS } from '../../server/seed/demo'

let srv: BrowserServer
const opened: TestBrowser[] = []

beforeAll(async () => {
  srv = await startBrowserServer()
})
afterAll(async () => {
  for (const b of opened) await b.close()
  await srv?.close()
})

async function browser(viewport?: { width: number; height: number }) {
  const b = await openBrowser(viewport)
  opened.push(b)
  return b
}

describe('what each demo role sees', () => {
  it('when signed out, then any page sends you to sign-in', async () => {
    const { page } = await browser()
    await page.goto(`${srv.url}/o/1/team`)
    await page.waitForURL(/\/sign-in/)
    expect(await page.textContent('h1')).toContain('Sign in')
  })

  it('when the hand signs in, then only the main operation is listed and the Team page has no invite form', async () => {
    const { page } = await browser()
    await signInAs(page, srv.url, 'hand@demo.standgraze.invalid')
    await expect.poll(() => page.textContent('[data-test=current-role]')).toContain('Hand')
    await page.click('[data-test=operation-switcher]')
    const items = await page.locator('[data-test^=operation-]').allTextContents()
    expect(items.join(' ')).toContain(DEMO_OPERATIONS.main.name)
    expect(items.join(' ')).not.toContain(DEMO_OPERATIONS.client.name)
    await page.keyboard.press('Escape')
    await page.click('[data-test=nav-team]')
    await page.waitForSelector('[data-test=member-list]')
    expect(await page.locator('[data-test=invite-submit]').count()).toBe(0)
  })

  it('when the nutritionist signs in, then both operations are listed and members cannot be managed', async () => {
    const { page } = await browser()
    await signInAs(page, srv.url, 'nutritionist@demo.standgraze.invalid')
    await page.click('[data-test=operation-switcher]')
    const items = (await page.locator('[data-test^=operation-]').allTextContents()).join(' ')
    expect(items).toContain(DEMO_OPERATIONS.main.name)
    expect(items).toContain(DEMO_OPERATIONS.client.name)
    await page.keyboard.press('Escape')
    await page.click('[data-test=nav-team]')
    await page.waitForSelector('[data-test=member-list]')
    expect(await page.locator('[data-test=invite-submit]').count()).toBe(0)
  })

  it('when the site admin signs in, then the users page shows and no operation is offered', async () => {
    const { page } = await browser()
    await signInAs(page, srv.url, 'admin@demo.standgraze.invalid')
    await page.waitForSelector('[data-test=admin-users]')
    expect(await page.textContent('[data-test=admin-users]')).toContain('owner@demo.standgraze.invalid')
    expect(await page.locator('[data-test=operation-switcher]').count()).toBe(0)
    await page.goto(`${srv.url}/o/1/team`)
    await page.waitForSelector('[data-test=not-found]')
  })

  it('when the owner uses a phone-width screen, then navigation opens from the menu button', async () => {
    const { page } = await browser({ width: 390, height: 844 })
    await signInAs(page, srv.url, 'owner@demo.standgraze.invalid')
    await page.waitForSelector('[data-test=current-operation]')
    await page.getByRole('button', { name: 'Open navigation' }).click()
    await page.click('[data-test=nav-team]')
    await page.waitForSelector('[data-test=member-list]')
    const width = await page.evaluate(() => document.documentElement.scrollWidth)
    expect(width).toBeLessThanOrEqual(390)
  })

  it('shows no console errors in any of these sessions', () => {
    expect(opened.flatMap((b) => b.errors)).toEqual([])
  })
})
