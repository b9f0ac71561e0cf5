/**
 * Stated physical relations between two situations, for cross-checks between correlations whose inputs
 * or outputs are not the same quantities: a relation gives the partner's inputs from the case's and maps
 * the partner's result back onto the case's outputs. Each states where it comes from, and `rel` is its own
 * uncertainty where it is not exact (combined with the two correlations' stated accuracies). The evidence
 * plan (evidence-plan.ts, `xv`) uses them; the library test recomputes every such case from its locator
 * (`correlation:<partner>?via=<key>`).
 */
type Values = Record<string, number>;

export interface Relation {
  /** What the relation is, in a phrase for the check case's citation. */
  relation: string;
  /** The partner's inputs (merged over those it shares with the case). */
  inputs: (i: Values, fixed: Values) => Values;
  /** The case's expected outputs from the partner's. */
  expected: (partnerOut: Values, i: Values) => Values;
  /** The relation's own relative uncertainty, when it is not exact… */
  rel?: number;
  /** …and why that figure. */
  relUncertainty?: string;
}

export const MAPPINGS: Record<string, Relation> = {
  /**
   * In the 1/3-power (turbulent) regime the heat flux through a horizontal surface heated from below does not
   * depend on the size of the surface or of the layer; a Rayleigh–Bénard layer of height H between a hot and a
   * cold plate with ΔT across it has two such wall layers in series, each with ΔT/2 (Malkus 1954; Globe & Dropkin
   * 1959). A single hot plate facing up with ΔT_w and Ra_L therefore matches a layer with H = L and Ra_H = 2 Ra_L:
   * q = Nu_H k (2ΔT_w)/H, so Nu_L = 2 Nu_H.
   */
  'rayleigh-benard-wall': {
    relation: 'the wall layer of Rayleigh–Bénard convection (H = L, twice the temperature difference, Nu_L = 2 Nu_H; 1/3-power regime)',
    inputs: (i) => ({ Ra_L: 2 * i.Ra_L }),
    expected: (o) => ({ Nu_L: 2 * o.Nu_L }),
    rel: 0.1,
    relUncertainty: 'a layer under a cold plate and a plate in open surroundings differ in the plumes that leave them; 10 % is a judgement, not a published figure',
  },
};
