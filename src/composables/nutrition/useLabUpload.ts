// A lab CSV upload from file to saved rows, with one explicit state: sending (upload %), checking (rows checked of total), preview, saving, saved or failed.
import { computed, ref, shallowRef } from 'vue'
import { labResultsApi, uploadLabCsv } from '@/api/nutrition'
import type { LabUpload } from '@shared/schemas/nutrition/labResults'

export type UploadState = 'idle' | 'sending' | 'checking' | 'preview' | 'saving' | 'saved' | 'failed'
type Preview = LabUpload & { acceptedLines?: number[]; affectedBalances?: number[] }

export function useLabUpload(opId: () => number, pollMs = 300) {
  const state = ref<UploadState>('idle')
  const sent = ref(0)
  const upload = shallowRef<Preview | null>(null)
  const refusedRows = shallowRef<LabUpload['rows']>([])
  const acceptedRows = shallowRef<LabUpload['rows']>([])
  const error = shallowRef<Error | null>(null)
  const saved = shallowRef<{ created: number; affected: number[] } | null>(null)

  const checked = computed(() => (upload.value && upload.value.total ? upload.value.processed / upload.value.total : 0))

  async function start(file: File) {
    error.value = null
    saved.value = null
    upload.value = null
    refusedRows.value = []
    acceptedRows.value = []
    state.value = 'sending'
    sent.value = 0
    try {
      let u = await uploadLabCsv(opId(), file, (f) => (sent.value = f))
      upload.value = u
      state.value = 'checking'
      while (u.status === 'parsing') {
        await new Promise((r) => setTimeout(r, pollMs))
        u = await labResultsApi.uploadStatus(opId(), u.id)
        upload.value = u
      }
      if (u.status === 'failed') {
        error.value = new Error(u.error ?? 'The file could not be checked.')
        state.value = 'failed'
        return
      }
      const refused = await labResultsApi.uploadStatus(opId(), u.id, { status: 'refused', pageSize: 1000 })
      const accepted = await labResultsApi.uploadStatus(opId(), u.id, { status: 'accepted', pageSize: 50 })
      upload.value = { ...u, acceptedLines: accepted.acceptedLines }
      refusedRows.value = refused.rows ?? []
      acceptedRows.value = accepted.rows ?? []
      state.value = 'preview'
    } catch (e) {
      error.value = e instanceof Error ? e : new Error(String(e))
      state.value = 'failed'
    }
  }

  async function confirm(lines?: number[]) {
    if (!upload.value) return
    state.value = 'saving'
    try {
      const res = await labResultsApi.confirmUpload(opId(), upload.value.id, lines ?? upload.value.acceptedLines ?? [])
      saved.value = { created: res.createdIds?.length ?? 0, affected: res.affectedBalances ?? [] }
      state.value = 'saved'
    } catch (e) {
      error.value = e instanceof Error ? e : new Error(String(e))
      state.value = 'failed'
    }
  }

  function reset() {
    state.value = 'idle'
    upload.value = null
    error.value = null
    saved.value = null
  }

  return { state, sent, checked, upload, refusedRows, acceptedRows, error, saved, start, confirm, reset }
}
