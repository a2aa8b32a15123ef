// Pages of Today, Fields, Strip plan and Season, by navigation name (lazy-loaded).
export const grazingPages: Record<string, () => Promise<unknown>> = {
  fields: () => import('@/pages/grazing/FieldsPage.vue'),
  'strip-plan': () => import('@/pages/grazing/StripPlanPage.vue'),
}
