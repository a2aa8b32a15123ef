// Single-use tokens for invitations and password resets: random, sent once, stored only as a SHA-256 hash.
import { createHash, randomBytes } from 'node:crypto'

export function newToken() {
  const token = randomBytes(32).toString('base64url')
  return { token, hash: hashToken(token) }
}

export function hashToken(token: string) {
  return createHash('sha256').update(token).digest('hex')
}
