/**
 * The high-precision zero test (../shared/math/nls.md §3, painleve.md §7): shared by the
 * reducibility stage and, for its own statistics, by the Painlevé stage.
 */
export { zeroTest, scaledThresholds, pointText } from "./zero-test";
export { sumAndScale, rhoOf, unitRoundoff } from "./statistic";
export { trackedField, significantDigits } from "./tracked-field";
export type { Tracked } from "./tracked-field";
export { SingularPointError } from "./errors";
export type {
  TermSource,
  TermJets,
  OrderStatistic,
  DoubleSample,
  ConfirmOutcome,
  ConfirmStatistic,
  ZeroFailureReason,
  ZeroOutcome,
  ZeroThresholds,
  ZeroTestOptions,
  ZeroTestResult,
} from "./types";
