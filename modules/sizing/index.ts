// Block-sizing assistant: proposes base-mat dimensions that pass every check of the
// calculation core, smallest concrete volume first (see README.md beside this file).
export { proposeBlockSizes, proposeBlockSizesAsync, type SizingResult, type SizingProposal, type SizingOutcome, type SizingIssue, type FailureCount, type CheckSummary, type NearestCandidate } from "./search";
export { applySizingProposal, type ApplyOutcome, type ProposalToApply } from "./apply";
export {
  sizingOptionsSchema,
  makeSizingOptionsSchema,
  parseSizingOptions,
  MODULE_SIZING_LIMITS,
  gridValues,
  DEFAULT_STEP_M,
  DEFAULT_MAX_ANALYSES,
  DEFAULT_PROPOSALS,
  MAX_MARGIN,
  type SizingOptions,
  type SizingOptionsDocument,
  type DimensionRange,
  type CentreMode,
  type OptionIssue,
  type SizingLimits,
} from "./options";
export { checkMargin, clearsWithMargin } from "./evaluate";
export { readBaseMat, concreteVolume, minimumFit, type BaseMat, type MatDimensions } from "./base-mat";
export type { Placement } from "./resize";
