// The one HTTP client (ofetch): same-origin cookies, the CSRF header on writes, and errors normalised to the API's error shape.
import { ofetch, FetchError } from 'ofetch'
import type { ApiError } from '@shared/schemas/common'

function csrfToken(): string | undefined {
  const m = document.cookie.match(/(?:^|;\s*)sg_csrf=([^;]+)/)
  return m ? decodeURIComponent(m[1]) : undefined
}

export class ApiRequestError extends Error {
  constructor(public info: ApiError) {
    super(info.message)
  }
  get status() {
    return this.info.status
  }
  fieldMessage(field: string): string | undefined {
    return this.info.fields?.find((f) => f.field === field)?.message
  }
}

/** Called when any request answers 401, so the session store can send the user to sign-in. */
let onUnauthorized: (() => void) | null = null
export function setUnauthorizedHandler(fn: () => void) {
  onUnauthorized = fn
}

export const http = ofetch.create({
  baseURL: '/api',
  credentials: 'same-origin',
  retry: 0,
  onRequest({ options }) {
    const method = (options.method ?? 'GET').toUpperCase()
    if (!['GET', 'HEAD', 'OPTIONS'].includes(method)) {
      const token = csrfToken()
      if (token) {
        const headers = new Headers(options.headers as HeadersInit | undefined)
        headers.set('X-CSRF-Token', token)
        options.headers = headers
      }
    }
  },
})

export async function api<T>(path: string, opts: Parameters<typeof http>[1] = {}): Promise<T> {
  try {
    return (await http(path, opts)) as T
  } catch (e) {
    if (e instanceof FetchError) {
      const body = e.data as { error?: ApiError } | undefined
      const info: ApiError = body?.error ?? {
        status: e.status ?? 0,
        code: e.status ? 'http_error' : 'network_error',
        message: e.status ? `The server answered ${e.status}.` : 'Could not reach the server. Check the connection and try again.',
      }
      if (info.status === 401 && onUnauthorized && !path.startsWith('/auth/sign-in')) onUnauthorized()
      throw new ApiRequestError(info)
    }
    throw e
  }
}
