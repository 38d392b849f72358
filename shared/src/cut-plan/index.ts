// Public API of the cut planner.
export { planCuts } from './cut-plan';
export type {
  CutPlan,
  CutPlanInput,
  CutPlanRules,
  CutPlanTotals,
  CutRegion,
  CutStep,
  GarmentMinimum,
  GarmentMinimumShortfall,
  GarmentPanelInput,
  GarmentSummary,
  GrainDirection,
  KeptFeatureInput,
  KeptFeaturePin,
  PanelPlan,
  PieceInput,
  PieceShortfall,
  PieceSource,
  Placement,
  PlanRect,
  RegionContent,
  ShortfallReason,
  StudioFabricInput,
  StudioFabricSummary,
} from './cut-plan-types';
export { CutPlanInputError } from './cut-plan-input-error';
