// The three main user journeys in Chromium against the real server and the demo data, plus the Balance screen's numbers against the engine and the units switch.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { openBrowser, signInAs, startBrowserServer, type BrowserServer, type TestBrowser } from '../helpers/browser'
import { DEMO_OPERATIONS } from '../../server/seed/demo'
import { balanceRation } from '../../shared/engine/nutrition/ration/balance'
import type { FeedRef } from '../../shared/adapters/nutrition/problem'
import { supplementPlan } from '../../shared/adapters/nutrition/plan'
import { coverageWord } from '../../shared/schemas/nutrition/balances'
import { fmtNumber, fmtPct, massValue, nutrientDisplay } from '../../shared/schemas/nutrition/format'
import type { BalanceResult, RationProblem } from '../../shared/engine/nutrition/ration/schema'

let srv: BrowserServer
let owner: TestBrowser
let nutritionist: TestBrowser

beforeAll(async () => {
  srv = await startBrowserServer()
  owner = await openBrowser()
  nutritionist = await openBrowser()
  await signInAs(owner.page, srv.url, 'owner@demo.standgraze.invalid')
  await signInAs(nutritionist.page, srv.url, 'nutritionist@demo.standgraze.invalid')
})
afterAll(async () => {
  await owner?.close()
  await nutritionist?.close()
  await srv?.close()
})

async function openPart(page: Page, name: string) {
  await page.click(`[data-test=nav-${name}]`)
  await page.waitForURL(new RegExp(`/o/\\d+/${name}`))
}

async function openStoredBalance(page: Page, name: string) {
  await openPart(page, 'balance')
  const item = page.locator('[data-test=balance-list] .v-list-item').filter({ hasText: name }).first()
  await item.click()
  await page.waitForSelector('[data-test=balance-result][data-kind=stored]')
  await expect.poll(() => page.textContent('[data-test=balance-result]')).toContain('Saved version')
  // The page puts the opened balance into the address after it renders; wait for that rather than racing it.
  await page.waitForURL((u) => new URL(u).searchParams.has('balance'))
  const id = Number(new URL(page.url()).searchParams.get('balance'))
  expect(id).toBeGreaterThan(0)
  return id
}

type Bar = { key: string; need: number; supplied: number; pct: number; unit: string; word: string; text: string }
async function bars(page: Page): Promise<Bar[]> {
  return page.$$eval('[data-test^=bar-][data-pct]', (els) =>
    els.map((e) => ({
      key: e.getAttribute('data-test')!.slice(4),
      need: Number(e.getAttribute('data-need')),
      supplied: Number(e.getAttribute('data-supplied')),
      pct: Number(e.getAttribute('data-pct')),
      unit: e.getAttribute('data-unit')!,
      word: e.getAttribute('data-word')!,
      text: e.textContent ?? '',
    })),
  )
}

async function apiGet<T>(page: Page, path: string): Promise<T> {
  const res = await page.request.get(`${srv.url}/api${path}`)
  expect(res.status()).toBe(200)
  return (await res.json()) as T
}

