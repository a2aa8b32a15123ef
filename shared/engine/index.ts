// Public API of the StandGraze domain engine: pure functions shared by client and server.
export * from './units'
export * from './nutrition/index'
export * from './grazing/index'
