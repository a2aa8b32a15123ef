// Pages of Herds, Feeds, Lab results, Balance and Reports, by navigation name (lazy-loaded).
export const nutritionPages: Record<string, () => Promise<unknown>> = {
  herds: () => import('@/pages/nutrition/HerdsPage.vue'),
  feeds: () => import('@/pages/nutrition/FeedsPage.vue'),
  'lab-results': () => import('@/pages/nutrition/LabResultsPage.vue'),
  balance: () => import('@/pages/nutrition/BalancePage.vue'),
  reports: () => import('@/pages/nutrition/ReportsPage.vue'),
}
