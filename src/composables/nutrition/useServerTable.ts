// Server-side paging, sorting and filtering for a Vuetify data table, with one explicit request state.
import { ref, shallowRef, watch, type Ref } from 'vue'
import { useRequest } from '@/composables/useRequest'

export type TableOptions = { page: number; itemsPerPage: number; sortBy: { key: string; order?: 'asc' | 'desc' | boolean }[] }
type Page<T> = { items: T[]; total: number; page: number; pageSize: number }

export function useServerTable<T>(fetch: (query: Record<string, string | number | undefined>) => Promise<Page<T>>, filters: Ref<Record<string, string | number | undefined>>, initial: Partial<TableOptions> = {}) {
  const options = ref<TableOptions>({ page: 1, itemsPerPage: 25, sortBy: [], ...initial })
  const items = shallowRef<T[]>([])
  const total = ref(0)
  const req = useRequest(async () => {
    const s = options.value.sortBy[0]
    const res = await fetch({
      page: options.value.page,
      pageSize: options.value.itemsPerPage,
      sort: s?.key,
      dir: s?.order === 'desc' ? 'desc' : 'asc',
      ...filters.value,
    })
    items.value = res.items
    total.value = res.total
    return res
  })
  function update(o: TableOptions) {
    options.value = o
    void req.run()
  }
  watch(filters, () => {
    options.value = { ...options.value, page: 1 }
    void req.run()
  }, { deep: true })
  return { options, items, total, state: req.state, error: req.error, update, reload: () => req.run() }
}
