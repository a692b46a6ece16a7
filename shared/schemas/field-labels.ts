// The words a person sees for each field the API takes, so that no message (from a schema, the
// calculation engine or the server) shows an internal name like `crewIds` or `anchorShiftStart`.
// Keyed by the field's name; a path such as `pressure.value` or `limits.ttd.highWatch` is read from
// its meaningful end (see fieldLabel).
import { checkCatalog, type CheckKey } from '../calc/check-catalog';

export const fieldLabels: Record<string, string> = {
  // Plausible ranges (plant setup) and the round's confirmation of readings outside them.
  low: 'Low end',
  high: 'High end',
  ranges: 'Plausible ranges',
  confirmOutsidePlausible: 'Readings confirmed outside the plausible range',
  // people and sign-in
  email: 'E-mail',
  password: 'Password',
  currentPassword: 'Current password',
  newPassword: 'New password',
  temporaryPassword: 'Temporary password',
  name: 'Name',
  role: 'Role',
  crewId: 'Crew',
  crewIds: 'Crews',
  position: 'Position',
  positions: 'Positions',
  // records in general
  version: 'Version (reload the page)',
  clientKey: 'Request key (reload the page)',
  clientId: 'Record id on the device',
  enteredAt: 'Time of entry',
  unitId: 'Unit',
  stationId: 'Station',
  id: 'Record',
  personId: 'Person',
  unit: 'Unit',
  value: 'Value',
  title: 'Title',
  detail: 'Detail',
  reference: 'Reference',
  priority: 'Priority',
  kind: 'Kind',
  reason: 'Reason',
  text: 'Text',
  note: 'What changed and why',
  comment: 'Comment',
  comments: 'Comments',
  body: 'Comment',
  // flags
  parameter: 'Parameter',
  parameters: 'Parameters',
  severity: 'Severity',
  readingSetId: 'Round',
  assignedTo: 'Who follows it up',
  followUp: 'Follow-up',
  status: 'Status',
  from: 'From',
  to: 'To',
  limit: 'Number of rows',
  // handovers
  html: 'Handover notes',
  itemId: 'Handover item',
  question: 'Question',
  answer: 'Answer',
  anchorShiftStart: 'First shift of the rotation',
  shiftStart: 'Shift starting',
  // log, orders, conditions
  category: 'Category',
  eventAt: 'Event time',
  equipmentId: 'Equipment',
  flagId: 'Flag',
  carryToHandover: 'Carry to handover',
  authorId: 'Author',
  before: 'Before',
  bodyHtml: 'Order text',
  effectiveFrom: 'In force from',
  effectiveTo: 'Until',
  state: 'State',
  q: 'Search text',
  requiredAction: 'Required action',
  startedAt: 'Started at',
  limitHours: 'Time allowed (hours)',
  limitAt: 'Deadline',
  ownerId: 'Owner',
  documentId: 'Record',
  page: 'Page',
  pageSize: 'Results per page',
  severityFilter: 'Severity',
  // station settings
  timeZone: 'Time zone',
  lateEntryMinutes: 'Late entry after (minutes)',
  shiftChangeTimes: 'Shift change times',
  roundIntervalMinutes: 'Round interval (minutes)',
  handoverWindowBeforeMinutes: 'Handover window before a change (minutes)',
  handoverWindowAfterMinutes: 'Handover window after a change (minutes)',
  categories: 'Categories',
  templates: 'Templates',
  key: 'Key',
  label: 'Label',
  // imports
  source: 'Source',
  timeColumn: 'Time column',
  columns: 'Column mapping',
  column: 'Column',
  // equipment
  tag: 'Tag',
  // plant design
  design: 'Design data',
  limits: 'Limits',
  surfaceAreaM2: 'Surface area',
  tubeOdMm: 'Tube OD',
  tubeGaugeBwg: 'Tube gauge',
  tubeMaterial: 'Tube material',
  tubeCount: 'Tube count',
  passes: 'Passes',
  designCwFlowKgS: 'Design CW flow',
  designCwInletK: 'Design CW inlet',
  designBackpressurePa: 'Design backpressure',
  designDutyW: 'Design duty',
  designCleanliness: 'Design cleanliness factor',
  designCleanUWM2K: 'Data-sheet clean U',
  backpressureCorrection: 'Backpressure correction curve',
  energyPricePerMwh: 'Energy price',
  currency: 'Currency',
  towerDesignRangeK: 'Tower design range',
  towerDesignApproachK: 'Tower design approach',
  towerDesignWetBulbK: 'Tower design wet bulb',
  lowAlarm: 'low alarm',
  lowWatch: 'low watch',
  highWatch: 'high watch',
  highAlarm: 'high alarm',
  // a round
  reading: 'Round readings',
  takenAt: 'Taken at',
  pressure: 'Condenser pressure',
  barometer: 'Barometer',
  hotwellTemperature: 'Hotwell temperature',
  cwInletTemperature: 'CW inlet temperature',
  cwOutletTemperature: 'CW outlet temperature',
  cwFlow: 'CW flow',
  steamFlow: 'Exhaust steam flow',
  airRemovalFlow: 'Air removal flow',
  dissolvedOxygenPpb: 'Condensate dissolved oxygen',
  tower: 'Cooling tower readings',
  hotWaterTemperature: 'Hot-water temperature',
  coldWaterTemperature: 'Basin (cold-water) temperature',
  basinTemperature: 'Basin (cold-water) temperature',
  wetBulbTemperature: 'Wet bulb',
  dryBulbTemperature: 'Dry bulb',
  relativeHumidityPercent: 'Relative humidity',
  stationPressure: 'Station pressure',
  circulatingFlow: 'Circulating flow',
  makeupConductivity: 'Makeup conductivity',
  basinConductivity: 'Basin conductivity',
  targetCycles: 'Target cycles',
  chemistry: 'Chemistry sample',
  pH: 'pH',
  temperature: 'Sample temperature',
  tdsMgL: 'Total dissolved solids',
  calciumHardnessMgL: 'Calcium hardness',
  alkalinityMgL: 'Total alkalinity',
  // training
  system: 'System',
  standard: 'Standard to meet',
  procedureRef: 'Procedure reference',
  requiredPerformances: 'Supervised performances before sign-off',
  taskKey: 'Task',
  changeNote: 'What changed and why',
  performedOn: 'Date',
  level: 'Level',
  supervisorId: 'Supervising operator',
  handoverItemId: 'Handover item',
  traineeId: 'Trainee',
  decision: 'Decision',
  target: 'What is corrected',
  targetId: 'Record',
};