describe('journey 1: a cattle producer checks the cowpea corridor for late-gestation cows', () => {
  let balanceId: number
  it('when the owner opens the cows’ balance on the cowpea field, then the screen shows late gestation, CP short or covered, the supplement and the cost', async () => {
    const { page } = owner
    await expect.poll(() => page.textContent('[data-test=current-operation]')).toContain(DEMO_OPERATIONS.main.name)
    balanceId = await openStoredBalance(page, 'Cows, late gestation, cowpea field')
    expect(await page.textContent('[data-test=balance-stage]')).toMatch(/Late gestation, day \d+/)
    expect(await page.textContent('[data-test=balance-result]')).toContain('cowpea')
    const cp = (await bars(page)).find((b) => b.key === 'cp')!
    expect(['short', 'covered', 'surplus']).toContain(cp.word)
    expect(cp.text).toContain(fmtPct(cp.pct))
    expect(await page.isVisible('[data-test=supplement-plan]')).toBe(true)
    expect(await page.textContent('[data-test=cost-per-head]')).toMatch(/^\$\d+\.\d\d$/)
  })

  it('when every number on the Balance screen is read, then it equals what the engine returns for the stored inputs', async () => {
    const { page } = owner
    const opId = new URL(page.url()).pathname.split('/')[2]
    const b = await apiGet<{ latest: { inputs: { problem: RationProblem; feeds: FeedRef[]; herd: { headCount: number } }; result: BalanceResult } }>(page, `/operations/${opId}/balances/${balanceId}`)
    const engine = await balanceRation(b.latest.inputs.problem)
    expect(b.latest.result).toEqual(JSON.parse(JSON.stringify(engine)))
    const shown = await bars(page)
    const dmi = engine.intakes.reduce((a, i) => a + i.kgDm, 0)
    const dm = shown.find((x) => x.key === 'dm')!
    expect(dm.need).toBeCloseTo(massValue(engine.intakeCapacityKg, 'us'), 9)
    expect(dm.supplied).toBeCloseTo(massValue(dmi, 'us'), 9)
    expect(shown.filter((x) => x.key !== 'dm').map((x) => x.key)).toEqual(engine.supply.map((s) => s.nutrient))
    for (const s of engine.supply) {
      const x = shown.find((y) => y.key === s.nutrient)!
      const need = nutrientDisplay(s.need, s.unit, 'us')
      const sup = nutrientDisplay(s.supplied, s.unit, 'us')
      expect(x.need).toBeCloseTo(need.value, 9)
      expect(x.supplied).toBeCloseTo(sup.value, 9)
      expect(x.pct).toBeCloseTo(s.pctCovered, 9)
      expect(x.word).toBe(coverageWord(s.pctCovered))
      expect(x.text).toContain(`need ${fmtNumber(need.value)} ${need.unit} · supplied ${fmtNumber(sup.value)} ${sup.unit}`)
    }
    const plan = supplementPlan(engine, b.latest.inputs.feeds, b.latest.inputs.herd.headCount)
    const rows = await page.$$eval('[data-test^="plan-feed-"]', (els) => els.map((e) => ({ perHead: Number(e.getAttribute('data-per-head')), cost: Number(e.getAttribute('data-cost')) })))
    expect(rows).toHaveLength(plan.rows.length)
    plan.rows.forEach((r, i) => {
      expect(rows[i].perHead).toBeCloseTo(massValue(r.kgAsFedPerHead, 'us'), 9)
      expect(rows[i].cost).toBeCloseTo(r.costPerHeadDay, 9)
    })
    expect(Number(await page.getAttribute('[data-test=plan-cost-total]', 'data-cost'))).toBeCloseTo(engine.costPerHeadDay, 9)
  })

  it('when the owner switches to metric, then every mass figure is divided by 2.20462… (1 lb = 0.45359237 kg, NIST SP 811) and the rest stays', async () => {
    const { page } = owner
    const before = await bars(page)
    const planBefore = await page.$$eval('[data-test^="plan-feed-"]', (els) => els.map((e) => Number(e.getAttribute('data-per-head'))))
    await page.click('[data-test=units-toggle] button:has-text("Metric")')
    await expect.poll(async () => (await bars(page)).find((x) => x.key === 'dm')?.unit).toBe('kg')
    const after = await bars(page)
    for (const [i, x] of before.entries()) {
      const y = after[i]
      const factor = x.unit === 'lb' ? 0.45359237 : 1
      expect(y.unit).toBe(x.unit === 'lb' ? 'kg' : x.unit)
      expect(y.need).toBeCloseTo(x.need * factor, 9)
      expect(y.supplied).toBeCloseTo(x.supplied * factor, 9)
      expect(y.pct).toBeCloseTo(x.pct, 12)
    }
    const planAfter = await page.$$eval('[data-test^="plan-feed-"]', (els) => els.map((e) => Number(e.getAttribute('data-per-head'))))
    planBefore.forEach((v, i) => expect(planAfter[i]).toBeCloseTo(v * 0.45359237, 9))
    expect(await page.textContent('[data-test=supplement-plan]')).not.toMatch(/\d lb/)
    await page.click('[data-test=units-toggle] button:has-text("US")')
    await expect.poll(async () => (await bars(page)).find((x) => x.key === 'dm')?.unit).toBe('lb')
  })

  it('when the owner changes the date, then the screen re-balances live in the browser, and saving stores the server’s run as the next version', async () => {
    const { page } = owner
    await page.fill('[data-test=balance-date] input', '2027-02-20')
    await page.waitForSelector('[data-test=balance-result][data-kind=live]')
    await expect.poll(() => page.textContent('[data-test=balance-provenance]')).toContain('Live preview')
    await expect.poll(() => page.textContent('[data-test=balance-stage]')).toMatch(/day \d+ \(18 days to calving\)/)
    await page.click('[data-test=balance-save]')
    await page.waitForSelector('[data-test=balance-result][data-kind=stored]')
    await expect.poll(() => page.textContent('[data-test=balance-provenance]')).toContain('Saved version 2')
  })
})

