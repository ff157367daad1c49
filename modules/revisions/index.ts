// Revisions: the pure part (diff, labels, canonical-input fingerprint, derived status).
export { canonicalInputHash, canonicalJson } from "./canonical-hash";
export { diffDocuments, diffRevisions, flippedChecks, listLeafPaths, withoutLongSeries, type ComparableResult, type ResultWithoutSeries, type CheckFlip, type DiffEntry, type DiffKind, type DiffOptions, type LeafValue, type RevisionDiff, type SectionDiff } from "./diff";
export { checkKeyLabel, fieldLabel, parseFieldPath } from "./field-labels";
export { isLetterLabel, isNumberLabel, letterLabel, nextRevisionLabel, type RevisionScheme } from "./labels";
export { isApprovalStale, REVISION_PURPOSES, revisionPurposeLabels, revisionStatus, revisionStatusLabels, signOffStepsLabels, type RevisionPurpose, type RevisionStatus, type SignOffSteps } from "./status";
export { revisionCommentSchema, revisionDecisionSchema, revisionIssueSchema, resolveCommentSchema } from "./schemas";
export { compareChecks, COMPARE_GROUP_TITLES, COMPARE_NOISE, COMPARE_NOISE_TEXT, displayText, isNoise, kindOfPath, labelOfPath, readableDiff, readableDiffCsv, type CheckMoved, type CompareGroup, type QuantityRow, type ReadableDiff, type VerdictRow } from "./readable-diff";
