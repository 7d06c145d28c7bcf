import { loadPattern, quantityPattern } from '../units/index.js';
import { COMPARE_STATUS_METRICS, FREQUENCY_WINDOW_FIELDS, LIMIT_FIELDS, LOAD_DESCRIPTION, MAX_CORNERS, MAX_LIST, OPERATING_FIELDS, OPTIONAL_SECTIONS, SECTION_FIELDS, TANK_FIELDS, type CompareKey, type FieldSpec, type QuantitySpec, type SectionName } from './fields.js';
import { COMPARE_KEYS, metricSpec } from './compareSection.js';
import { MODEL_NAME_PATTERN, NAME_PATTERN } from './names.js';

type Schema = Record<string, unknown>;


/** Schema of one value: a YAML number, or a string in engineering notation (the parser stays the authority on limits). */
function quantity(spec: QuantitySpec, description = spec.description): Schema {
  const num: Schema = { type: spec.integer ? 'integer' : 'number' };
  if (spec.sign === 'positive') num.exclusiveMinimum = 0;
  else num.minimum = 0;
  if (spec.below !== undefined) num.exclusiveMaximum = spec.below;
  if (spec.atMost !== undefined) num.maximum = spec.atMost;
  const out: Schema = { description, anyOf: [num, { type: 'string', pattern: quantityPattern(spec.unit) }], examples: [spec.example] };
  if (spec.default !== undefined) out.default = spec.unit === 'ratio' ? `${spec.default * 100}%` : spec.default;
  return out;
}

function field(spec: FieldSpec): Schema {
  if (spec.kind === 'quantity') return quantity(spec);
  if (spec.kind === 'enum') return { description: spec.description, enum: [...spec.values], ...(spec.default !== undefined && { default: spec.default }) };
  return { description: spec.description, type: 'boolean', ...(spec.default !== undefined && { default: spec.default }) };
}

function section(fields: Record<string, FieldSpec>, description: string): Schema {
  return {
    type: 'object',
    description,
    additionalProperties: false,
    required: Object.entries(fields).filter(([, s]) => s.default === undefined).map(([k]) => k),
    properties: Object.fromEntries(Object.entries(fields).map(([k, s]) => [k, field(s)])),
  };
}

const oneOrList = (item: Schema, description: string): Schema =>
  ({ description, anyOf: [item, { type: 'array', items: item, minItems: 1, maxItems: MAX_LIST }] });

const load: Schema = { description: LOAD_DESCRIPTION, type: 'string', pattern: loadPattern(), examples: ['50%', '12 ohm', '5 A', '120 W'] };
const frequency = quantity(OPERATING_FIELDS.frequency, 'Fixed switching frequency.');
const regulate: Schema = { const: 'regulate', description: 'Solve the switching frequency that gives output.voltage (FHA), then simulate at it.' };

const OFF: Schema = { const: 'off', description: 'Report the metric(s) without flagging a difference.' };

/** `compare`: group tolerances, single metrics by name, and "off". */
function compareSchema(description: string): Schema {
  const groups = SECTION_FIELDS.compare as Record<string, QuantitySpec>;
  const properties = Object.fromEntries(COMPARE_KEYS.map((k): [string, Schema] => {
    if ((COMPARE_STATUS_METRICS as readonly string[]).includes(k)) return [k, { ...OFF, description: `Compare ${k} without flagging a disagreement.` }];
    const spec = groups[k] ?? metricSpec(k as CompareKey);
    const q = quantity(spec, groups[k] ? spec.description : `Allowed relative difference for ${k} alone (overrides its group).`);
    return [k, { ...q, anyOf: [...(q.anyOf as Schema[]), OFF] }];
  }));
  return { type: 'object', description, additionalProperties: false, required: [], properties };
}

const limitsSchema: Schema = {
  type: 'object',
  description: 'Design limits, evaluated per corner on FHA, the ideal model and the simulation. Optional; every key is optional. Capacitive operation is always outside limits.',
  additionalProperties: false,
  properties: {
    frequency: {
      type: 'object', description: "The controller's switching-frequency window.", additionalProperties: false, minProperties: 1,
      properties: { min: quantity(FREQUENCY_WINDOW_FIELDS.min), max: quantity(FREQUENCY_WINDOW_FIELDS.max) },
    },
    ...Object.fromEntries(Object.entries(LIMIT_FIELDS).map(([k, spec]) => [k, field(spec)])),
  },
};

