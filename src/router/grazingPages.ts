// Pages of Today, Fields, Strip plan and Season, by navigation name (lazy-loaded).
export const grazingPages: Record<string, () => Promise<unknown>> = {
  today: () => import('@/pages/grazing/TodayPage.vue'),
  fields: () => import('@/pages/grazing/FieldsPage.vue'),
  'strip-plan': () => import('@/pages/grazing/StripPlanPage.vue'),
  season: () => import('@/pages/grazing/SeasonPage.vue'),
}
