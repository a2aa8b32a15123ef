// Grazing schemas: fields and components, yield worksheets, strip plans, season, Today and crew records.
export * from './fields'
export * from './estimates'
export * from './plans'
export * from './records'
export * from './season'
