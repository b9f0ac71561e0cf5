/**
 * A correlation version's definition, as stored and as validated by validation/definition.schema.json.
 * Kept in step with the schema by tests/unit/engine-schema.test.ts.
 */
export interface Definition {
  schemaVersion: 1;
  title: string;
  summary: string;
  category: Category;
  situation: string;
  tags?: string[];
  inputs: InputDef[];
  constants?: ConstantDef[];
  tables?: TableDef[];
  steps?: StepDef[];
  outputs: OutputDef[];
  validity?: ValidityLimit[];
  references: Reference[];
  propertyBasis?: string;
  /** The published accuracy of the correlation on its data, e.g. ±20 % (rel 0.2), with where it is stated. */
  accuracy?: Accuracy;
  notes?: string;
}

/**
 * Stated accuracy. rel 0 marks an exact solution of the model the definition states; with
 * `approximates`, rel is the deviation from that other correlation (an explicit form of an implicit one).
 */
export interface Accuracy { rel: number; basis: string; approximates?: string; byOutput?: Record<string, number> }

export const CATEGORIES = [
  'external-flow', 'internal-flow', 'free-convection', 'friction', 'boundary-layer', 'properties',
  'extended-surfaces', 'heat-exchangers', 'tube-banks', 'non-circular-ducts', 'impinging-jets',
  'condensation', 'boiling', 'pressure-losses', 'radiation',
] as const;
export type Category = (typeof CATEGORIES)[number];

/** How each category reads on the screens. */
export const CATEGORY_LABELS: Record<Category, string> = {
  'external-flow': 'External forced convection',
  'internal-flow': 'Internal flow heat transfer',
  'free-convection': 'Free convection',
  friction: 'Pipe friction',
  'boundary-layer': 'Boundary layers',
  properties: 'Fluid properties',
  'extended-surfaces': 'Fins and extended surfaces',
  'heat-exchangers': 'Heat exchangers',
  'tube-banks': 'Tube banks',
  'non-circular-ducts': 'Non-circular ducts',
  'impinging-jets': 'Impinging jets',
  condensation: 'Condensation',
  boiling: 'Boiling',
  'pressure-losses': 'Pressure losses in fittings',
  radiation: 'Thermal radiation',
};

export interface InputDef {
  symbol: string;
  name: string;
  /** A unit mathjs understands ("m", "W/(m^2 K)", "Pa s"), or "1" for a dimensionless group. */
  unit: string;
  description?: string;
}

export interface ConstantDef {
  symbol: string;
  name: string;
  value: number;
  unit: string;
}

export interface TableDef {
  name: string;
  source: string;
  /** The column looked up by (strictly increasing). */
  key: string;
  columns: { name: string; unit: string; values: number[] }[];
}

export type StepDef = ExpressionStep | SolveStep | TableStep;

interface StepBase {
  symbol: string;
  name: string;
  unit: string;
}

export interface ExpressionStep extends StepBase {
  kind: 'expression';
  expression: string;
}

/** An implicit equation residual(symbol) = 0, solved by Brent's method inside the bracket. */
export interface SolveStep extends StepBase {
  kind: 'solve';
  residual: string;
  bracket: [string | number, string | number];
}

/** Linear interpolation of `column` of table `table` at the value of symbol `at`. */
export interface TableStep extends StepBase {
  kind: 'table';
  table: string;
  column: string;
  at: string;
}

export interface OutputDef {
  symbol: string;
  name: string;
  unit: string;
  expression: string;
}

export interface ValidityLimit {
  symbol: string;
  min?: number;
  max?: number;
  minInclusive?: boolean;
  maxInclusive?: boolean;
  /** warn (default): compute and warn; refuse: no result, a clear error. */
  action?: 'warn' | 'refuse';
  note?: string;
}

export interface Reference {
  citation: string;
  locator?: string;
  doi?: string;
}

export type InputValue = number | { value: number; unit: string };

/**
 * Where a check case's expected value comes from (what the evidence is):
 * - published: a handbook, paper or standard, with a locator (table, equation, figure, page, example);
 * - independent-solution: the physics solved another way in validation/reference (similarity ODE,
 *   eigenvalue problem, root-find of a different equation, quadrature of a local law);
 * - standard-formulation: a published standard computed by a general-purpose library (e.g. IAPWS);
 * - cross-check: another correlation, with a tolerance from the two correlations' stated accuracies;
 * - limit: a limiting case, derived in the note;
 * - transcription: the formula re-typed — catches typos, counts for nothing;
 * - memory: a value recalled, not looked up (counts, flagged);
 * - common-practice: a fact of the trade, no source.
 */
export const SOURCE_KINDS = ['published', 'independent-solution', 'standard-formulation', 'cross-check', 'limit', 'transcription', 'memory', 'common-practice'] as const;
export type SourceKind = (typeof SOURCE_KINDS)[number];

export interface CheckCase {
  label: string;
  inputs: Record<string, InputValue>;
  /** Expected values per output symbol (in the output's declared unit). */
  expected: Record<string, number>;
  tolerance: { rel?: number; abs?: number; why?: string };
  /** attachment: the evidence document behind the value (its SHA-256 is part of the version's content hash). */
  source: { kind: SourceKind; citation: string; locator?: string; attachment?: { id: string; sha256: string; mediaType: string; name: string } };
  /** Symbols whose limits this case is meant to break; absent means none. */
  expectWarnings?: string[];
  /** The case is meant to hit a `refuse` limit. */
  expectRefusal?: boolean;
}

export interface Warning {
  symbol: string;
  value: number;
  min?: number;
  max?: number;
  message: string;
}

export interface EvaluationResult {
  outputs: Record<string, number>;
  warnings: Warning[];
}
