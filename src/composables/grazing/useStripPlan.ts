// State of the Strip plan screen: fields, plans and herd groups from the API, the plan being edited as a draft, and its evaluation recomputed in the browser on every change.
import { computed, ref, watch } from 'vue'
import { useRequest } from '@/composables/useRequest'
import { fieldsApi, plansApi } from '@/api/grazing'
import { planCreateSchema, type GrazingGroupOption, type Plan, type PlanValues } from '@shared/schemas/grazing/plans'
import { evaluatePlan, planDay, planHazards, engineGroup } from '@shared/adapters/grazing/planEval'
import { addDays } from '@shared/engine/grazing/dates'
import { localToday } from './useUnits'
import type { Field } from '@shared/schemas/grazing/fields'

export function blankPlan(field: Field | undefined, date: string): PlanValues {
  return {
    fieldId: field?.id ?? 0,
    herdId: null,
    groupName: '',
    species: 'cattle',
    headCount: 40,
    bodyWeightKg: 545,
    intakeKgDmPerHead: 13.6,
    pregnant: false,
    lactating: false,
    grainAdapted: false,
    mineral: null,
    access: 'strip',
    daysPerMove: 1,
    basis: 'forage',
    grainAllowanceKgPerHead: null,
    utilization: null,
    startDate: date,
    endDate: null,
    startOffsetM: 0,
    paceLengthM: null,
    supplement: null,
    notes: '',
  }
}

function valuesOf(p: Plan): PlanValues {
  const { id: _i, operationId: _o, groupSource: _g, supplementSource: _s, createdAt: _c, updatedAt: _u, ...v } = p
  return { ...v }
}

export function useStripPlan(opId: () => number) {
  const load = useRequest(async () => {
    const [f, p, g] = await Promise.all([fieldsApi.list(opId()), plansApi.list(opId()), plansApi.groups(opId())])
    return { fields: f.items, plans: p.items, groups: g.items }
  })
  const fields = computed(() => load.data.value?.fields ?? [])
  const plans = computed(() => load.data.value?.plans ?? [])
  const groups = computed<GrazingGroupOption[]>(() => load.data.value?.groups ?? [])

  const selectedId = ref<number | 'new' | null>(null)
  const draft = ref<PlanValues>(blankPlan(undefined, localToday()))
  const selected = computed(() => (typeof selectedId.value === 'number' ? (plans.value.find((p) => p.id === selectedId.value) ?? null) : null))

  function select(id: number | 'new' | null) {
    selectedId.value = id
    const p = typeof id === 'number' ? plans.value.find((x) => x.id === id) : undefined
    draft.value = p ? valuesOf(p) : blankPlan(fields.value[0], localToday())
  }
  watch(plans, (ps) => {
    if (selectedId.value === null && ps.length) select(ps[0].id)
    else if (selectedId.value === null && !ps.length && fields.value.length) select('new')
  })

  const field = computed(() => fields.value.find((f) => f.id === draft.value.fieldId) ?? null)
  const valid = computed(() => planCreateSchema.safeParse(draft.value))
  const evaluation = computed(() => {
    if (!field.value || !valid.value.success) return null
    try {
      return evaluatePlan(field.value, valid.value.data)
    } catch {
      return null
    }
  })
  const ok = computed(() => (evaluation.value && evaluation.value.ok ? evaluation.value : null))

  /** Day shown on the diagram, as days from the start. */
  const dayIndex = ref(0)
  watch(
    () => [selectedId.value, ok.value?.days] as const,
    () => {
      const ev = ok.value
      if (!ev) return
      const today = Math.round((Date.parse(`${localToday()}T00:00:00Z`) - Date.parse(`${draft.value.startDate}T00:00:00Z`)) / 86_400_000)
      dayIndex.value = Math.max(0, Math.min(Math.max(0, ev.days - 1), today))
    },
  )
  const dayDate = computed(() => addDays(draft.value.startDate, dayIndex.value))
  const day = computed(() => (ok.value ? planDay(draft.value, ok.value, dayDate.value) : null))
  const hazards = computed(() => {
    if (!field.value || !ok.value) return []
    const others = plans.value.filter((o) => o.id !== selectedId.value && o.fieldId === draft.value.fieldId && o.startDate <= dayDate.value && (o.endDate ?? '9999-12-31') >= dayDate.value)
    try {
      return planHazards(field.value, draft.value, dayDate.value, others.map((o) => engineGroup(o)))
    } catch {
      return []
    }
  })

  const save = useRequest(async () => {
    const body = planCreateSchema.parse(draft.value)
    const saved = typeof selectedId.value === 'number' ? await plansApi.update(opId(), selectedId.value, body) : await plansApi.create(opId(), body)
    await load.run()
    select(saved.id)
    return saved
  })
  const remove = useRequest(async () => {
    if (typeof selectedId.value !== 'number') return
    await plansApi.remove(opId(), selectedId.value)
    selectedId.value = null
    await load.run()
  })
  const dirty = computed(() => {
    const p = selected.value
    if (!p) return selectedId.value === 'new'
    return JSON.stringify(valuesOf(p)) !== JSON.stringify(draft.value)
  })

  return { load, fields, plans, groups, selectedId, selected, select, draft, field, valid, evaluation, ok, dayIndex, dayDate, day, hazards, save, remove, dirty }
}
