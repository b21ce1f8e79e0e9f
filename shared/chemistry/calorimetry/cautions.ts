/**
 * Cautions shown with every calorimetry page and result. They are the usual ones of the trade
 * (common practice, no source) and defer to the instrument maker, local codes and site practice.
 */

export const BOMB_CAUTIONS: readonly string[] = [
  'A combustion bomb holds oxygen at about 3 MPa (30 atm): fill, fire and vent it only as the instrument maker instructs, have it inspected and pressure-tested on the schedule they set, and never exceed its rated pressure or the energy it may release in one firing.',
  'Samples that are energetic or unknown (peroxides, nitro compounds, perchlorates, large masses) can over-pressure a bomb: screen them first and keep to the maker’s limits on sample mass.',
  'Oil and grease burn violently in oxygen: keep the bomb, its seals and the filling line clean and free of them.',
  'Fire the bomb with it closed in the calorimeter and stay clear; release the pressure slowly before opening it. The washings hold nitric (and, with sulfur, sulfuric) acid.',
  'These figures reduce data; they are not a safety assessment. Follow the instrument maker’s instructions, local codes and your site’s practice.',
];

export const CONSTANT_PRESSURE_CAUTIONS: readonly string[] = [
  'The heat measured on a few grams grows with the batch: at scale the same reaction can release heat faster than it can be removed and run away. Use this ΔH for screening, and have any scale-up reviewed by qualified process-safety staff.',
  'Mixing concentrated acids or bases with water can boil and spatter: add acid to water, slowly, wearing eye and skin protection.',
  'Thermodynamics gives the heat, not the rate or the gas evolved: confirm hazards by reaction calorimetry or adiabatic tests before scale-up, following local codes and your site’s practice.',
];
