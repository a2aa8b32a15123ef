// Nutrition schemas: herd groups, feeds, lab results, balances and reports (one schema per resource), and the balance's input builder.
export { listQuerySchema, actorSchema, type ListQuery, type Actor } from './common'
export * from './herds'
export * from './feeds'
export * from './labResults'
export * from './balances'
export * from './cautions'
export * from './format'