describe('journey 2: a sheep producer plans supplements for twin-bearing ewes', () => {
  it('when the owner opens the twin ewes in late gestation, then the cattle mineral cannot be chosen and is listed as not offered, with the copper caution', async () => {
    const { page } = owner
    await openStoredBalance(page, 'Twin ewes, late gestation')
    expect(await page.textContent('[data-test=balance-stage]')).toMatch(/Late gestation, day \d+ .*twins/)
    const blocked = page.locator('[data-test^=supp-blocked-]')
    expect(await blocked.count()).toBe(1)
    expect(await blocked.first().textContent()).toContain('never offered to sheep')
    const mineralBox = page.locator('[data-test=balance-supplements] .v-checkbox').filter({ hasText: 'Demo cattle mineral' }).locator('input')
    expect(await mineralBox.isDisabled()).toBe(true)
    expect(await page.textContent('[data-test=excluded]')).toContain('Demo cattle mineral (cattle only)')
    expect(await page.textContent('[data-test=supplement-plan]')).not.toContain('cattle mineral')
    expect(await page.isVisible('[data-test=caution-copper-sheep]')).toBe(true)
    expect(await page.isVisible('[data-test=caution-pregnancy-toxaemia]')).toBe(true)
  })

  it('when the owner opens the same ewes in early lactation, then a supplement is suggested with its amount and cost, and never the cattle mineral', async () => {
    const { page } = owner
    await openStoredBalance(page, 'Twin ewes, early lactation')
    expect(await page.textContent('[data-test=balance-stage]')).toMatch(/Early lactation, day \d+ \(twins\)/)
    const names = await page.$$eval('[data-test=plan-name]', (els) => els.map((e) => e.textContent ?? ''))
    expect(names.length).toBeGreaterThan(0)
    expect(names.join(' ')).not.toContain('cattle')
    expect(await page.textContent('[data-test=plan-per-head]')).toMatch(/\d lb/)
    expect(await page.textContent('[data-test=cost-per-head]')).toMatch(/^\$\d+\.\d\d$/)
  })
})

