// Request state for Today: the crew's day for a date, recent records, and recording "moved" or "fed".
import { computed, ref } from 'vue'
import { useRequest } from '@/composables/useRequest'
import { crewApi } from '@/api/grazing'
import type { RecordCreate } from '@shared/schemas/grazing/records'
import { localToday } from './useUnits'

export function useToday(opId: () => number) {
  const date = ref(localToday())
  const load = useRequest(async () => {
    const [today, recent] = await Promise.all([crewApi.today(opId(), date.value), crewApi.records(opId())])
    return { today, recent: recent.items.slice(0, 30) }
  })
  const items = computed(() => load.data.value?.today.items ?? [])
  const recent = computed(() => load.data.value?.recent ?? [])
  const record = useRequest(async (body: RecordCreate) => {
    const r = await crewApi.record(opId(), body)
    await load.run()
    return r
  })
  const undo = useRequest(async (id: number) => {
    await crewApi.removeRecord(opId(), id)
    await load.run()
  })
  return { date, load, items, recent, record, undo }
}
