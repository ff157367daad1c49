// The cautions shown on every results page and written into every exported
// workbook (brief: results can put people and plant at risk).
export const CAUTIONS_TITLE = "Before you rely on these numbers";

export const CAUTIONS: readonly string[] = [
  "These results are an aid to a qualified engineer, not a substitute for one.",
  "The methods are idealisations: a rigid block on linear soil springs and dashpots at the base, harmonic steady state, with the assumptions stated beside each figure.",
  "Soil properties are uncertain; read the soil band (the same analysis at a lower and an upper shear modulus), not only the best estimate.",
  "Local codes, the machine vendor's requirements and licensed professional review govern over anything shown here.",
];