const SECTION_TEXT: Record<SectionName, string> = {
  topology: 'Bridge and rectifier type.',
  tank: 'Resonant tank and transformer, all referred to the primary.',
  switches: 'Primary switches and dead time.',
  rectifier: 'Secondary rectifier diodes.',
  output: 'Output filter and regulation target.',
  tolerances: 'Component tolerances; with corners: extremes the nominal set and every low/high combination of Lr, Cr, Lm are checked (9 sets); with corners: random, seeded Monte Carlo samples.',
  compare: 'Allowed FHA-versus-simulation differences, as fractions, per group or per metric by name; "off" reports a metric without flagging it.',
  simulation: 'Simulation control.',
};

const device = (what: string): Schema => ({
  type: 'object',
  description: `${what}: a SPICE model file (path relative to the design file) and the .model or .subckt name in it.`,
  additionalProperties: false,
  required: ['file', 'name'],
  properties: {
    file: { type: 'string', minLength: 1, maxLength: 1024, description: 'Model file, ASCII only, no .control/.include/.lib/.end.' },
    name: { type: 'string', pattern: MODEL_NAME_PATTERN, description: 'Name of the .model or .subckt to use.' },
  },
});

const corner: Schema = {
  type: 'object',
  description: 'One corner given by hand; tank values left out take the nominal ones.',
  additionalProperties: false,
  required: ['vin', 'load'],
  properties: {
    vin: quantity(OPERATING_FIELDS.vin, 'DC input voltage of this corner.'),
    load,
    frequency: { description: 'Fixed switching frequency, or "regulate" (the default).', anyOf: [frequency, regulate], default: 'regulate' },
    lr: quantity(TANK_FIELDS.lr, 'Lr for this corner instead of tank.lr.'),
    cr: quantity(TANK_FIELDS.cr, 'Cr for this corner instead of tank.cr.'),
    lm: quantity(TANK_FIELDS.lm, 'Lm for this corner instead of tank.lm.'),
  },
};

/** The schema's `$id` (a URN: stable, and it claims no web address). */
export const DESIGN_SCHEMA_ID = 'urn:tankcheck:schema:design:1';

/**
 * JSON Schema (draft 2020-12) of the tankcheck design file, for editors (completion, hover text,
 * early red squiggles). It mirrors `parseDesign`, which remains the authority: the parser adds
 * the cross-field physics checks (Lm > Lr, dead time, ...) that a schema cannot express.
 * Written to schema/design.schema.json; a test keeps the two equal.
 */
export const designJsonSchema: Schema = {
  $schema: 'https://json-schema.org/draft/2020-12/schema',
  // a name, not a download address: the file ships in the package (tankcheck/schema/design.schema.json)
  $id: DESIGN_SCHEMA_ID,
  title: 'tankcheck design file',
  description: 'An LLC resonant converter design: tank, devices, operating corners and comparison limits. Values take engineering notation such as "27 nF", "1.5meg", "110 mohm"; a bare "M" is refused (write "m" for milli, "meg" for mega).',
  type: 'object',
  additionalProperties: false,
  required: ['name', 'topology', 'tank', 'switches', 'rectifier', 'output', 'operating'],
  properties: {
    name: { type: 'string', pattern: NAME_PATTERN, description: 'Design name for reports: 1 to 80 letters, digits, spaces, "_", "." or "-".' },
    ...Object.fromEntries((Object.keys(SECTION_FIELDS) as SectionName[]).map((k) => {
      const text = `${SECTION_TEXT[k]}${OPTIONAL_SECTIONS.includes(k) ? ' Optional; every field has a default.' : ''}`;
      return [k, k === 'compare' ? compareSchema(text) : section(SECTION_FIELDS[k] as Record<string, FieldSpec>, text)];
    })),
    operating: {
      type: 'object',
      description: 'Operating corners: the grid vin x load x frequency, plus any corners listed by hand.',
      additionalProperties: false,
      required: ['ratedPower'],
      dependentRequired: { vin: ['load'], load: ['vin'] },
      anyOf: [{ required: ['vin', 'load'] }, { required: ['corners'] }],
      properties: {
        vin: oneOrList(quantity(OPERATING_FIELDS.vin), OPERATING_FIELDS.vin.description),
        load: oneOrList(load, 'Load(s) of the grid.'),
        ratedPower: quantity(OPERATING_FIELDS.ratedPower),
        frequency: { description: OPERATING_FIELDS.frequency.description, anyOf: [regulate, frequency, { type: 'array', items: frequency, minItems: 1, maxItems: MAX_LIST }], default: 'regulate' },
        corners: { type: 'array', items: corner, maxItems: MAX_CORNERS, description: 'Corners listed by hand, in addition to the grid.' },
      },
    },
    devices: {
      type: 'object',
      description: 'Optional SPICE models for the rectifier diodes and the primary switches (default: built-in models).',
      additionalProperties: false,
      properties: { diodeModel: device('Rectifier diode model'), switchModel: device('Primary switch model') },
    },
    limits: limitsSchema,
  },
};
