// Role-matrix row for the block-sizing route: any signed-in account, like /calculate (it reads
// and stores nothing of a project). A short search keeps the eight calls cheap.
import type { MatrixRole } from "../support/fixture";
import type { RouteCase } from "../support/matrix-types";
import { sampleAnalysisInput } from "../analysis-input-sample";

const signedIn: MatrixRole[] = ["outsider", "admin", "manager", "designer", "checker", "vendor", "viewer"];

export const routeCases: RouteCase[] = [
  {
    route: "v1/sizing",
    method: "POST",
    allowed: signedIn,
    request: async () => ({
      params: {},
      body: { input: sampleAnalysisInput(), options: { dimensions: { length: { min: 6, max: 6.4 }, width: { min: 4, max: 4.4 } }, maxAnalyses: 5 } },
    }),
  },
];
