// The analysis input of calc-contract.md (SI), shared by the draft and calculate tests.
// A function, so each test can change its own copy.
export function sampleAnalysisInput(): Record<string, unknown> & { soil: Record<string, unknown> } {
  return {
    schemaVersion: 1,
    block: {
      concreteDensity: 2400,
      solids: [
        { name: "mat", x: [-3, 3], y: [-2, 2], z: [0, 1.5] },
        { name: "pedestal", x: [-1, 1], y: [-0.6, 0.6], z: [1.5, 2.0] },
        { name: "cable pit", x: [2, 2.5], y: [-0.5, 0.5], z: [1.0, 1.5], void: true },
      ],
    },
    soil: {
      shearModulus: 6.0e7,
      poissonRatio: 0.33,
      density: 1900,
      materialDamping: 0.03,
      allowableBearingPressure: 150000,
      embedmentDepth: 0,
      sidewallContactHeight: 0,
    },
    impedance: { method: "equivalent-radius" },
    machines: [
      {
        name: "Fan",
        mass: 6000,
        cg: [0, 0, 2.2],
        rotors: [
          {
            name: "Impeller",
            mass: 1500,
            speedRpm: 1180,
            speedRangeRpm: [900, 1180],
            balanceGrade: 6.3,
            axis: "x",
            unbalanceMode: "static",
            bearings: [
              [-1, 0, 2.2],
              [1, 0, 2.2],
            ],
          },
        ],
      },
    ],
    checkPoints: [{ name: "coupling", position: [0, 0, 2.2] }],
    criteria: {
      frequencySeparation: 0.2,
      maxDisplacementPeak: 5.0e-5,
      maxVelocityPeak: 3.0e-3,
      minMassRatio: 3,
      maxEccentricity: 0.05,
      maxBearingRatio: 0.5,
    },
    sweep: { fromHz: 0.5, toHz: 60, points: 600 },
  };
}
