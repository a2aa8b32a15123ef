// Pages of Herds, Feeds, Lab results, Balance and Reports, by navigation name (lazy-loaded).
export const nutritionPages: Record<string, () => Promise<unknown>> = {}
