// Runs a yield worksheet through the grazing engine: each sample, then their average and spread; pure, so the dialog previews exactly what the server saves.
import { grainYieldFromHeads, clipPlotDm, sampleSpread } from '../../engine/grazing/index'
import { kgPerHaToLbPerAcre } from '../../engine/units'
import type { ClippedFrameWorksheet, HeadCountWorksheet, WorksheetResult } from '../../schemas/grazing/estimates'

/**
 * Head counts: K-State's formula per stretch of row (engine grainYieldFromHeads), DM per hectare at the 14 %
 * moisture basis; clipped frames: DM per frame (engine clipPlotDm). The field's figure is the plain mean of the
 * samples, with the spread (NDSU R1838: clip several plots and average).
 */
export function computeWorksheet(w: HeadCountWorksheet | ClippedFrameWorksheet): WorksheetResult {
  if (w.method === 'head-count') {
    const samples = w.samples.map((s) => {
      const y = grainYieldFromHeads({ rowSpacingIn: w.rowSpacingIn, rowLengthFt: s.rowLengthFt, rows: s.rows, heads: s.heads, seedsPerHead: w.seedsPerHead, seedsPerLb: w.seedsPerLb })
      return { kgDmPerHa: y.kgDmPerHa, lbDmPerAcre: kgPerHaToLbPerAcre(y.kgDmPerHa), dmPct: null, buPerAcre: y.buPerAcre, headsPerAcre: y.headsPerAcre }
    })
    return {
      kind: 'sorghum-grain',
      kgDmPerHa: sampleSpread(samples.map((s) => s.kgDmPerHa)),
      samples,
      buPerAcre: sampleSpread(samples.map((s) => s.buPerAcre)),
      dmPct: null,
      // A head count over the full row spacing is already per hectare of field.
      basis: 'field',
    }
  }
  const frame = w.frameAreaFt2 !== undefined ? { frameAreaFt2: w.frameAreaFt2 } : { frameAreaM2: w.frameAreaM2 as number }
  const samples = w.samples.map((s) => {
    const r = clipPlotDm({ ...frame, wetG: s.wetG, dryG: s.dryG, containerG: s.containerG })
    return { kgDmPerHa: r.kgDmPerHa, lbDmPerAcre: r.lbDmPerAcre, dmPct: r.dmPct, buPerAcre: null, headsPerAcre: null }
  })
  return {
    kind: w.kind,
    kgDmPerHa: sampleSpread(samples.map((s) => s.kgDmPerHa)),
    samples,
    buPerAcre: null,
    dmPct: sampleSpread(samples.map((s) => s.dmPct as number)),
    // Frames for the legume are thrown inside the corridor unless the user says otherwise.
    basis: w.basis ?? (w.kind.startsWith('legume') ? 'band' : 'field'),
  }
}
