// The words the pages use for API and record fields: in 422 messages and on the audit page, never the raw key.
import { POLICY_DESCRIPTIONS } from './domain/policy'

/** Field key → the label a page shows beside it (units as the pages write them). */
export const FIELD_LABELS: Readonly<Record<string, string>> = {
  email: 'E-mail', password: 'Password', name: 'Name', roles: 'Roles', active: 'Active', reason: 'Reason',
  sampleCode: 'Sample code', kind: 'Kind', components: 'Components', role: 'Role', materialId: 'Material', material: 'Material',
  massG: 'Mass (g)', lengthCm: 'Fuse length (cm)', wire: 'Fuse wire', heatingValueJPerG: 'Heating value (J/g)', formula: 'Formula', smiles: 'Structure (SMILES)',
  composition: 'Composition', declaredHazard: 'Declared hazard', decompositionEnergyJPerG: 'Decomposition energy (J/g)',
  vesselId: 'Vessel', vessel: 'Vessel', vesselName: 'Vessel', planId: 'Plan', plan: 'Plan', runId: 'Run', run: 'Run',
  fillPressureMPa: 'Fill pressure (MPa gauge)', note: 'Note', status: 'Status', verdict: 'Verdict', seq: 'Run number',
  weighedMassG: 'Weighed mass (g)', aidMassG: 'Aid mass (g)', outcome: 'Outcome', observations: 'Observations',
  temperatureRiseK: 'Corrected temperature rise (K)', sampleMassG: 'Sample mass (g)', certifiedValueJPerG: 'Certified value (J/g)',
  grossJPerG: 'Gross calorific value (J/g)', energyEquivalentJPerK: 'Energy equivalent (J/K)', energyEquivalentId: 'Energy equivalent',
  valueJPerK: 'Energy equivalent (J/K)', standardDeviationJPerK: 'Standard deviation (J/K)', relativeStandardDeviationPct: 'Relative standard deviation (%)',
  resultIds: 'Results', resultId: 'Result', runs: 'Runs', runIds: 'Runs', firingId: 'Firing', revision: 'Revision', inputs: 'Inputs',
  serialNumber: 'Serial number', class: 'Class', location: 'Location', ratedEnergyJ: 'Rated energy (J)', maxChargeMassG: 'Largest charge (g)',
  maxFillPressureMPa: 'Largest oxygen fill (MPa gauge)', volumeMl: 'Volume (mL)', serviceIntervalFirings: 'Routine service every (firings)',
  requalificationIntervalFirings: 'Requalification every (firings)', firingsSinceService: 'Firings since routine service',
  firingsSinceRequalification: 'Firings since requalification', firingsTotal: 'Lifetime firings', condition: 'Condition', conditionReason: 'Condition reason',
  performedAt: 'Performed on', seals: 'Seals', leakTest: 'Leak test', checksPassed: 'Checks passed', effect: 'Effect', record: 'Record',
  electrodeResistanceOhm: 'Electrode resistance (Ω)', packingNutTorqueNm: 'Packing nut torque (N·m)', certificateNumber: 'Certificate number', body: 'Body',
  signature: 'Signature', signatureId: 'Signature', boundHash: 'Signed charge fingerprint', meaning: 'Meaning', signedAt: 'Signed at', signerName: 'Signed by',
  approvedBy: 'Approved by', plannedBy: 'Planned by', firedBy: 'Fired by', firedAt: 'Fired at', createdAt: 'Created', updatedAt: 'Changed', at: 'At',
  assessment: 'Assessment', findings: 'Findings', policy: 'Lab policy', labName: 'Lab name', changes: 'Changes', csv: 'File', commit: 'Import now',
  thermogram: 'Thermogram', fuse: 'Fuse', burntLengthCm: 'Burnt fuse length (cm)', acid: 'Acid correction', check: 'Check run', service: 'Service',
  returnedToService: 'Returned to service', lockedOut: 'Locked out', outcomeMessage: 'Outcome',
}

/** The label of one key; an unknown camelCase key is spelt out in words ("fooBarMPa" → "Foo bar MPa"). */
export function fieldLabel(key: string): string {
  const known = FIELD_LABELS[key]
  if (known) return known
  const policy = (POLICY_DESCRIPTIONS as Record<string, { label: string, unit: string } | undefined>)[key]
  if (policy) return policy.unit && policy.unit !== '—' ? `${policy.label} (${policy.unit})` : policy.label
  const words = key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/[._-]+/g, ' ').trim().toLowerCase()
  return words.charAt(0).toUpperCase() + words.slice(1)
}

/** A dotted path in words: `components.0.massG` → "Components, item 1, mass (g)"; a policy key by its own label. */
export function pathWords(path: string): string {
  if (!path || path === '(body)') return 'The request'
  return path.split('.').map((part, i) => {
    if (/^\d+$/.test(part)) return `item ${Number(part) + 1}`
    const label = fieldLabel(part)
    return i === 0 ? label : label.charAt(0).toLowerCase() + label.slice(1)
  }).join(', ')
}

/** Kinds of record in the audit trail, as the pages name them. */
export const ENTITY_LABELS: Readonly<Record<string, string>> = {
  'run': 'Run', 'vessel': 'Vessel', 'plan': 'Plan', 'user': 'User', 'material': 'Material', 'result': 'Result', 'attachment': 'Attachment',
  'energy-equivalent': 'Energy equivalent', 'report': 'Report', 'lab-settings': 'Lab settings', 'service': 'Service', 'sample': 'Sample', 'client': 'Client',
}

/** An audit action in words: `run.approve` → "Run: approve"; `vessel.ratings-change` → "Vessel: ratings change". */
export function actionWords(action: string): string {
  const [entity = '', ...rest] = action.split('.')
  const verb = rest.join(' ').replace(/-/g, ' ')
  const what = ENTITY_LABELS[entity] ?? fieldLabel(entity)
  return verb ? `${what}: ${verb}` : what
}