const limitBandKeys = new Set(['lowAlarm', 'lowWatch', 'highWatch', 'highAlarm']);
const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
// Own keys only: a field named `constructor` or `hasOwnProperty` in hostile input is no label.
const checkLabel = (key: string) => (Object.hasOwn(checkCatalog, key) ? checkCatalog[key as CheckKey].label : undefined);

/**
 * The label a person sees for a field path (`a.b.0.c` or an array of segments); '' for the whole
 * form. An unknown name gives "This field", never the name itself.
 */
export function fieldLabel(path: string | readonly PropertyKey[]): string {
  const segments = (typeof path === 'string' ? path.split('.') : path.map(String)).filter((s) => s !== '' && s !== '_' && !/^\d+$/.test(s));
  if (!segments.length) return '';
  const last = segments.at(-1)!;
  const parent = segments.at(-2);
  const named = (s: string) => (Object.hasOwn(fieldLabels, s) ? fieldLabels[s] : checkLabel(s));
  if (last === 'value' && parent) return fieldLabel(segments.slice(0, -1));
  if (last === 'unit' && parent && parent !== 'columns') return `${fieldLabel(segments.slice(0, -1))} unit`;
  if (limitBandKeys.has(last) && parent && checkLabel(parent)) return `${checkLabel(parent)}, ${named(last)}`;
  if (last === 'column' && parent && segments.at(-3) === 'columns') return `Column for ${named(parent) ?? 'this reading'}`;
  return capital(named(last) ?? 'This field');
}
