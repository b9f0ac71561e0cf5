/**
 * A calculation template's definition: a chain of steps over one flat set of symbols, as stored and
 * as validated by validation/template.schema.json. Free of mathjs, so browser code may import it.
 *
 * Every symbol of the chain is declared once: the template's inputs and constants, then each step's
 * outputs in order. A step reads only symbols declared before it.
 */
import type { Definition, Warning } from './types';

/** A correlation version pinned by number and content hash (what a reviewer signed). */
export interface Pin {
  slug: string;
  version: number;
  contentHash: string;
}

/** Evaluates a pinned correlation version (a property table is one too). */
export interface CorrelationStep {
  key: string;
  kind: 'correlation';
  title: string;
  use: Pin;
  /** Correlation input symbol → the chain symbol that feeds it (dimensions must agree; units are converted). */
  inputs: Record<string, string>;
  /** Correlation output symbol → the chain symbol it becomes (in the correlation's declared unit). */
  outputs: Record<string, string>;
}

/** Arithmetic in the safe expression language, e.g. h = Nu_L * k / L. */
export interface ExpressionStep {
  key: string;
  kind: 'expression';
  title: string;
  outputs: { symbol: string; name: string; unit: string; expression: string }[];
}

export type LeafStep = CorrelationStep | ExpressionStep;

/**
 * Picks one of several short sequences of steps by an explicit rule on earlier values: the first
 * option whose `when` holds; the last option has no `when` (otherwise). Every option must produce
 * the symbols the choice `gives` (same units); anything else an option computes stays inside it.
 */
export interface ChoiceStep {
  key: string;
  kind: 'choice';
  title: string;
  /** The rule in words, shown in every record, e.g. "laminar average for Re_L ≤ 5×10^5, else mixed". */
  rule: string;
  gives: string[];
  options: { label: string; when?: string; steps: LeafStep[] }[];
}

export type ChainStep = LeafStep | ChoiceStep;

export const STEP_KINDS = ['correlation', 'expression', 'choice'] as const;
export type StepKind = (typeof STEP_KINDS)[number];

/** The descriptive head, inputs, constants, validity and references are those of a correlation definition. */
export interface TemplateDefinition extends Pick<Definition, 'schemaVersion' | 'title' | 'summary' | 'category' | 'situation' | 'tags' | 'inputs' | 'constants' | 'validity' | 'references' | 'notes'> {
  kind: 'template';
  steps: ChainStep[];
  /** The chain symbols a run reports as its results, in this order. */
  outputs: { symbol: string; name: string }[];
}

/** A range warning of a chain, with the step where it arose. */
export interface ChainWarning extends Warning {
  step: string;
}

/** What one executed step did: its inputs (in the units it takes them) and outputs. */
export interface StepRecord {
  key: string;
  title: string;
  kind: 'correlation' | 'expression';
  correlation: Pin | null;
  /** Set when the step was picked by a choice: the choice's key and rule, and the option picked. */
  choice?: { key: string; title: string; rule: string; picked: string; options: string[] };
  inputs: Record<string, number>;
  outputs: Record<string, number>;
  units: Record<string, string>;
  warnings: ChainWarning[];
}

export interface ChainResult {
  steps: StepRecord[];
  outputs: Record<string, number>;
  warnings: ChainWarning[];
}

export function isTemplateDefinition(d: unknown): d is TemplateDefinition {
  return Boolean(d) && typeof d === 'object' && (d as { kind?: unknown }).kind === 'template';
}

/** Every pinned correlation a template uses, each once. */
export function pinsOf(def: Pick<TemplateDefinition, 'steps'>): Pin[] {
  const out = new Map<string, Pin>();
  const visit = (s: ChainStep) => {
    switch (s.kind) {
      case 'correlation': out.set(`${s.use.slug}@${s.use.version}`, s.use); return;
      case 'expression': return;
      case 'choice': s.options.forEach((o) => o.steps.forEach(visit)); return;
      default: { const never: never = s; throw new Error(`unknown step ${JSON.stringify(never)}`); }
    }
  };
  def.steps.forEach(visit);
  return [...out.values()];
}
