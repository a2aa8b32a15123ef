// Zod schemas shared by client and server: one per resource.
export * from './common'
export * from './roles'
export * from './auth'
export * from './operations'
export * from './nutrition/index'
export * from './grazing/index'
