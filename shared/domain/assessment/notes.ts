// Method notes: the formula, its source and the inputs behind every computed figure.
import { HUGGETT_J_PER_G_O2, SULFUR_PRODUCT } from '../oxygen'
import type { proofChargeBound } from '../peak-pressure'
import type { LabPolicy } from '../policy'
import type { ChargeInput, MethodNote } from './contract'
import type { ChargeModel, ChargeState, ComponentModel, peakAt } from './model'

export function methodNotes(
  model: ChargeModel,
  input: ChargeInput,
  policy: LabPolicy,
  r: { m: number; s: ChargeState; excess: number | null; peak: ReturnType<typeof peakAt>; proof: ReturnType<typeof proofChargeBound>; massOf: (c: ComponentModel) => number },
): MethodNote[] {
  const notes: MethodNote[] = []
  for (const c of model.components) {
    const inputs: Record<string, number | string> = { component: c.label, massG: r.massOf(c) }
    if (c.source === 'fuse-wire') {
      notes.push({ figure: `heat release of ${c.label}`, formula: 'Q = length × J/cm of the wire type', source: 'lab policy (the lab\'s own decision); platinum does not burn', inputs: { ...inputs, heatJ: c.fixedHeatJ } })
      continue
    }
    const formula = {
      'declared': 'Q = m × declared heating value',
      'material': 'Q = m × heating value of the material record',
      'correlation': 'HHV_d (MJ/kg) = 0.3491C + 1.1783H + 0.1005S − 0.1034O − 0.0151N − 0.0211A; HHV = HHV_d·(1 − M/100); Q = m × HHV',
      'element-oxide': `Q = m × (−ΔfH° of ${c.elementFuel?.oxide ?? 'the oxide'}) / (atoms per oxide × atomic weight)`,
      'policy-fallback': 'Q = m × conservative policy heating value',
      'cotton': 'Q = m × policy J/g of cotton',
      'fuse-wire': '',
    }[c.source]
    const source = {
      'declared': 'value given by the planner',
      'material': 'materials library',
      'correlation': `Channiwala & Parikh 2002, Fuel 81:1051 (composition ${c.compositionFrom === 'derived' ? 'from the formula or structure' : 'as given'})`,
      'element-oxide': 'NIST-JANAF Thermochemical Tables (formation enthalpy of the oxide at 298.15 K)',
      'policy-fallback': c.fallbackReason ? `lab policy (${c.fallbackReason})` : 'lab policy',
      'cotton': 'lab policy (the lab\'s own decision)',
      'fuse-wire': '',
    }[c.source]
    notes.push({ figure: `heating value of ${c.label}`, formula, source, inputs: { ...inputs, heatingValueJPerG: c.heatPerG } })
    notes.push(c.demandFrom === 'composition'
      ? { figure: `oxygen demand of ${c.label}`, formula: `n(O2)/g = C/12.011 + H/4.032 + 1.5·S/32.06 − O/31.998 (mass fractions; S → ${SULFUR_PRODUCT}, the larger demand than SO2; N → N2; Cl → HCl as far as the hydrogen goes, Cl2 beyond it)`, source: 'stoichiometry, IUPAC atomic weights', inputs: { ...inputs, demandMolPerG: c.demandPerG } }
      : c.demandFrom === 'element'
        ? { figure: `oxygen demand of ${c.label}`, formula: `n(O2)/g = O2 per atom / atomic weight (${c.elementFuel?.element ?? ''} → ${c.elementFuel?.oxide ?? ''}, a solid oxide: no gas formed)`, source: 'stoichiometry, IUPAC atomic weights', inputs: { ...inputs, demandMolPerG: c.demandPerG } }
        : { figure: `oxygen demand of ${c.label}`, formula: `n(O2) = Q_net / (${HUGGETT_J_PER_G_O2.toLocaleString('en-US')} J per g O2 × 31.998 g/mol); Q_net = Q_gross − n(H2O)·44.0 kJ/mol with the water of (CH2)n (estimated from heat: no composition)`, source: 'Huggett 1980, Fire and Materials 4:61 (constant on the net heat of combustion basis); CODATA key values for the heat of vaporisation', inputs: { ...inputs, demandMolPerG: c.demandPerG } })
  }
  notes.push({ figure: 'heat release', formula: 'Q = Σ mass × heating value (+ fuse wire length × J/cm)', source: 'sum over the charge: sample, aid, fuse (common practice)', inputs: { heatReleaseJ: r.s.heatJ, sampleMassG: r.m } })
  notes.push({
    figure: 'oxygen available',
    formula: 'n = P_abs·V/(Z·R·T) − 0.7905·n_air; V = vessel − water − charge/density; P_abs = gauge + 0.101325 MPa; n_air = 0.101325 MPa·V/(R·T)',
    source: 'virial equation of O2 (Tsonopoulos 1974; Orbey & Vera 1983; critical constants Schmidt & Wagner 1985); air composition ISO 2533',
    inputs: {
      fillPressureMPaGauge: input.fillPressureMPa,
      freeVolumeMl: r.s.freeVolumeMl,
      temperatureC: model.geometry.temperatureC,
      waterMl: model.geometry.waterMl,
      oxygenAvailableMol: r.s.oxygenMol,
      nitrogenFromAirMol: r.s.nitrogenMol,
    },
  })
  notes.push({ figure: 'oxygen excess', formula: 'excess = oxygen available / oxygen demand', source: 'ratio of the oxygen filled to the stoichiometric demand (common practice)', inputs: { oxygenDemandMol: r.s.demandMol, oxygenExcess: r.excess ?? 'no demand' } })
  notes.push({
    figure: 'peak-pressure bound',
    formula: 'Σ nᵢ[Uᵢ(T) − Uᵢ(T₀)] = Q − n(H2O)·ΔvapU; P = n·R·T/V (constant volume, adiabatic, complete combustion, ideal gas at the peak)',
    source: 'NASA Glenn polynomials, McBride, Zehe & Gordon 2002, NASA/TP-2002-211556; ΔvapU from CODATA key values',
    inputs: { peakTemperatureK: r.peak.temperatureK, peakPressureMPaAbsolute: r.peak.pressureMPa, gasMol: r.peak.totalMol },
  })
  const proofCharge = input.vessel.proofCharge
  notes.push({
    figure: 'proof-charge bound',
    formula: 'the same bound for the vessel proof charge of benzoic acid',
    source: proofCharge ? 'vessel record' : 'lab policy: 2 g benzoic acid at 40 atm gauge (ASTM E144 summaries)',
    inputs: {
      massG: proofCharge?.massG ?? policy.proofChargeMassG,
      fillPressureMPaGauge: proofCharge?.fillPressureMPa ?? policy.proofChargeFillPressureMPa,
      peakPressureMPaAbsolute: r.proof.pressureMPa,
      peakTemperatureK: r.proof.temperatureK,
    },
  })
  return notes
}
