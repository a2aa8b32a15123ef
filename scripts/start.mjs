// `npm start`: installs what is missing, starts the private PostgreSQL cluster, builds the client when stale, runs the server with the demo data.
import { spawn, spawnSync } from 'node:child_process'
import { existsSync, readdirSync, statSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { DATA, ROOT, ensureDependencies, log, startCluster } from './lib/provision.mjs'

ensureDependencies()

const pgPort = Number(process.env.PGPORT ?? 54329)
const cluster = startCluster({ dataDir: join(DATA, 'pg'), sockDir: join(DATA, 'pg-run'), port: pgPort })
log(`PostgreSQL is up on 127.0.0.1:${pgPort} (data in .data/pg)`)

function newestMtime(path) {
  if (!existsSync(path)) return 0
  const st = statSync(path)
  if (!st.isDirectory()) return st.mtimeMs
  let newest = st.mtimeMs
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtime(join(path, entry)))
  return newest
}

const stamp = join(ROOT, 'dist', '.build-stamp')
const sources = ['src', 'shared', 'fonts', 'index.html', 'vite.config.ts', 'package-lock.json', 'public'].map((p) => newestMtime(join(ROOT, p)))
if (!existsSync(stamp) || Math.max(...sources) > statSync(stamp).mtimeMs) {
  log('building the client (vite build)…')
  const r = spawnSync(join(ROOT, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], { cwd: ROOT, stdio: 'inherit' })
  if (r.status !== 0) {
    cluster.stop()
    process.exit(r.status ?? 1)
  }
  writeFileSync(stamp, new Date().toISOString())
}

const server = spawn(join(ROOT, 'node_modules', '.bin', 'tsx'), ['server/index.ts'], {
  cwd: ROOT,
  stdio: 'inherit',
  env: { ...process.env, DATABASE_URL: process.env.DATABASE_URL ?? cluster.url, PORT: process.env.PORT ?? '3000' },
})

let stopping = false
function shutdown(signal) {
  if (stopping) return
  stopping = true
  log(`stopping (${signal})…`)
  server.kill('SIGTERM')
}
process.on('SIGINT', () => shutdown('SIGINT'))
process.on('SIGTERM', () => shutdown('SIGTERM'))
server.on('exit', (code) => {
  cluster.stop()
  log('server and database stopped')
  process.exit(stopping ? 0 : (code ?? 1))
})
