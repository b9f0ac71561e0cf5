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

const JET_CELL_UNCERTAINTY = 'colliding wall jets lower an array’s mean below the single jet’s by 10–30 % in Martin’s own two forms at H/D ≤ 3; 20 % is a judgement';

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
  /**
   * Summation in a cube: a face sees the opposite face and four adjacent ones and nothing else, so
   * F(adjacent) = (1 − F(opposite))/4, with every dimension equal.
   */
  'cube-summation': {
    relation: 'the summation rule in a cube (a face sees the opposite face and four adjacent faces: F_adjacent = (1 − F_opposite)/4)',
    inputs: (i) => ({ X: i.X, Y: i.X, L: i.X }),
    expected: (o) => ({ F_12: (1 - o.F_12) / 4 }),
    rel: 1e-9,
    relUncertainty: 'exact: rounding only',
  },
  /**
   * In a layer tilted θ from the horizontal (heated from below, θ ≤ 60°) the cells are driven by the component of
   * gravity normal to the plates: Nu(Ra, θ) ≈ Nu_horizontal(Ra cos θ) (Hollands et al. 1976, who add a small
   * correction to the onset that this relation leaves out).
   */
  'gravity-normal-component': {
    relation: 'the normal component of gravity (Nu of the tilted layer ≈ Nu of a horizontal layer at Ra cos θ)',
    inputs: (i) => ({ Ra_L: i.Ra_L * Math.cos((i.theta_deg * Math.PI) / 180) }),
    expected: (o) => ({ Nu_L: o.Nu_L }),
    rel: 0.1,
    relUncertainty: 'the relation leaves out the tilt’s delay of the onset of cells and the along-slope flow; 10 % is a judgement',
  },
  /** The same relation read the other way: a layer of height L with ΔT across it has Nu_L = ½ Nu of a plate with Ra_L/2. */
  'rayleigh-benard-layer': {
    relation: 'the wall layer of Rayleigh–Bénard convection read from the plate (Ra_plate = Ra_L/2, Nu_L = ½ Nu_plate; 1/3-power regime)',
    inputs: (i) => ({ Ra_L: i.Ra_L / 2 }),
    expected: (o) => ({ Nu_L: o.Nu_L / 2 }),
    rel: 0.1,
    relUncertainty: 'a layer under a cold plate and a plate in open surroundings differ in the plumes that leave them; 10 % is a judgement, not a published figure',
  },
  /**
   * Martin (1977) built his array correlation on the single jet: each nozzle of an array serves a cell of the surface,
   * and a single jet averaged over a disc of the same area has the same relative nozzle area, f = A_r = D²/(4r²).
   * Neighbouring wall jets collide and the spent gas leaves between the nozzles, so arrays transfer less; the
   * relation is used only near the nozzle plate (H/D ≤ 3), where Martin's interaction factor K is within 1 % of 1.
   */
  'jet-array-cell': {
    relation: 'one cell of a jet array as a single jet averaged over a disc of the same area (f = D²/(4r²); H/D ≤ 3)',
    inputs: (i) => ({ f: 1 / (4 * i.r_over_D * i.r_over_D) }),
    expected: (o) => ({ Nu_D: o.Nu_D }),
    rel: 0.2,
    relUncertainty: JET_CELL_UNCERTAINTY,
  },
  /** The same relation read from the array: the single jet over a disc of radius r = D/(2√f). */
  'jet-single-cell': {
    relation: 'a single jet averaged over a disc of the area one nozzle of the array serves (r/D = 1/(2√f); H/D ≤ 3)',
    inputs: (i) => ({ r_over_D: 1 / (2 * Math.sqrt(i.f)) }),
    expected: (o) => ({ Nu_D: o.Nu_D }),
    rel: 0.2,
    relUncertainty: JET_CELL_UNCERTAINTY,
  },
};
