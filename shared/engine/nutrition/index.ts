// Nutrition: energy chain, cattle and sheep requirements, ration balance (LP).
export {}
