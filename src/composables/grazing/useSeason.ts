// State of the Season screen: the stored fields, plans and settings from the API, and the season budget recomputed in the browser as dates and prices change (timed, since it must stay well under 200 ms).
import { computed, ref, shallowRef, watch } from 'vue'
import { useRequest } from '@/composables/useRequest'
import { seasonApi } from '@/api/grazing'
import { seasonSettingsSchema, type SeasonSettingsValues } from '@shared/schemas/grazing/season'
import { computeSeason, type SeasonGroup } from '@shared/adapters/grazing/seasonInput'
import type { SeasonBudget } from '@shared/engine/grazing/index'

export function useSeason(opId: () => number) {
  const load = useRequest(() => seasonApi.get(opId()))
  const settings = ref<SeasonSettingsValues | null>(null)
  watch(load.data, (d) => {
    if (d) settings.value = structuredClone(d.settings)
  })
  const valid = computed(() => (settings.value ? seasonSettingsSchema.safeParse(settings.value) : null))
  const budget = shallowRef<SeasonBudget | null>(null)
  const groups = shallowRef<SeasonGroup[]>([])
  const computeMs = ref<number | null>(null)
  const computeError = ref<string | null>(null)
  watch(
    [valid, load.data],
    () => {
      const d = load.data.value
      if (!d || !valid.value?.success) return
      const t0 = performance.now()
      try {
        const r = computeSeason(valid.value.data, d.fields, d.plans)
        budget.value = r.budget
        groups.value = r.groups
        computeError.value = null
      } catch (e) {
        computeError.value = e instanceof Error ? e.message : String(e)
      }
      computeMs.value = performance.now() - t0
    },
    { deep: true },
  )
  const save = useRequest(async () => {
    if (!valid.value?.success) return null
    const saved = await seasonApi.saveSettings(opId(), valid.value.data)
    if (load.data.value) load.data.value = { ...load.data.value, settings: saved, settingsSaved: true }
    return saved
  })
  return { load, settings, valid, budget, groups, computeMs, computeError, save }
}
