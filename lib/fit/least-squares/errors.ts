/** Why a least-squares problem cannot be fitted at all (as opposed to a fit that stops early). */
export type LeastSquaresErrorCode =
  | "invalid-problem"
  | "too-few-observations"
  | "no-free-parameters"
  | "missing-jacobian"
  | "invalid-start";

/** A problem the engine refuses to fit; `code` is stable, `message` says what to fix. */
export class LeastSquaresError extends Error {
  readonly code: LeastSquaresErrorCode;

  constructor(code: LeastSquaresErrorCode, message: string) {
    super(message);
    this.name = "LeastSquaresError";
    this.code = code;
  }
}
