import { typicalValue } from '@/lib/engine/ranges';
import type { Definition, CheckCase } from '@/lib/engine/types';

/**
 * Starting values for an input form: the first in-range check case (a realistic point chosen by the
 * author), else the middle of each input's validity range.
 */
export function defaultInputs(definition: Definition, checkCases: CheckCase[]): Record<string, number> {
  const sample = checkCases.find((c) => !c.expectWarnings?.length && !c.expectRefusal && definition.inputs.every((i) => typeof c.inputs[i.symbol] === 'number'));
  return Object.fromEntries(definition.inputs.map((i) => [i.symbol, sample ? (sample.inputs[i.symbol] as number) : Number(typicalValue(definition, i.symbol).toPrecision(4))]));
}
