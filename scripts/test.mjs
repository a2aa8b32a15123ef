// `npm test`: the same provisioning on a throwaway cluster and free port, then type-check, lint, unit, API, component and browser tests; ends with "N passed, N failed".
import { spawnSync } from 'node:child_process'
import { existsSync, mkdtempSync, readFileSync, rmSync, chmodSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { ROOT, ensureChromium, ensureDependencies, freePort, log, npx, startCluster } from './lib/provision.mjs'

const only = process.argv[2] // optional: typecheck | lint | unit | api | component | browser
ensureDependencies()

const needsDb = !only || only === 'api' || only === 'browser'
const needsBrowser = !only || only === 'browser'
const chromium = needsBrowser ? ensureChromium() : undefined

const work = mkdtempSync(join(tmpdir(), 'standgraze-test-'))
chmodSync(work, 0o755)
let cluster = null
let dbUrls = {}
if (needsDb) {
  const port = await freePort()
  const opts = { dataDir: join(work, 'pg'), sockDir: join(work, 'run'), port, fsync: false }
  cluster = startCluster({ ...opts, db: 'standgraze_api' })
  startCluster({ ...opts, db: 'standgraze_browser' })
  dbUrls = { api: cluster.url, browser: cluster.url.replace(/standgraze_api$/, 'standgraze_browser') }
  log(`throwaway PostgreSQL on 127.0.0.1:${port}`)
}

const results = []
function step(name, fn) {
  if (only && only !== name) return
  log(`── ${name} ──`)
  const t0 = Date.now()
  const r = fn()
  results.push({ name, ...r, seconds: (Date.now() - t0) / 1000 })
}

function simple(bin, args, env = {}) {
  const r = npx(bin, args, { env: { ...process.env, ...env } })
  return r.status === 0 ? { passed: 1, failed: 0 } : { passed: 0, failed: 1 }
}

function vitest(project, env = {}) {
  const out = join(work, `${project}.json`)
  const r = npx('vitest', ['run', '--project', project, '--reporter=default', '--reporter=json', `--outputFile.json=${out}`], {
    env: { ...process.env, ...env, NODE_ENV: 'test' },
  })
  if (!existsSync(out)) return { passed: 0, failed: 1, note: `vitest exited ${r.status} without a report` }
  const j = JSON.parse(readFileSync(out, 'utf8'))
  const failedSuites = j.testResults.filter((s) => s.status === 'failed' && s.assertionResults.length === 0).length
  const failed = j.numFailedTests + failedSuites + (r.status !== 0 && j.numFailedTests === 0 && failedSuites === 0 ? 1 : 0)
  return { passed: j.numPassedTests, failed, skipped: j.numPendingTests + j.numTodoTests }
}

try {
  step('typecheck', () => {
    const parts = [
      ['vue-tsc', ['--noEmit', '-p', 'tsconfig.json']],
      ['tsc', ['--noEmit', '-p', 'shared/tsconfig.json']],
      ['tsc', ['--noEmit', '-p', 'server/tsconfig.json']],
      ['vue-tsc', ['--noEmit', '-p', 'tests/tsconfig.json']],
    ]
    let passed = 0
    let failed = 0
    for (const [bin, args] of parts) {
      if (npx(bin, args).status === 0) passed++
      else failed++
    }
    return { passed, failed }
  })
  step('lint', () => simple('eslint', ['.', '--max-warnings=0']))
  step('unit', () => vitest('unit'))
  step('api', () => vitest('api', { DATABASE_URL: dbUrls.api }))
  step('component', () => vitest('component'))
  step('browser', () => {
    const b = spawnSync(join(ROOT, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], { cwd: ROOT, stdio: 'inherit' })
    if (b.status !== 0) return { passed: 0, failed: 1, note: 'vite build failed' }
    return vitest('browser', { DATABASE_URL: dbUrls.browser, CHROMIUM_PATH: chromium })
  })
} finally {
  cluster?.stop()
  rmSync(work, { recursive: true, force: true })
}

let passed = 0
let failed = 0
let skipped = 0
process.stdout.write('\nStep         passed  failed  seconds\n')
for (const r of results) {
  passed += r.passed
  failed += r.failed
  skipped += r.skipped ?? 0
  process.stdout.write(`${r.name.padEnd(12)} ${String(r.passed).padStart(6)}  ${String(r.failed).padStart(6)}  ${r.seconds.toFixed(1).padStart(7)}${r.note ? `  (${r.note})` : ''}\n`)
}
process.stdout.write(`\n${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}\n`)
process.exit(failed > 0 || results.length === 0 ? 1 : 0)
