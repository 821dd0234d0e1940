export { fitLeastSquares, fitLeastSquaresAsync, type FitControl } from "./fit";
export { LeastSquaresError, type LeastSquaresErrorCode } from "./errors";
export { solutionStatistics } from "./statistics";
export {
  leastSquaresOptionsSchema,
  normaliseLeastSquaresOptions,
  type LeastSquaresOptions,
  type LeastSquaresOptionsInput,
} from "./options";
export type { LeastSquaresProblem, ParameterSpec, ValuesWithJacobian } from "./problem";
export {
  CONVERGED_STOP_REASONS,
  type FitProgress,
  type FitWarning,
  type FitWarningKind,
  type FittedParameter,
  type LeastSquaresResult,
  type StartSummary,
  type StopReason,
} from "./result";
