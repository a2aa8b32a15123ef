// Grazing: field supply, yield worksheets, strip plan, diet within a strip, season budget, hazards, field economics.
export { evidenceLabelSchema, type EvidenceLabel, type Cited } from './common'
export * from './conversions'
export * from './field'
export * from './yield'
export * from './animals'
export * from './strip'
