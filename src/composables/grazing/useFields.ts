// Request state for the Fields screen: the operation's fields and strip plans, reloaded after each change.
import { computed } from 'vue'
import { useRequest } from '@/composables/useRequest'
import { fieldsApi, plansApi } from '@/api/grazing'
import type { Field } from '@shared/schemas/grazing/fields'

export function useFields(opId: () => number) {
  const list = useRequest(async () => {
    const [fields, plans] = await Promise.all([fieldsApi.list(opId()), plansApi.list(opId())])
    return { fields: fields.items, plans: plans.items }
  })
  const fields = computed(() => list.data.value?.fields ?? [])
  const plans = computed(() => list.data.value?.plans ?? [])
  const action = useRequest(async (fn: () => Promise<unknown>) => {
    await fn()
    await list.run()
  })
  /** Puts a field the server returned in place without a full reload. */
  function replace(f: Field) {
    const d = list.data.value
    if (!d) return
    const i = d.fields.findIndex((x) => x.id === f.id)
    const fields = i >= 0 ? d.fields.map((x) => (x.id === f.id ? f : x)) : [...d.fields, f].sort((a, b) => a.name.localeCompare(b.name))
    list.data.value = { ...d, fields }
  }
  return { list, fields, plans, action, replace, reload: () => list.run() }
}
