// `npm run dev`: the private PostgreSQL cluster, the API under `tsx watch` on :3001, and Vite with hot reload on :5173 proxying /api.
import { spawn } from 'node:child_process'
import { join } from 'node:path'
import { DATA, ROOT, ensureDependencies, log, startCluster } from './lib/provision.mjs'

ensureDependencies()
const pgPort = Number(process.env.PGPORT ?? 54329)
const cluster = startCluster({ dataDir: join(DATA, 'pg'), sockDir: join(DATA, 'pg-run'), port: pgPort })
const apiPort = process.env.API_PORT ?? '3001'
const bin = (name) => join(ROOT, 'node_modules', '.bin', name)

const children = [
  spawn(bin('tsx'), ['watch', '--clear-screen=false', 'server/index.ts'], {
    cwd: ROOT,
    stdio: 'inherit',
    env: { ...process.env, DATABASE_URL: process.env.DATABASE_URL ?? cluster.url, PORT: apiPort, PUBLIC_URL: 'http://127.0.0.1:5173' },
  }),
  spawn(bin('vite'), [], { cwd: ROOT, stdio: 'inherit', env: { ...process.env, API_PORT: apiPort } }),
]
log('dev: open http://127.0.0.1:5173 (API on :' + apiPort + ')')

let stopping = false
function stop() {
  if (stopping) return
  stopping = true
  for (const c of children) c.kill('SIGTERM')
  setTimeout(() => {
    cluster.stop()
    process.exit(0)
  }, 1500)
}
process.on('SIGINT', stop)
process.on('SIGTERM', stop)
for (const c of children) c.on('exit', stop)
