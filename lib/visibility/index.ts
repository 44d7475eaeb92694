export {
  computeVisibility,
  planVisibility,
  PLANNING_DISCLAIMER,
  round,
  roundOrNull,
  twilightOut,
  type VisibilityNight,
  type VisibilityPlan,
  type VisibilityResult,
  type VisibilityWindow,
} from "./compute";
export { zodErrorToFieldMessages } from "./field-errors";
export {
  constraintsSchema,
  decField,
  raField,
  siteSchema,
  targetSchema,
  telescopeSchema,
  visibilityRequestSchema,
  whenSchema,
  type VisibilityRequest,
  type VisibilityRequestInput,
} from "./schema";
export { parseVisibilityRequest, type ParsedVisibilityRequest } from "./parse";
