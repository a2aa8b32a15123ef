// Grazing: field supply, yield worksheets, strip plan, season budget, hazards.
export {}
