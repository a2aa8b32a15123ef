// Request state with one explicit value (idle / loading / done / error), for every screen that calls the API.
import { ref, shallowRef } from 'vue'
import { ApiRequestError } from '@/api/client'

export type RequestState = 'idle' | 'loading' | 'done' | 'error'

export function useRequest<A extends unknown[], T>(fn: (...args: A) => Promise<T>) {
  const state = ref<RequestState>('idle')
  const data = shallowRef<T | null>(null)
  const error = shallowRef<ApiRequestError | Error | null>(null)

  async function run(...args: A): Promise<T | undefined> {
    state.value = 'loading'
    error.value = null
    try {
      const result = await fn(...args)
      data.value = result
      state.value = 'done'
      return result
    } catch (e) {
      error.value = e instanceof Error ? e : new Error(String(e))
      state.value = 'error'
      return undefined
    }
  }

  function fieldError(field: string): string | undefined {
    return error.value instanceof ApiRequestError ? error.value.fieldMessage(field) : undefined
  }

  return { state, data, error, run, fieldError }
}