describe('journey 3: a nutritionist uploads a client’s lab CSV, corrects two values, re-runs the affected balances and e-mails the report', () => {
  it('when the file has two bad rows, then they are refused with reasons; after two hand corrections the client’s balance is out of date, re-runs in one action, and the client receives the report with the PDF', async () => {
    const { page } = nutritionist
    await page.click('[data-test=operation-switcher]')
    await page.getByRole('listitem').filter({ hasText: DEMO_OPERATIONS.client.name }).first().click()
    await expect.poll(() => page.textContent('[data-test=current-operation]')).toContain(DEMO_OPERATIONS.client.name)
    await openPart(page, 'lab-results')

    const csv = [
      'feed,sample_date,lab,sample_ref,basis,dm,cp,tdn,adf,ndf,ca,p',
      'Demo grass hay, round bales,2027-01-05,Demo Feed Lab,J3-1,as-fed,87,6.9,46,36,58,0.38,0.15',
      'Demo hay that does not exist,2027-01-05,Demo Feed Lab,J3-2,dm,88,8,55,,,,',
      'Demo grass hay, round bales,2027-01-06,Demo Feed Lab,J3-3,dm,eighty,8.1,54,,,,',
      'Demo range cube 20 % CP,2027-01-06,Demo Feed Lab,J3-4,as-fed,91,19.5,66,,,1.0,0.8',
    ]
      // The hay's name has a comma: quote it as a spreadsheet would.
      .map((l) => l.replace('Demo grass hay, round bales', '"Demo grass hay, round bales"'))
      .join('\n')
    await page.setInputFiles('[data-test=lab-csv-input] input[type=file]', { name: 'client-lab.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) })
    await page.click('[data-test=lab-csv-send]')
    await page.waitForSelector('[data-test=lab-upload-preview]')
    expect(await page.textContent('[data-test=upload-accepted]')).toContain('2 accepted')
    expect(await page.textContent('[data-test=upload-refused]')).toContain('2 refused')
    expect(await page.textContent('[data-test=refused-line-3]')).toContain('No feed named "Demo hay that does not exist"')
    expect(await page.textContent('[data-test=refused-line-4]')).toMatch(/dm.*"eighty" is not a number/)
    await page.click('[data-test=lab-upload-save]')
    await page.waitForSelector('[data-test=lab-upload-saved]')
    expect(await page.textContent('[data-test=lab-upload-saved]')).toContain('Saved 2 results')

    // Two values fixed by hand: the hay's CP and the cube's TDN.
    for (const [row, field, value] of [['J3', 'cpPct', '7.6'], ['J3', 'tdnPct', '70']] as const) {
      void row
      const target = field === 'cpPct' ? 'Demo grass hay, round bales' : 'Demo range cube 20 % CP'
      await page.locator('[data-test=lab-table] tbody tr').filter({ hasText: target }).filter({ hasText: '2027-01-0' }).first().click()
      await page.waitForSelector('[data-test=lab-form]')
      await expect.poll(() => page.textContent('[data-test=lab-dialog]')).toContain('version 1')
      await page.fill(`[data-test=lab-form] input[name=${field}]`, value)
      await page.click('[data-test=lab-save]')
      await page.waitForSelector('[data-test=lab-affected]')
      await expect.poll(() => page.textContent('[data-test=lab-history]')).toContain('Version 2')
      await page.keyboard.press('Escape')
      await page.waitForSelector('[data-test=lab-dialog]', { state: 'detached' })
    }

    await openPart(page, 'balance')
    await page.waitForSelector('[data-test=out-of-date-chip]')
    expect(await page.locator('[data-test=out-of-date-chip]').count()).toBeGreaterThanOrEqual(1)
    await page.click('[data-test=rerun-out-of-date]')
    await page.waitForSelector('[data-test=out-of-date-chip]', { state: 'detached' })

    await openPart(page, 'reports')
    await page.waitForSelector('[data-test=balance-report]')
    expect(await page.textContent('[data-test=report-footer]')).toContain('checked by a nutritionist or veterinarian')
    await page.click('[data-test=report-email]')
    const client = `client-${Date.now()}@example.test`
    await page.fill('[data-test=email-addresses] input', client)
    await page.click('[data-test=email-send]')
    await page.waitForSelector('[data-test=report-sent]')
    const mail = await srv.sink.waitFor(client)
    expect(mail.subject).toContain('Client cows')
    expect(mail.text).toContain('checked by a nutritionist or veterinarian')
    expect(mail.attachments).toEqual([expect.objectContaining({ contentType: 'application/pdf' })])
    expect(mail.attachments[0].size).toBeGreaterThan(1000)
  })
})

describe('console', () => {
  it('shows no console errors in either browser', () => {
    expect([...owner.errors, ...nutritionist.errors]).toEqual([])
  })
})
