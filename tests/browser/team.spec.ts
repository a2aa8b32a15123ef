// Browser: the owner switches operation and invites a member; the invitee opens the link from the mail sink in a second browser, signs up and lands in the operation with the invited role.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openBrowser, signInAs, startBrowserServer, type BrowserServer, type TestBrowser } from '../helpers/browser'
import { DEMO_OPERATIONS } from '../../server/seed/demo'

let srv: BrowserServer
let owner: TestBrowser
let invitee: TestBrowser

beforeAll(async () => {
  srv = await startBrowserServer()
  owner = await openBrowser()
  invitee = await openBrowser({ width: 390, height: 844 })
})
afterAll(async () => {
  await owner?.close()
  await invitee?.close()
  await srv?.close()
})

describe('team invitations in the browser', () => {
  it('when the owner invites a hand to the client operation, then the invitee signs up from the e-mailed link and lands there as hand', async () => {
    const { page } = owner
    await signInAs(page, srv.url, 'owner@demo.standgraze.invalid')
    await expect.poll(() => page.textContent('[data-test=current-operation]')).toContain(DEMO_OPERATIONS.main.name)

    await page.click('[data-test=operation-switcher]')
    await page.getByRole('listitem').filter({ hasText: DEMO_OPERATIONS.client.name }).first().click()
    await expect.poll(() => page.textContent('[data-test=current-operation]')).toContain(DEMO_OPERATIONS.client.name)

    await page.click('[data-test=nav-team]')
    await page.waitForSelector('[data-test=member-list]')
    const email = `new-advisor-${Date.now()}@example.test`
    await page.fill('input[name=invite-email]', email)
    await page.click('[data-test=invite-submit]')
    await page.waitForSelector('[data-test=invite-sent]')

    const mail = await srv.sink.waitFor(email)
    const link = mail.text.match(/(http:\/\/\S+accept-invite\?token=\S+)/)![1]
    expect(link.startsWith(srv.url)).toBe(true)

    const p2 = invitee.page
    await p2.goto(link)
    await p2.waitForSelector('[data-test=invite-summary]')
    expect(await p2.textContent('[data-test=invite-summary]')).toContain(DEMO_OPERATIONS.client.name)
    await p2.click('[data-test=invite-sign-up]')
    await p2.fill('input[name=name]', 'New Advisor')
    await p2.fill('input[name=password]', 'strip-grazing-rules-9')
    await p2.click('[data-test=sign-up-submit]')
    await p2.waitForURL(/\/o\/\d+\/today/)
    await expect.poll(() => p2.textContent('[data-test=current-operation]')).toContain(DEMO_OPERATIONS.client.name)
    expect(await p2.textContent('[data-test=current-role]')).toContain('Hand')
  })

  it('shows no console errors in either browser', () => {
    expect([...owner.errors, ...invitee.errors]).toEqual([])
  })
})
