// Units for the nutrition screens: the session's unit system and formatters that convert every figure the same way the PDF and CSV do.
import { computed } from 'vue'
import { useSessionStore } from '@/stores/session'
import * as f from '@shared/schemas/nutrition/format'

export function useUnits() {
  const session = useSessionStore()
  const units = computed<f.Units>(() => session.unitSystem)
  return {
    units,
    massUnit: computed(() => f.massUnit(units.value)),
    tempUnit: computed(() => f.tempUnit(units.value)),
    windUnit: computed(() => f.windUnit(units.value)),
    mass: (kg: number, digits?: number) => f.fmtMass(kg, units.value, digits),
    massValue: (kg: number) => f.massValue(kg, units.value),
    nutrient: (value: number, unit: 'kg' | 'Mcal' | 'g') => {
      const d = f.nutrientDisplay(value, unit, units.value)
      return `${f.fmtNumber(d.value)} ${d.unit}`
    },
    number: f.fmtNumber,
    money: f.fmtMoney,
    pct: f.fmtPct,
    /** Price per lb or per kg as fed from a price per kg as fed. */
    perMassUnit: (perKg: number) => (units.value === 'us' ? perKg * 0.45359237 : perKg),
  }
}
